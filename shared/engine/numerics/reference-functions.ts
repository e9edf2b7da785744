/**
 * The engine's elementary functions off the hot paths: pure-JavaScript ports from the stdlib
 * project (`@stdlib/math-base-special-*`; exp, ln, sin, cos, log1p are ports of FreeBSD's msun
 * fdlibm, atan and atan2 of Cephes). They use only IEEE-754 double arithmetic, which every
 * JavaScript engine performs identically, so their results do not depend on the host, unlike
 * `Math.exp`, `Math.log`, `Math.sin`, ... whose last bits no standard fixes (ECMA-262 says
 * "implementation-approximated"). Accuracy: stdlib documents each as within 1 ulp (fdlibm's
 * bound); tests/shared/engine/numerics.test.ts checks them against Math.* to 2 ulp.
 */
import stdlibAtan from '@stdlib/math-base-special-atan';
import stdlibAtan2 from '@stdlib/math-base-special-atan2';
import stdlibCos from '@stdlib/math-base-special-cos';
import stdlibExp from '@stdlib/math-base-special-exp';
import stdlibLn from '@stdlib/math-base-special-ln';
import stdlibLog1p from '@stdlib/math-base-special-log1p';
import stdlibSin from '@stdlib/math-base-special-sin';

export const referenceExp: (x: number) => number = stdlibExp;
export const referenceLog: (x: number) => number = stdlibLn;
export const log1p: (x: number) => number = stdlibLog1p;
export const referenceSin: (x: number) => number = stdlibSin;
export const referenceCos: (x: number) => number = stdlibCos;
export const atan: (x: number) => number = stdlibAtan;
export const atan2: (y: number, x: number) => number = stdlibAtan2;
