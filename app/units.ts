/**
 * Display units. The plan and the solver speak metres; the user may read and type feet.
 * Conversion happens only here, at the boundary between what is stored and what is shown.
 */
export type LengthUnit = "m" | "ft";

/** Exact by definition of the international foot (1959): 0.3048 m. */
export const METRES_PER_FOOT = 0.3048;

export function toDisplay(metres: number, unit: LengthUnit): number {
  return unit === "ft" ? metres / METRES_PER_FOOT : metres;
}

export function fromDisplay(value: number, unit: LengthUnit): number {
  return unit === "ft" ? value * METRES_PER_FOOT : value;
}

/** A length for a label: one decimal in metres, whole-ish feet. */
export function formatLength(metres: number, unit: LengthUnit, digits?: number): string {
  const v = toDisplay(metres, unit);
  const d = digits ?? (unit === "ft" ? (Math.abs(v) < 10 ? 1 : 0) : Math.abs(v) < 10 ? 2 : 1);
  return `${v.toFixed(d)} ${unit}`;
}

/** Grid spacing for the ground: 1 m or 5 ft, with major lines every 5 m or 25 ft. */
export function gridStepMetres(unit: LengthUnit): { minor: number; major: number } {
  return unit === "ft" ? { minor: 5 * METRES_PER_FOOT, major: 25 * METRES_PER_FOOT } : { minor: 1, major: 5 };
}

export function formatMHz(mhz: number): string {
  return `${mhz.toFixed(3)} MHz`;
}

export function formatDb(db: number, unit = "dB"): string {
  const sign = db > 0 ? "+" : db < 0 ? "−" : "±";
  return `${sign}${Math.abs(db).toFixed(2)} ${unit}`;
}
