/**
 * American Wire Gauge diameters from the defining formula of ASTM B258 (Standard Specification for
 * Standard Nominal Diameters and Cross-Sectional Areas of AWG Sizes of Solid Round Wires):
 *   d(n) = 0.005 in · 92^((36 − n) / 39),
 * so 36 AWG is 0.005 in and 0000 ("4/0") is 0.46 in. Gauges 0, 00, 000, 0000 are written here as
 * 0, −1, −2, −3.
 */

const INCH = 0.0254;

/** Diameter in metres of a solid round wire of the given AWG number (−3 = 4/0 … 40). */
export function awgDiameter(awg: number): number {
  if (!Number.isInteger(awg) || awg < -3 || awg > 40) {
    throw new RangeError(`AWG ${awg} is outside -3 (4/0) .. 40`);
  }
  return 0.005 * 92 ** ((36 - awg) / 39) * INCH;
}

/** Gauge label as the trade writes it: −3 → "4/0", 0 → "1/0", 14 → "14". */
export function awgLabel(awg: number): string {
  return awg <= 0 ? `${1 - awg}/0` : String(awg);
}
