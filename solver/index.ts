/**
 * The solver's public face.
 *
 *   solveModel(model, options)      one call: mesh, fill, factor, solve at every frequency, resonances.
 *   prepareModel(model, options)    the same split in two: geometry, mesh and ground built once, then
 *                                   solveAt(frequencyHz) per frequency (sweeps, trimming loops).
 *
 * The model is assumed to have passed the zod schema (solver/model/schema.ts); geometric problems
 * (zero-length segments, points below ground, feeds on free ends, …) still throw ModelError with the
 * path of the offending field.
 */
import { groundSystemWarnings } from "./analysis/ground-system";
import { findResonances } from "./analysis/resonance";
import { frequencyListMHz } from "./analysis/sweep";
import { computeFarField } from "./fields/farfield";
import type { FarFieldFn } from "./fields/types";
import { buildMesh } from "./geometry/mesh";
import type { Mesh } from "./geometry/types";
import type { GroundKernel } from "./ground/kernel";
import { realGroundKernel } from "./ground/real";
import { MU0 } from "./model/constants";
import { conductivityOf } from "./model/materials";
import type {
  FrequencyResult,
  GroundConnectionReport,
  MeshView,
  SolveOptions,
  SolveResult,
  Warning,
  WireModel,
} from "./model/types";
import { type RealGroundFactory, selectGround } from "./mom/ground-select";
import { type FrequencySolveOptions, type MomSolver, makeMomSolver } from "./mom/prepare";
import { mirrorSegmentSet } from "./mom/segments";

export interface PreparedModel {
  readonly mesh: MeshView;
  readonly segments: number;
  readonly unknowns: number;
  readonly warnings: Warning[];
  readonly groundMethod: string;
  /** How each wire with a z = 0 end joins the ground (model order), as the ground kernel models it. */
  readonly groundConnections: GroundConnectionReport[];
  /**
   * The series impedance (ohms) a wire's ground tie puts in at a frequency (Hz), as modelled: a rod's
   * line, a stated resistance, a bare contact's hemisphere term; null for an ideal tie or none.
   */
  groundTieOhms(wireId: string, frequencyHz: number): [number, number] | null;
  /** Frequencies of the model, MHz. */
  readonly frequenciesMHz: number[];
  /** Solve at one frequency (Hz). Options default to those given to prepareModel. */
  solveAt(frequencyHz: number, opts?: FrequencySolveOptions): FrequencyResult;
  /**
   * Many frequencies (Hz) at once, results in the same order. Bands of ≥ 6 points within 12 % share
   * three full fills and interpolate the rest (Newman 1988); `interpolate: false` fills every point.
   */
  solveSweep(frequenciesHz: number[], opts?: FrequencySolveOptions): FrequencyResult[];
}

/** Internal knobs (tests, benchmarks, a substitute lossy-ground factory); not part of the app's contract. */
export interface EngineHooks {
  realGround?: RealGroundFactory;
  farField?: FarFieldFn | null;
}

export interface PreparedInternals {
  meshDetail: Mesh;
  ground: GroundKernel;
  solver: MomSolver;
}

export function prepareModel(
  model: WireModel,
  options: SolveOptions = {},
  hooks: EngineHooks = {},
): PreparedModel {
  return prepareInternal(model, options, hooks).prepared;
}

