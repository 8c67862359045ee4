/**
 * Physical constants, SI. CODATA 2018 values (NIST): μ0 is measured since the 2019 SI redefinition, so it is
 * written out rather than taken as 4π×1e-7. ε0 and η0 follow from μ0 and c so the three stay consistent.
 */

/** Speed of light in vacuum, m/s (exact). */
export const C0 = 299_792_458;

/** Vacuum permeability, H/m (CODATA 2018). */
export const MU0 = 1.25663706212e-6;

/** Vacuum permittivity, F/m: 1/(μ0 c²) ≈ 8.8541878128e-12 (CODATA 2018). */
export const EPS0 = 1 / (MU0 * C0 * C0);

/** Wave impedance of free space, ohms: μ0 c ≈ 376.730313668. */
export const ETA0 = MU0 * C0;
