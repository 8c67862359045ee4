/**
 * Induced-EMF (sinusoidal-current) reference formulas, evaluated with the sine and cosine integrals of
 * @stdlib/math-base-special-sici. Not part of the solver: the independent yardstick for its tests.
 */
import sici from "@stdlib/math-base-special-sici";

const EULER_GAMMA = 0.5772156649015329;

function Si(x: number): number {
  return sici(x)[0];
}
function Ci(x: number): number {
  return sici(x)[1];
}

/**
 * Centre-fed dipole of length l and radius a, input impedance at the feed (ohms) by the induced-EMF
 * method: Balanis, Antenna Theory, 4th ed., eq. 4-70 (R_r) and eq. 4-79 (X_m), both referred to the
 * current maximum, moved to the feed by dividing by sin²(kl/2) (eq. 4-93). Formulas from memory;
 * kl = π reproduces Carter's 73.08 + j42.52 Ω with η = 376.73 Ω (checked in the tests).
 */
export function dipoleInducedEmf(kl: number, ka: number, eta: number): [number, number] {
  const s = Math.sin(kl);
  const c = Math.cos(kl);
  const rr =
    (eta / (2 * Math.PI)) *
    (EULER_GAMMA +
      Math.log(kl) -
      Ci(kl) +
      0.5 * s * (Si(2 * kl) - 2 * Si(kl)) +
      0.5 * c * (EULER_GAMMA + Math.log(kl / 2) + Ci(2 * kl) - 2 * Ci(kl)));
  const xm =
    (eta / (4 * Math.PI)) *
    (2 * Si(kl) + c * (2 * Si(kl) - Si(2 * kl)) - s * (2 * Ci(kl) - Ci(2 * kl) - Ci((2 * ka * ka) / kl)));
  const f = Math.sin(kl / 2) ** 2;
  return [rr / f, xm / f];
}

/**
 * Mutual impedance of two parallel side-by-side half-wave dipoles at spacing d (kd = k·d), sinusoidal
 * currents: Balanis, Antenna Theory, 4th ed., eqs. 8-68/8-69 (from memory):
 *   R21 = η/(4π) [2 Ci(u0) − Ci(u1) − Ci(u2)],  X21 = −η/(4π) [2 Si(u0) − Si(u1) − Si(u2)],
 *   u0 = kd, u1 = k(√(d² + l²) + l), u2 = k(√(d² + l²) − l), l = λ/2.
 * Balanis tabulates (Fig. 8.20 region) 40.8 − j28.3 Ω at d = 0.25 λ and −12.5 − j29.9 Ω at 0.5 λ.
 */
export function mutualSideBySide(kd: number, eta: number): [number, number] {
  const kl = Math.PI;
  const r = Math.sqrt(kd * kd + kl * kl);
  const u0 = kd;
  const u1 = r + kl;
  const u2 = r - kl;
  return [
    (eta / (4 * Math.PI)) * (2 * Ci(u0) - Ci(u1) - Ci(u2)),
    (-eta / (4 * Math.PI)) * (2 * Si(u0) - Si(u1) - Si(u2)),
  ];
}
