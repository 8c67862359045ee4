import type { MeshView, PatternGrid, SegmentCurrents } from "../model/types";

/** What the far-field code needs to know of the ground: nothing (free), images (perfect), or Fresnel weights. */
export type FarFieldGround =
  | { kind: "free" }
  | { kind: "perfect" }
  | { kind: "real"; permittivity: number; conductivity: number };

export interface FarFieldRequest {
  mesh: MeshView;
  currents: SegmentCurrents;
  frequencyHz: number;
  ground: FarFieldGround;
  /** Power accepted at the feed (W); gain is 4πU over this, so every loss counts. */
  acceptedWatts: number;
  /** Grid step in degrees (2 for the full pattern; coarser for quick passes). */
  stepDeg: number;
  /** Return the whole grid (else only the peak, the two cuts and the integrals). */
  keepPattern: boolean;
}

export interface FarFieldSummary {
  /** Power radiated into the space wave: the whole sphere in free space, the upper half over ground (W). */
  radiatedWatts: number;
  directivityDbi: number;
  peakGainDbi: number;
  peakElevationDeg: number;
  /** Degrees from north (+y), clockwise. */
  peakBearingDeg: number;
  pattern?: PatternGrid;
  elevationCut: { anglesDeg: number[]; gainDbi: number[] };
  azimuthCut: { anglesDeg: number[]; gainDbi: number[] };
}

export type FarFieldFn = (request: FarFieldRequest) => FarFieldSummary;
