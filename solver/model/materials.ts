/**
 * Conductor materials by name → conductivity in S/m (20 °C, DC values; the skin-effect model in
 * solver/mom/loss.ts turns them into a surface impedance).
 *
 * - copper: 5.8e7 S/m, the International Annealed Copper Standard (IACS, 1913): 100 % IACS is a
 *   resistivity of 1/58 Ω·mm²/m at 20 °C.
 * - aluminium: 3.5e7 S/m, about 61 % IACS, the electrical-conductor grade (1350) used for wire
 *   (pure aluminium is 3.77e7 S/m, CRC Handbook of Chemistry and Physics, resistivity 2.65e-8 Ω·m).
 *   From memory.
 * - copper-clad steel: copper's 5.8e7 S/m. WHY: at HF the skin depth in copper (δ ≈ 66 µm / sqrt(f/MHz),
 *   about 50 µm at 1.8 MHz, 12 µm at 30 MHz) lies inside the copper cladding of common CCS wire, so the
 *   RF current sees copper and the steel core only adds strength. (Its DC rating of 30–40 % IACS
 *   applies at DC and low frequencies only.) Slightly optimistic on 160 m for thin cladding.
 * - stainless steel: 1.4e6 S/m (type 304, resistivity about 7.2e-7 Ω·m, CRC Handbook; from memory).
 *   Austenitic grades are essentially non-magnetic, so μ = μ0 holds.
 * A number is taken as the conductivity in S/m; absent means a perfect conductor (no loss).
 */
import type { MaterialInput } from "./types";

export const CONDUCTIVITY_S_PER_M: Readonly<Record<Exclude<MaterialInput, number>, number>> = {
  copper: 5.8e7,
  aluminium: 3.5e7,
  aluminum: 3.5e7,
  "copper-clad steel": 5.8e7,
  "stainless steel": 1.4e6,
};

/** Conductivity in S/m, or Infinity for a perfect conductor (material absent). */
export function conductivityOf(material: MaterialInput | undefined): number {
  if (material === undefined) return Number.POSITIVE_INFINITY;
  if (typeof material === "number") return material;
  const s = CONDUCTIVITY_S_PER_M[material];
  return s === undefined ? Number.NaN : s;
}
