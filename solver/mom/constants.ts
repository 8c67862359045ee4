/** Physical constants (CODATA 2018). */
export const C0 = 299_792_458;
export const MU0 = 1.25663706212e-6;
export const EPS0 = 1 / (MU0 * C0 * C0);
/** Free-space wave impedance μ0·c ≈ 376.730 Ω. */
export const ETA0 = MU0 * C0;
