import { findResonances } from "../analysis/resonance";
import { type PreparedModel, prepareModel } from "../index";
import type { WireModel } from "../model/types";

/**
 * Trim a layout to resonance: find the scale L (a total wire length) at which the feed reactance at
 * `mhz` is zero, by secant steps on X(L) from a handbook starting length. Each step is one solve of a
 * small model, impedance only.
 */
export interface TrimResult {
  lengthM: number;
  /** Feed reactance left at `mhz` after trimming, ohms. */
  residualOhms: number;
  steps: number;
  converged: boolean;
}

const TOLERANCE_OHMS = 0.5;
const MAX_STEPS = 10;

/* The model's own frequency list sets the segmentation and the "auto" ground method, so a layout trimmed
 * here meshes exactly as the analysis of the same plan will (compile it with the band edges). */
export function reactanceAt(model: WireModel, mhz: number): number {
  const p = prepareModel(model, { patternStepDeg: 0 });
  return p.solveAt(mhz * 1e6, { patternStepDeg: 0 }).impedance[1];
}

export function trimToResonance(
  build: (lengthM: number) => WireModel,
  startM: number,
  mhz: number,
  bounds: { min: number; max: number } = { min: startM * 0.5, max: startM * 1.5 },
): TrimResult {
  let l0 = startM;
  let x0 = reactanceAt(build(l0), mhz);
  // The second probe goes toward resonance but stays inside the bounds.
  let l1 = Math.min(bounds.max, Math.max(bounds.min, startM * (x0 > 0 ? 0.97 : 1.03)));
  let x1 = reactanceAt(build(l1), mhz);
  let steps = 2;
  while (Math.abs(x1) > TOLERANCE_OHMS && steps < MAX_STEPS) {
    const slope = (x1 - x0) / (l1 - l0);
    // Reactance rises with length near a series resonance; a flat or wrong-signed slope means the
    // secant has left the neighbourhood — fall back to a small step in the right direction.
    let next = Number.isFinite(slope) && slope !== 0 ? l1 - x1 / slope : l1 * (x1 > 0 ? 0.98 : 1.02);
    next = Math.min(bounds.max, Math.max(bounds.min, next));
    if (Math.abs(next - l1) < 1e-6 * l1) break;
    l0 = l1;
    x0 = x1;
    l1 = next;
    x1 = reactanceAt(build(l1), mhz);
    steps++;
  }
  return { lengthM: l1, residualOhms: x1, steps, converged: Math.abs(x1) <= TOLERANCE_OHMS };
}

/**
 * Series or parallel resonances of a model in a small window around `mhz` (±`spanFraction`).
 * `prepared`: the same model already prepared by the caller (the ideal dipole has just solved it for
 * its pattern), so the mesh and ground kernel are not built twice; each solve here asks for no pattern.
 */
export function resonancesNear(
  model: WireModel,
  mhz: number,
  spanFraction = 0.01,
  points = 3,
  prepared?: PreparedModel,
): number[] {
  const f = Array.from(
    { length: points },
    (_, i) => mhz * (1 - spanFraction + (2 * spanFraction * i) / (points - 1)),
  );
  const p = prepared ?? prepareModel(model, { patternStepDeg: 0 });
  const x = f.map((m) => p.solveAt(m * 1e6, { patternStepDeg: 0 }).impedance[1]);
  return findResonances(f, x).map((r) => r.mhz);
}

/**
 * Trim by moving the resonance: find the resonance of the wanted kind near `mhz` from a small sweep and
 * scale the length by f_res / f (a wire's resonances scale inversely with its length). Robust where the
 * reactance is steep. "swr-min" takes the SWR minimum (against the model's reference) as the resonance:
 * an end-fed half wave with a short counterpoise stays capacitive through its high-impedance peak, so
 * its X never crosses zero and the SWR minimum is what the user tunes for.
 */
export function trimByFrequency(
  build: (lengthM: number) => WireModel,
  startM: number,
  mhz: number,
  kind: "series" | "parallel" | "swr-min",
): TrimResult {
  let L = startM;
  let steps = 0;
  let offset = Number.POSITIVE_INFINITY;
  for (; steps < 6; steps++) {
    const span = steps === 0 ? 0.1 : 0.03;
    const f = Array.from({ length: 9 }, (_, i) => mhz * (1 - span + (span / 4) * i));
    const found = resonanceIn(build(L), f, kind);
    if (found === undefined) break;
    offset = found - mhz;
    if (Math.abs(offset) < 5e-4 * mhz) break;
    L *= found / mhz;
  }
  const residualOhms = reactanceAt(build(L), mhz);
  return { lengthM: L, residualOhms, steps, converged: Math.abs(offset) < 5e-4 * mhz };
}

/** The resonance of the given kind nearest the middle of the frequency list `f` (MHz), if any. */
export function resonanceIn(
  model: WireModel,
  f: number[],
  kind: "series" | "parallel" | "swr-min",
): number | undefined {
  const p = prepareModel(model, { patternStepDeg: 0 });
  const r = f.map((m) => p.solveAt(m * 1e6, { patternStepDeg: 0 }));
  const mid = f[Math.floor(f.length / 2)];
  if (kind === "swr-min") {
    let k = 0;
    for (let i = 1; i < r.length; i++) if (r[i].swr < r[k].swr) k = i;
    if (k === 0 || k === r.length - 1) return undefined;
    // Vertex of the parabola through the three points around the minimum.
    const [a, b, c] = [r[k - 1].swr, r[k].swr, r[k + 1].swr];
    const h = f[k + 1] - f[k];
    const den = a - 2 * b + c;
    return den > 0 ? f[k] + (h * (a - c)) / (2 * den) : f[k];
  }
  const found = findResonances(
    f,
    r.map((x) => x.impedance[1]),
  ).filter((x) => x.kind === kind);
  if (!found.length) return undefined;
  return found.reduce((a, b) => (Math.abs(b.mhz - mid) < Math.abs(a.mhz - mid) ? b : a)).mhz;
}
