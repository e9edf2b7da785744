/**
 * sin and cos for headings and beam angles (|x| up to a few turns), the fdlibm way: reduce
 * x = k pi/2 + y with |y| <= pi/4 by the two-part constant of fdlibm's __ieee754_rem_pio2
 * (pi/2 = PIO2_1 + PIO2_1T, PIO2_1 with 33 significant bits so k * PIO2_1 is exact), then the
 * fdlibm kernels __kernel_sin / __kernel_cos (the stdlib ports) on y and the quadrant k mod 4.
 *
 * Error bound: for |x| <= 2^19 pi/2 the reduction error is below |k| 2^-86 (the truncation of
 * PIO2_1T) plus half an ulp of y, the kernels are within 1 ulp, so sin and cos are within
 * 2.5e-16 absolute of the exact values (tested against the stdlib fdlibm ports and Math.sin /
 * Math.cos). Larger |x|, Infinity and NaN go to the stdlib ports (their full Payne–Hanek
 * reduction).
 */
import kernelCos from '@stdlib/math-base-special-kernel-cos';
import kernelSin from '@stdlib/math-base-special-kernel-sin';
import { referenceCos, referenceSin } from './reference-functions';

/** fdlibm's constants (e_rem_pio2.c): 2/pi, the first 33 bits of pi/2, and pi/2 - PIO2_1. */
const INV_PIO2 = 0.6366197723675814;
const PIO2_1 = 1.5707963267341256;
const PIO2_1T = 6.077100506506192e-11;
/** Beyond this the two-part reduction loses accuracy (2^19 pi/2, fdlibm's medium-size bound). */
const MEDIUM = 823550;

/** Writes sin(x) to out[offset] and cos(x) to out[offset + 1]. */
export function sinCos(x: number, out: Float64Array, offset = 0): void {
  if (!(x > -MEDIUM && x < MEDIUM)) {
    out[offset] = referenceSin(x);
    out[offset + 1] = referenceCos(x);
    return;
  }
  const k = Math.round(x * INV_PIO2);
  const y = x - k * PIO2_1 - k * PIO2_1T;
  const s = kernelSin(y, 0);
  const c = kernelCos(y, 0);
  switch (k & 3) {
    case 0:
      out[offset] = s;
      out[offset + 1] = c;
      break;
    case 1:
      out[offset] = c;
      out[offset + 1] = -s;
      break;
    case 2:
      out[offset] = -s;
      out[offset + 1] = -c;
      break;
    default:
      out[offset] = -c;
      out[offset + 1] = s;
  }
}

const scratch = new Float64Array(2);

export function sin(x: number): number {
  sinCos(x, scratch);
  return scratch[0];
}

export function cos(x: number): number {
  sinCos(x, scratch);
  return scratch[1];
}
