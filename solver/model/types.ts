/**
 * The wire model: what the solver takes (also the CLI's input format) and what it returns.
 * Units are SI throughout: metres, hertz (MHz only where a field name says so), ohms, amperes.
 * Frame: x east, y north, z up; the ground plane, when there is one, is z = 0.
 */

export type Vec3 = [number, number, number];

/** Conductor: a named material, a conductivity in S/m, or absent for a perfect conductor. */
export type MaterialInput =
  | "copper"
  | "aluminium"
  | "aluminum"
  | "copper-clad steel"
  | "stainless steel"
  | number;

/** How a wire end at z = 0 joins a real (lossy) ground. Over perfect ground every such end is ideal. */
export type GroundConnection =
  | "contact"
  | "ideal"
  | { rod: { length: number; radius: number } }
  | { ohms: number };

export interface WireInput {
  id: string;
  /** Polyline vertices, at least two, metres. */
  points: Vec3[];
  /** Conductor radius, metres. */
  radius: number;
  material?: MaterialInput;
  /** Fixed total segment count for the wire (split across its straight runs by length). */
  segments?: number;
  groundConnection?: GroundConnection;
}

export interface PointOnWire {
  wire: string;
  /** Fraction of the wire's total length from its first point, 0..1. */
  at: number;
}

export type FeedInput = PointOnWire;

export interface LoadInput extends PointOnWire {
  ohms?: number;
  henries?: number;
  farads?: number;
  arrangement?: "series" | "parallel";
}

export type GroundMethod = "auto" | "reflection" | "sommerfeld";

export type GroundInput =
  | { kind: "free" }
  | { kind: "perfect" }
  | { kind: "real"; conductivity?: number; permittivity?: number; preset?: string; method?: GroundMethod };

export type FrequencyInput = number[] | { from: number; to: number; count: number };

export interface WireModel {
  wires: WireInput[];
  feed: FeedInput;
  loads?: LoadInput[];
  ground: GroundInput;
  frequenciesMHz: FrequencyInput;
  /** Reference impedance for SWR, ohms; default 50. */
  referenceOhms?: number;
}

/** Complex number as a pair [re, im]; used in results so they serialise to JSON as they are. */
export type ComplexPair = [number, number];

export interface SolveOptions {
  /** Far-field grid step in degrees (default 2). 0 = skip the pattern (impedance and SWR only). */
  patternStepDeg?: number;
  /** Keep the whole far-field grid in each result (default false: only the peak and cuts). */
  keepPattern?: boolean;
  /** Segments per wavelength at the highest frequency for automatic segmentation (default 25). */
  segmentsPerWavelength?: number;
}

export interface Warning {
  /** Machine-readable kind, e.g. "thin-wire-radius", "feed-snapped". */
  code: string;
  message: string;
  /** The wire (or other input path) the warning points at, when there is one. */
  wire?: string;
  path?: string;
}

/** The segmented model: geometry that does not depend on frequency, kept reachable from every result. */
export interface MeshView {
  /** Segment count. */
  segments: number;
  /** Per segment: start and end points (metres), flattened xyz. */
  starts: Float64Array;
  ends: Float64Array;
  radii: Float64Array;
  /** Index into model.wires for each segment. */
  wireOfSegment: Int32Array;
  /** Distance along the wire (metres from its first point) of each segment's start and end. */
  wireStart: Float64Array;
  wireEnd: Float64Array;
}

/** Currents on every segment, linear along each one: I(u) = start·(1−u) + end·u, u from segment start to end.
 *  Positive current flows from the segment's start toward its end. */
export interface SegmentCurrents {
  startRe: Float64Array;
  startIm: Float64Array;
  endRe: Float64Array;
  endIm: Float64Array;
}

export interface PowerBudget {
  /** Power accepted at the feed, watts (results are normalised to 1 W accepted). */
  accepted: number;
  radiated: number;
  wireLoss: number;
  loadLoss: number;
  groundLoss: number;
}

export interface PatternGrid {
  /** Elevation angles (degrees above the horizon) and bearings (degrees from north, clockwise). */
  elevationsDeg: number[];
  bearingsDeg: number[];
  /** Total gain in dBi, row-major [elevation][bearing]. */
  gainDbi: Float64Array;
  /** The two polarisations, same layout: E_θ (vertical, in the plane of elevation) and E_φ (horizontal).
   *  Their powers add up to the total. */
  verticalDbi: Float64Array;
  horizontalDbi: Float64Array;
}

export interface WireCurrentSummary {
  wire: string;
  peakAmps: number;
}

export interface FrequencyResult {
  mhz: number;
  impedance: ComplexPair;
  swr: number;
  peakGainDbi: number;
  peakElevationDeg: number;
  peakBearingDeg: number;
  directivityDbi: number;
  efficiency: number;
  power: PowerBudget;
  currents: WireCurrentSummary[];
  /** Full current distribution for 1 W accepted (for near fields, wire-end voltage, plots). */
  segmentCurrents: SegmentCurrents;
  /** Feed current and voltage for 1 W accepted. */
  feedCurrent: ComplexPair;
  feedVoltage: ComplexPair;
  pattern?: PatternGrid;
  /** Elevation cut through the peak bearing and azimuth cut at the peak elevation, dBi. */
  elevationCut?: { anglesDeg: number[]; gainDbi: number[] };
  azimuthCut?: { anglesDeg: number[]; gainDbi: number[] };
}

/** How one wire's z = 0 end joins the ground, in words, as the ground that ran modelled it. */
export interface GroundConnectionReport {
  wire: string;
  /** E.g. "2.4 m rod, ≈80.8 Ω at d.c. (Dwight 1936), at HF a lossy line in the soil (Sunde 1949): an estimate"; ideal ones say they are an idealisation. */
  label: string;
}

/**
 * The near-ground method names (`groundMethod`) in words, for reports (CLI text, the app's Results
 * panel). Kept beside the names so a new method is worded where it is declared; unknown names pass through.
 */
export function groundMethodWords(method: string): string {
  switch (method) {
    case "none":
      return "free space (no ground)";
    case "image":
      return "perfect image plane";
    case "reflection":
      return "reflection-coefficient images (Fresnel, approximate)";
    case "sommerfeld":
      return "rigorous half-space (Sommerfeld)";
    default:
      return method;
  }
}

export interface SolveResult {
  segments: number;
  /** Number of unknowns (basis functions). */
  unknowns: number;
  results: FrequencyResult[];
  resonancesMHz: number[];
  warnings: Warning[];
  mesh: MeshView;
  /** Which near-interaction ground method ran ("none" in free space, "image" over perfect ground). */
  groundMethod: string;
  /** One entry per wire with an end joined to the ground (model order); empty in free space. */
  groundConnections: GroundConnectionReport[];
}
