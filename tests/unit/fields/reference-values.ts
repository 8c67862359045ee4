/**
 * Closed-form reference values for thin linear dipoles with sinusoidal current, from Balanis, Antenna
 * Theory, 4th ed., §4.5 (eqs. 4-68 to 4-70 area for R_r and D0; from memory of the formula's form, checked
 * here against the half-wave limits 73.08 Ω and 1.641 in the same section). Si and Ci come from the
 * general-purpose @stdlib/math-base-special-sici library, not from this project.
 */

import sici from "@stdlib/math-base-special-sici";

const EULER = 0.5772156649015329;

function si(x: number): number {
  return sici(x)[0];
}
function ci(x: number): number {
  return sici(x)[1];
}
/** Cin(x) = γ + ln x − Ci(x). */
export function cin(x: number): number {
  return EULER + Math.log(x) - ci(x);
}

/**
 * Radiated power of a centre-fed dipole of length l with current I_max·sin(k(l/2 − |z|)), per |I_max|²:
 * P/|I_max|² = (η/4π){C + ln(kl) − Ci(kl) + ½ sin(kl)[Si(2kl) − 2Si(kl)]
 *              + ½ cos(kl)[C + ln(kl/2) + Ci(2kl) − 2Ci(kl)]}   (Balanis eq. 4-68, R_r = 2P/|I_max|²).
 */
export function dipolePowerPerAmpSq(klength: number, eta: number): number {
  const x = klength;
  return (
    (eta / (4 * Math.PI)) *
    (EULER +
      Math.log(x) -
      ci(x) +
      0.5 * Math.sin(x) * (si(2 * x) - 2 * si(x)) +
      0.5 * Math.cos(x) * (EULER + Math.log(x / 2) + ci(2 * x) - 2 * ci(x)))
  );
}
