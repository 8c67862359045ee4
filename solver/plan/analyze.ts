import { findResonances } from "../analysis/resonance";
import { AUTO_HEIGHT_WAVELENGTHS } from "../ground/real";
import { prepareModel } from "../index";
import { ModelError } from "../model/errors";
import type { FrequencyResult } from "../model/types";
import type {
  BandAnalysis,
  CompiledPlan,
  PlanAnalysis,
  PlanGroundConnection,
  PlanWarning,
  PowerSplit,
  SweepPoint,
} from "./analysis-types";
import { type Band, bandCentre, bandEdges } from "./bands";
import { activeRun, compilePlan } from "./compile";
import { idealDipole } from "./ideal-dipole";
import { type Plan, PlanError, parsePlan } from "./schema";
import { mapSolverWarnings } from "./warnings";
import { meanHeight } from "./yard-geometry";

/**
 * A plan, band by band: an impedance sweep across each band, resonances, SWR figures, the pattern at the
 * band centre, the power split, and the comparison with the ideal straight dipole.
 *
 * One mesh serves every band (segmented for the highest frequency swept), so a drag re-solves but
 * never re-meshes per band. Sweep points solve impedance only; the pattern is computed at the band
 * centre, where the headline figures are read.
 */

export interface AnalyzeOptions {
  /** Live dragging: 5 sweep points per band and a 6° pattern grid instead of 21 points and 2°. */
  quick?: boolean;
}

const FULL_POINTS = 21;
const QUICK_POINTS = 5;
const FULL_STEP = 2;
const QUICK_STEP = 6;

function linspace(a: number, b: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));
}

/**
 * Quick passes only: the height at which the ideal-dipole reference is trimmed and solved, the plan's
 * mean wire height snapped to a grid of λ/2000 (1 cm on 20 m). Dragging a support moves the mean
 * height by a millimetre or so per step, and each new height costs the reference a fresh trim (half a
 * dozen solves and a pattern); on the grid, successive drag steps find it in the cache. The reference
 * gain varies slowly with h/λ (about 0.4 dB per metre at 9 m on 20 m over average ground, measured
 * here), so half a grid step moves its peak gain by ≲ 0.002 dB and its gain at the plan's take-off
 * angle by ≲ 0.004 dB (measured on the demo plan), far below the 0.1 dB the panel shows. Snapping,
 * rather than reusing whatever reference is nearest in the cache, keeps a quick result a function of
 * the plan alone, not of the drag's history. The full pass, and a plan that sets its own reference
 * height (constant through a drag, so cached anyway), use the exact height; the reported
 * `ideal.heightM` is always the plan's. Never below one grid step: a dipole on the soil is no reference.
 */
export function quickReferenceHeight(heightM: number, centreMHz: number): number {
  const grid = 299.792458 / centreMHz / 2000;
  return Math.max(grid, Math.round(heightM / grid) * grid);
}

/** Index of the sweep point that is the band centre (to rounding), or −1. */
function sharedCentreIndex(mhz: number[], centreMHz: number): number {
  if (mhz.length % 2 === 0) return -1;
  const mid = (mhz.length - 1) / 2;
  return Math.abs(mhz[mid] - centreMHz) <= 1e-12 * centreMHz ? mid : -1;
}

/** Width of the SWR ≤ 2 stretch that holds the minimum, interpolating the crossings linearly. */
export function bandwidth2to1(sweep: SweepPoint[]): { mhz: number; coversBand: boolean } {
  let k = 0;
  for (let i = 1; i < sweep.length; i++) if (sweep[i].swr < sweep[k].swr) k = i;
  if (!(sweep[k].swr <= 2)) return { mhz: 0, coversBand: false };
  const cross = (i: number, j: number) => {
    const a = sweep[i];
    const b = sweep[j];
    return a.mhz + ((2 - a.swr) * (b.mhz - a.mhz)) / (b.swr - a.swr);
  };
  let lo = sweep[0].mhz;
  let hi = sweep[sweep.length - 1].mhz;
  let coversBand = true;
  for (let i = k; i > 0; i--) {
    if (sweep[i - 1].swr > 2) {
      lo = cross(i, i - 1);
      coversBand = false;
      break;
    }
  }
  for (let i = k; i < sweep.length - 1; i++) {
    if (sweep[i + 1].swr > 2) {
      hi = cross(i, i + 1);
      coversBand = false;
      break;
    }
  }
  return { mhz: hi - lo, coversBand };
}

