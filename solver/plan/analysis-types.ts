import type { ComplexPair, FrequencyResult, MeshView, Vec3, WireModel } from "../model/types";
import type { BandName } from "./schema";

/**
 * What compiling and analysing a plan returns. Everything here is plain data (typed arrays inside the
 * solver's FrequencyResult and MeshView aside), so it crosses the worker boundary by structured clone.
 */

// ---------- compiled plan: the wire model plus the way back to plan elements ----------

/** What part of the plan a wire (or a stretch of one) comes from. */
export type WirePartKind = "run" | "span" | "droop" | "mast" | "radial" | "rod";

export interface WireElementRef {
  /** Id of the plan element (wire run, mast, ...). */
  elementId: string;
  kind: WirePartKind;
  /** Finer detail, e.g. the droop's or anchor's id, or "radial 3". */
  part?: string;
}

/** A stretch of one compiled wire, by distance along it (metres from its first point). */
export interface WirePart extends WireElementRef {
  wire: string;
  fromM: number;
  toM: number;
}

export interface CompiledPlan {
  model: WireModel;
  /** Wire id → the plan element it was compiled from. */
  wireElement: Record<string, WireElementRef>;
  /** Plan element id (run, droop, mast, ...) → the wires that carry it. */
  elementWires: Record<string, string[]>;
  /** Stretches of each wire (runs are split into spans and droop legs). */
  parts: WirePart[];
  /** The fed run being analysed. */
  activeRunId: string;
  /** Reference impedance for SWR (ohms), from the active run's feed system. */
  referenceOhms: number;
  /** Wire ends not joined to anything or to the ground: where the RF voltage is highest. */
  freeEnds: { wire: string; end: "start" | "end"; point: Vec3; elementId: string }[];
  warnings: PlanWarning[];
}

// ---------- warnings ----------

export type PlanWarningCode =
  | "wire-through-roof"
  | "wire-through-trunk"
  | "support-too-tall"
  | "wire-end-within-reach"
  | "wire-over-walkway"
  | "thin-wire"
  | "feed-at-junction"
  | "run-too-short"
  | "near-power-line"
  | "metal-fence-not-modelled"
  | "solver";

export interface PlanWarning {
  code: PlanWarningCode | string;
  message: string;
  /** The plan element the warning is about (support, run, droop, walkway, ...). */
  elementId?: string;
}

// ---------- analysis ----------

export interface SweepPoint {
  mhz: number;
  impedance: ComplexPair;
  swr: number;
}

/** Where the accepted power goes, as fractions of it (they add up to 1). */
export interface PowerSplit {
  radiated: number;
  wireLoss: number;
  loadLoss: number;
  groundLoss: number;
}

/** The ideal straight dipole the plan is measured against in each band. */
export interface IdealDipoleReference {
  heightM: number;
  /** Total length after trimming to resonance at the band centre. */
  lengthM: number;
  resonanceMHz: number;
  peakGainDbi: number;
  takeoffDeg: number;
  /** Its gain at the plan's take-off angle (in the plan's peak bearing, relative to the dipole broadside). */
  gainAtPlanTakeoffDbi: number;
  efficiency: number;
}

export interface BandAnalysis {
  name: BandName;
  lowMHz: number;
  highMHz: number;
  centreMHz: number;
  sweep: SweepPoint[];
  resonancesMHz: number[];
  swrMin: number;
  swrMinMHz: number;
  /** SWR at the lower and upper band edges. */
  swrAtEdges: [number, number];
  /** Width of the SWR ≤ 2 stretch around the minimum, within the swept band (0 if never below 2). */
  bandwidth2to1MHz: number;
  /** SWR ≤ 2 across the whole band: the true 2:1 bandwidth is then wider than `bandwidth2to1MHz`. */
  bandwidthCoversBand: boolean;
  /** Feed impedance at the band centre. */
  feedImpedance: ComplexPair;
  peakGainDbi: number;
  takeoffDeg: number;
  /** Bearing of the peak, degrees from TRUE north (the plan's north direction applied). */
  bearingDeg: number;
  efficiency: number;
  power: PowerSplit;
  ideal: IdealDipoleReference;
  /** Plan peak gain minus the ideal dipole's peak gain, dB. The headline figure. */
  vsIdealDipoleDb: number;
  /** Plan gain at its take-off angle minus the dipole's gain at that same elevation, dB. */
  vsIdealAtTakeoffDb: number;
  /** The solver's full result at the band centre (segment currents, cuts) for drawing and later analyses. */
  centre: FrequencyResult;
  /** Each ground tie's series impedance at the band centre, as modelled (ideal ties are left out). */
  groundTies: { elementId: string; wire: string; ohms: [number, number] }[];
}

/** One compiled wire with an end on the ground: the plan element it carries and the solver's words for the joint. */
export interface PlanGroundConnection {
  /** The element the wire comes from (`CompiledPlan.wireElement`): a mast, or a ground-fed run. */
  elementId: string;
  wire: string;
  /** E.g. "2.4 m rod, ≈80.8 Ω at d.c. (Dwight 1936), at HF a lossy line in the soil (Sunde 1949): an estimate"; ideal ones say they are an idealisation. */
  label: string;
}

export interface PlanAnalysis {
  quick: boolean;
  activeRunId: string;
  referenceOhms: number;
  bands: BandAnalysis[];
  warnings: PlanWarning[];
  compiled: CompiledPlan;
  /** The solver's segmentation of the compiled model (segment → wire → plan element via `compiled`). */
  mesh: MeshView;
  unknowns: number;
  segments: number;
  /** Near-ground method the solver ran: "image" (perfect), "reflection" or "sommerfeld" (real ground). */
  groundMethod: string;
  /** How each conductor touching the ground is joined to it, as the solver modelled it (model order). */
  groundConnections: PlanGroundConnection[];
  /** Free wire ends (current zero, so RF voltage at its peak on a resonant wire), per band, for the app's
   *  high-voltage marks and the later safety work. */
  highVoltagePoints: { elementId: string; wire: string; point: Vec3; band: BandName }[];
}