export function prepareInternal(
  model: WireModel,
  options: SolveOptions = {},
  hooks: EngineHooks = {},
): { prepared: PreparedModel; internals: PreparedInternals } {
  const freqs = frequencyListMHz(model.frequenciesMHz);
  const maxHz = Math.max(...freqs) * 1e6;
  const spw = options.segmentsPerWavelength ?? 25;
  const mesh = buildMesh(model, {
    maxFrequencyHz: maxHz,
    segmentsPerWavelength: spw,
    ground: model.ground.kind !== "free",
  });
  const warnings = [...mesh.warnings, ...materialWarnings(model, Math.min(...freqs) * 1e6)];
  const setup = {
    lowestFrequencyHz: Math.min(...freqs) * 1e6,
    segments: mesh.segs,
    mirrored: mirrorSegmentSet(mesh.segs),
    wireOfSegment: mesh.view.wireOfSegment,
    connections: model.wires.map((w) => w.groundConnection),
  };
  const { kernel, farField } = selectGround(model.ground, setup, hooks.realGround ?? realGroundKernel);
  if (kernel.methodNote) {
    warnings.push({ code: "ground-method-fallback", message: kernel.methodNote, path: "ground.method" });
  }
  const solver = makeMomSolver({
    mesh,
    ground: kernel,
    farFieldGround: farField,
    referenceOhms: model.referenceOhms ?? 50,
    farField: hooks.farField === null ? undefined : (hooks.farField ?? computeFarField),
  });
  const defaults: FrequencySolveOptions = {
    patternStepDeg: options.patternStepDeg ?? 2,
    keepPattern: options.keepPattern ?? false,
  };
  const prepared: PreparedModel = {
    mesh: mesh.view,
    segments: mesh.segs.n,
    unknowns: solver.unknowns,
    warnings,
    groundMethod: kernel.method,
    groundConnections: groundConnectionReports(model, mesh, kernel),
    groundTieOhms: (wireId, hz) => {
      const wi = model.wires.findIndex((w) => w.id === wireId);
      const out = new Float64Array(2);
      if (wi < 0 || !mesh.groundPorts.some((g) => g.wire === wi) || !kernel.tieImpedance?.(wi, hz, out)) {
        return null;
      }
      return [out[0], out[1]];
    },
    frequenciesMHz: freqs,
    solveAt: (hz, opts) => solver.solveAt(hz, { ...defaults, ...opts }),
    solveSweep: (hz, opts) => solver.solveSweep(hz, { ...defaults, ...opts }),
  };
  return { prepared, internals: { meshDetail: mesh, ground: kernel, solver } };
}

/**
 * One report per wire the mesh joined to the ground (a wire with both ends on z = 0 is listed once), in
 * model order. The words come from the ground kernel, which alone knows what it solved (a rod's estimate,
 * a rigorous bare contact, an ideal tie); a kernel without labels (free space) reports none.
 */
function groundConnectionReports(
  model: WireModel,
  mesh: Mesh,
  kernel: GroundKernel,
): GroundConnectionReport[] {
  const wires = [...new Set(mesh.groundPorts.map((g) => g.wire))].sort((a, b) => a - b);
  const out: GroundConnectionReport[] = [];
  for (const wi of wires) {
    const label = kernel.connectionLabel?.(wi);
    if (label !== undefined) out.push({ wire: model.wires[wi].id, label });
  }
  return out;
}

/**
 * The loss model Z_s = (1 + j)·sqrt(ωμ0/2σ) needs the radius to be several skin depths
 * δ = sqrt(2/(ωμ0σ)) (Ramo, Whinnery & Van Duzer, Fields and Waves, §5.6). Checked at the lowest
 * frequency, where δ is largest.
 */
function materialWarnings(model: WireModel, fMinHz: number): Warning[] {
  const out: Warning[] = [];
  model.wires.forEach((w, i) => {
    const sigma = conductivityOf(w.material);
    if (!Number.isFinite(sigma)) return;
    const delta = Math.sqrt(2 / (2 * Math.PI * fMinHz * MU0 * sigma));
    if (w.radius < 3 * delta) {
      out.push({
        code: "skin-depth",
        message: `wire "${w.id}" radius ${w.radius} m is under three skin depths (${delta.toPrecision(2)} m): its loss is only roughly estimated`,
        wire: w.id,
        path: `wires[${i}].radius`,
      });
    }
    if (w.groundConnection !== undefined && model.ground.kind === "free") {
      out.push({
        code: "ground-connection-ignored",
        message: `wire "${w.id}" has a ground connection but the model is in free space`,
        wire: w.id,
        path: `wires[${i}].groundConnection`,
      });
    }
  });
  return out;
}

export function solveModel(
  model: WireModel,
  options: SolveOptions = {},
  hooks: EngineHooks = {},
): SolveResult {
  const { prepared: p, internals } = prepareInternal(model, options, hooks);
  const results = p.solveSweep(p.frequenciesMHz.map((mhz) => mhz * 1e6));
  const grounded = new Set(internals.meshDetail.groundPorts.map((g) => g.wire));
  const resonancesMHz = findResonances(
    results.map((r) => r.mhz),
    results.map((r) => r.impedance[1]),
  ).map((r) => r.mhz);
  return {
    segments: p.segments,
    unknowns: p.unknowns,
    results,
    resonancesMHz,
    warnings: [...p.warnings, ...groundSystemWarnings(model, grounded, results)],
    mesh: p.mesh,
    groundMethod: p.groundMethod,
    groundConnections: p.groundConnections,
  };
}

export type { FrequencySolveOptions };
