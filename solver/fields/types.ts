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
  /** Gain (dBi) along the great circle through the peak bearing: angle a is the elevation toward the peak
   *  bearing, continuing over the zenith (a = 180 − e behind). 0..180 over ground, −90..270 in free space
   *  (both ends the nadir). Nulls are floored at −300 dBi. */
  elevationCut: { anglesDeg: number[]; gainDbi: number[] };
  /** Gain (dBi) at the peak elevation, bearings 0..360−step. */
  azimuthCut: { anglesDeg: number[]; gainDbi: number[] };
}

export type FarFieldFn = (request: FarFieldRequest) => FarFieldSummary;
