/** Exact powers of two 2^-1022 .. 2^1023 (index m + 1022), built by exact doublings and halvings. */
export const POW2_OFFSET = 1022;
export const POW2 = new Float64Array(2046);
POW2[POW2_OFFSET] = 1;
for (let m = 1; m <= 1023; m++) POW2[POW2_OFFSET + m] = POW2[POW2_OFFSET + m - 1] * 2;
for (let m = 1; m <= 1022; m++) POW2[POW2_OFFSET - m] = POW2[POW2_OFFSET - m + 1] / 2;