/** Gain of an elevation cut at an angle, linear interpolation in dB. */
export function cutGainAt(cut: { anglesDeg: number[]; gainDbi: number[] } | undefined, deg: number): number {
  if (!cut || cut.anglesDeg.length === 0) return Number.NaN;
  const a = cut.anglesDeg;
  const g = cut.gainDbi;
  if (deg <= a[0]) return g[0];
  for (let i = 1; i < a.length; i++) {
    if (deg <= a[i]) return g[i - 1] + ((g[i] - g[i - 1]) * (deg - a[i - 1])) / (a[i] - a[i - 1]);
  }
  return g[g.length - 1];
}

export function powerSplit(r: FrequencyResult): PowerSplit {
  const acc = r.power.accepted;
  const radiated = r.power.radiated / acc;
  const wireLoss = r.power.wireLoss / acc;
  const loadLoss = r.power.loadLoss / acc;
  // Over ground the space wave is all the far field sees; what is neither radiated nor lost in wires
  // and loads went into the ground (soil and the ground connection). Over perfect ground this is ~0.
  return { radiated, wireLoss, loadLoss, groundLoss: 1 - radiated - wireLoss - loadLoss };
}

/** `wireRuns[0] "dipole"`, `supports[3] "pole"`, or the droop inside its run, for error paths. */
function elementPath(plan: Plan, id: string | undefined): string {
  if (id === undefined) return "plan";
  const s = plan.supports.findIndex((x) => x.id === id);
  if (s >= 0) return `supports[${s}] "${id}"`;
  for (let r = 0; r < plan.wireRuns.length; r++) {
    const run = plan.wireRuns[r];
    if (run.id === id) return `wireRuns[${r}] "${id}"`;
    const d = run.droops?.findIndex((x) => x.id === id) ?? -1;
    if (d >= 0) return `wireRuns[${r}] "${run.id}": droops[${d}] "${id}"`;
  }
  return id;
}

/**
 * Run a solver step; a ModelError it throws names a wire (`wires[2].points`) or the feed, which the user
 * never wrote: re-throw it as a PlanError naming the plan element that wire came from.
 */
function solverStep<T>(plan: Plan, compiled: CompiledPlan, step: () => T): T {
  try {
    return step();
  } catch (e) {
    if (!(e instanceof ModelError) || e instanceof PlanError) throw e;
    const m = /^wires\[(\d+)\]/.exec(e.path);
    const wire = m
      ? compiled.model.wires[Number(m[1])]?.id
      : e.path.startsWith("feed")
        ? compiled.model.feed.wire
        : undefined;
    const ref = wire ? compiled.wireElement[wire] : undefined;
    const inner = e.message.startsWith(`${e.path}: `) ? e.message.slice(e.path.length + 2) : e.message;
    throw new PlanError(
      elementPath(plan, ref?.elementId),
      `${inner} (compiled model: ${e.path || "model"})`,
      ref?.elementId,
    );
  }
}

