/**
 * Closed forms of ∫ (linear current) e^{jκl} dl over one segment, with x = κℓ/2 = (kℓ/2)(r̂·t̂).
 * Each is a difference of nearly equal terms for small x, so below |x| = 0.1 a Taylor series is used
 * (truncation < 1e-12 relative there; the direct form loses < 1e-13 above it).
 */

const SMALL = 0.1;

/** sin x / x: transform of a uniform current over the segment centred on its midpoint (per unit length). */
export function sinc(x: number): number {
  if (Math.abs(x) < SMALL) {
    const x2 = x * x;
    return 1 - (x2 / 6) * (1 - (x2 / 20) * (1 - (x2 / 42) * (1 - x2 / 72)));
  }
  return Math.sin(x) / x;
}

/** (sin x − x cos x)/(2x²) = ∫_{−1/2}^{1/2} s sin(2xs) ds: the odd (ramp) part of a linear current. */
export function rampTransform(x: number): number {
  if (Math.abs(x) < SMALL) {
    const x2 = x * x;
    return x * (1 / 6 - x2 * (1 / 60 - x2 * (1 / 1680 - x2 / 90720)));
  }
  return (Math.sin(x) - x * Math.cos(x)) / (2 * x * x);
}
