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

/** An SWR figure: two decimals where they mean something, fewer once the match is hopeless anyway. */
export function formatSwr(swr: number): string {
  if (!Number.isFinite(swr)) return "∞";
  return swr < 10 ? swr.toFixed(2) : swr < 100 ? swr.toFixed(1) : swr.toFixed(0);
}

export function formatMHz(mhz: number): string {
  return `${mhz.toFixed(3)} MHz`;
}

export function formatDb(db: number, unit = "dB"): string {
  const sign = db > 0 ? "+" : db < 0 ? "−" : "±";
  return `${sign}${Math.abs(db).toFixed(2)} ${unit}`;
}

/** Snap steps offered, in metres (the store's unit), chosen to be round numbers in the user's unit. */
export const SNAP_STEPS: Record<LengthUnit, readonly number[]> = {
  m: [0.1, 0.5, 1],
  ft: [0.5 * METRES_PER_FOOT, 1 * METRES_PER_FOOT, 5 * METRES_PER_FOOT],
};

const sameStep = (a: number, b: number) => Math.abs(a - b) < 1e-9;

/** The snap menu's entries for a unit: its round steps, plus a current step that is not one of them. */
export function snapChoices(unit: LengthUnit, current: number | null): number[] {
  const steps = [...SNAP_STEPS[unit]];
  if (current !== null && !steps.some((m) => sameStep(m, current))) steps.push(current);
  return steps.sort((a, b) => a - b);
}

/** A snap step as the menu shows it: "0.5 ft", "1 ft", "0.1 m"; a non-round step keeps 2 decimals. */
export function formatStep(metres: number, unit: LengthUnit): string {
  const v = toDisplay(metres, unit);
  const whole = (k: number) => Math.abs(v * k - Math.round(v * k)) < 1e-6;
  return formatLength(metres, unit, whole(1) ? 0 : whole(10) ? 1 : 2);
}

/** On a unit switch, the step in the same place on the new unit's list (a custom step is kept). */
export function snapStepAfterUnitSwitch(
  step: number | null,
  from: LengthUnit,
  to: LengthUnit,
): number | null {
  if (step === null) return null;
  const i = SNAP_STEPS[from].findIndex((m) => sameStep(m, step));
  return i >= 0 ? SNAP_STEPS[to][i] : step;
}