export function analyzePlan(input: Plan, options: AnalyzeOptions = {}): PlanAnalysis {
  const plan = parsePlan(input);
  const quick = options.quick ?? false;
  const nPoints = quick ? QUICK_POINTS : FULL_POINTS;
  const step = quick ? QUICK_STEP : FULL_STEP;
  const bands: Band[] = plan.bands.map((b) => bandEdges(b, plan.ituRegion));
  const sweeps = bands.map((b) => linspace(b.lowMHz, b.highMHz, nPoints));
  const compiled = compilePlan(plan, { frequenciesMHz: sweeps.flat() });
  // Live passes must answer in tens of milliseconds. Over real ground the rigorous (Sommerfeld) near
  // interaction that "auto" picks whenever any wire is within 0.1 λ of the soil costs seconds per
  // frequency, so a quick pass uses the reflection-coefficient method instead — but only when the fed
  // antenna itself (with its radials) stays above 0.1 λ, so that the approximation touches parasitic
  // metal near the ground (a grounded mast) and not the antenna being tuned. The full pass keeps the
  // plan's method.
  if (quick && compiled.model.ground.kind === "real" && (compiled.model.ground.method ?? "auto") === "auto") {
    const lambdaMax = 299.792458 / Math.min(...bands.map((b) => b.lowMHz));
    const lowest = Math.min(
      ...compiled.model.wires
        .filter((w) => compiled.wireElement[w.id]?.elementId === compiled.activeRunId)
        .flatMap((w) => w.points.map((p) => p[2])),
    );
    if (lowest >= AUTO_HEIGHT_WAVELENGTHS * lambdaMax) {
      compiled.model.ground = { ...compiled.model.ground, method: "reflection" };
    }
  }
  const prepared = solverStep(plan, compiled, () => prepareModel(compiled.model, { patternStepDeg: 0 }));
  const run = activeRun(plan);
  const runWires = compiled.model.wires.filter(
    (w) => compiled.wireElement[w.id]?.elementId === run.id && compiled.wireElement[w.id].kind === "run",
  );
  const referenceHeight = plan.analysis?.referenceHeight;
  const height = referenceHeight ?? meanHeight(runWires.map((w) => w.points));
  const radius = runWires[0].radius;
  const warnings: PlanWarning[] = [...compiled.warnings, ...mapSolverWarnings(prepared.warnings, compiled)];

  const results: BandAnalysis[] = bands.map((band, bi) => {
    const centreMHz = bandCentre(band);
    // With an odd point count the middle sweep point is the band centre, which is solved anyway (with
    // the pattern): take its impedance from that solve instead of filling and factoring Z twice at one
    // frequency — one solve in six saved on a quick pass. Same matrix, same answer; in an interpolated
    // (full) sweep the centre is the fit's middle sample, so the direct fill agrees with it to rounding
    // (measured 4e-11 relative on the demo plan) and the other points keep the same fit band.
    const mid = sharedCentreIndex(sweeps[bi], centreMHz);
    const others = sweeps[bi].filter((_, i) => i !== mid);
    const otherResults = solverStep(plan, compiled, () =>
      // Impedance only; bands of ≥ 6 points interpolate Z between three full fills (Newman 1988).
      prepared.solveSweep(
        others.map((mhz) => mhz * 1e6),
        { patternStepDeg: 0 },
      ),
    );
    // With the pattern kept: the app draws the 3D lobe.
    const centre = solverStep(plan, compiled, () =>
      prepared.solveAt(centreMHz * 1e6, { patternStepDeg: step, keepPattern: true }),
    );
    const sweep: SweepPoint[] = otherResults.map((r) => ({ mhz: r.mhz, impedance: r.impedance, swr: r.swr }));
    if (mid >= 0)
      sweep.splice(mid, 0, { mhz: sweeps[bi][mid], impedance: centre.impedance, swr: centre.swr });
    const resonancesMHz = findResonances(
      sweep.map((p) => p.mhz),
      sweep.map((p) => p.impedance[1]),
    ).map((r) => r.mhz);
    let best = sweep[0];
    for (const p of sweep) if (p.swr < best.swr) best = p;
    const bw = bandwidth2to1(sweep);
    const ideal = idealDipole({
      centreMHz,
      heightM: quick && referenceHeight === undefined ? quickReferenceHeight(height, centreMHz) : height,
      radius,
      material: run.material,
      ground: compiled.model.ground,
      patternStepDeg: step,
    });
    const idealAtTakeoff = cutGainAt(ideal.elevationCut, centre.peakElevationDeg);
    const north = plan.lot.northDeg;
    return {
      name: band.name,
      lowMHz: band.lowMHz,
      highMHz: band.highMHz,
      centreMHz,
      sweep,
      resonancesMHz,
      swrMin: best.swr,
      swrMinMHz: best.mhz,
      swrAtEdges: [sweep[0].swr, sweep[sweep.length - 1].swr],
      bandwidth2to1MHz: bw.mhz,
      bandwidthCoversBand: bw.coversBand,
      feedImpedance: centre.impedance,
      peakGainDbi: centre.peakGainDbi,
      takeoffDeg: centre.peakElevationDeg,
      // Solver bearings are clockwise from the plan's +y; true north sits northDeg clockwise from +y.
      bearingDeg: (((centre.peakBearingDeg - north) % 360) + 360) % 360,
      efficiency: centre.efficiency,
      power: powerSplit(centre),
      ideal: {
        heightM: height,
        lengthM: ideal.lengthM,
        resonanceMHz: ideal.resonanceMHz,
        peakGainDbi: ideal.peakGainDbi,
        takeoffDeg: ideal.takeoffDeg,
        gainAtPlanTakeoffDbi: idealAtTakeoff,
        efficiency: ideal.efficiency,
      },
      vsIdealDipoleDb: centre.peakGainDbi - ideal.peakGainDbi,
      vsIdealAtTakeoffDb: centre.peakGainDbi - idealAtTakeoff,
      centre,
      groundTies: prepared.groundConnections.flatMap((c) => {
        const ohms = prepared.groundTieOhms(c.wire, centreMHz * 1e6);
        return ohms
          ? [{ elementId: compiled.wireElement[c.wire]?.elementId ?? c.wire, wire: c.wire, ohms }]
          : [];
      }),
    };
  });

  return {
    quick,
    activeRunId: run.id,
    referenceOhms: compiled.referenceOhms,
    bands: results,
    warnings,
    compiled,
    mesh: prepared.mesh,
    unknowns: prepared.unknowns,
    segments: prepared.segments,
    groundMethod: prepared.groundMethod,
    groundConnections: [
      ...prepared.groundConnections.map((c) => ({
        elementId: compiled.wireElement[c.wire]?.elementId ?? c.wire,
        wire: c.wire,
        label: c.label,
      })),
      ...radialFieldReports(compiled),
    ],
    highVoltagePoints: results.flatMap((b) =>
      compiled.freeEnds.map((e) => ({ elementId: e.elementId, wire: e.wire, point: e.point, band: b.name })),
    ),
  };
}

/**
 * A radial field touches no ground node (over real ground its wires are lifted a little, since the
 * thin-wire model cannot bury them), so the solver has nothing to say about it; say what was modelled.
 */
function radialFieldReports(compiled: CompiledPlan): PlanGroundConnection[] {
  const byElement = new Map<string, { wire: string; count: number; length: number; height: number }>();
  for (const part of compiled.parts) {
    if (part.kind !== "radial") continue;
    const w = compiled.model.wires.find((x) => x.id === part.wire);
    const f = byElement.get(part.elementId);
    if (f) f.count++;
    else
      byElement.set(part.elementId, {
        wire: part.wire,
        count: 1,
        length: part.toM - part.fromM,
        height: w ? w.points[0][2] : Number.NaN,
      });
  }
  return [...byElement].map(([elementId, f]) => ({
    elementId,
    wire: f.wire,
    label: `radial field: ${f.count} × ${f.length.toFixed(2)} m wires ${(f.height * 100).toFixed(0)} cm above the soil, solved as wires (the model cannot bury them)`,
  }));
}
