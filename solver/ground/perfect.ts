/**
 * Perfectly conducting ground at z = 0, by image theory (Balanis, Antenna Theory, 4th ed., §4.7).
 * The image of a source segment lies at (x, y, −z) and carries the negated current on the mirrored
 * geometry: horizontal image current reversed, vertical kept, image charge negated. So the reflected
 * terms are minus the free-space integrals against the mirrored segment, with the mirrored tangent:
 *   vector: −(t̂_p·t̂_q̃) J̃_ab,   scalar: −J̃_00,   t̂_q̃ = (t_x, t_y, −t_z).
 * Over a perfect ground every z = 0 end is an ideal connection.
 */
import { findRuns, PairCache } from "../mom/pair-cache";
import type { GroundFrequency, GroundKernel, GroundSetup } from "./kernel";

export function perfectGround(setup: GroundSetup): GroundKernel {
  const P = setup.segments;
  const M = setup.mirrored;
  const j = new Float64Array(8);
  // Image pairs repeat along straight runs too (Toeplitz for horizontal runs, Hankel for vertical).
  const cache = new PairCache(P, M, findRuns(P, setup.wireOfSegment));
  return {
    method: "image",
    connectsAtZ0: true,
    symmetric: true,
    hasPairTerms: true,
    interpolable: true,
    beginFrequency(f: GroundFrequency) {
      cache.begin(f.k);
    },
    pairTerms(p: number, q: number, out: Float64Array) {
      cache.get(p, q, j);
      const dot =
        P.dir[3 * p] * M.dir[3 * q] +
        P.dir[3 * p + 1] * M.dir[3 * q + 1] +
        P.dir[3 * p + 2] * M.dir[3 * q + 2];
      for (let i = 0; i < 8; i++) out[i] -= dot * j[i];
      out[8] -= j[0];
      out[9] -= j[1];
    },
    nodeImpedance() {
      return false;
    },
    connectionLabel() {
      return "ideal connection (perfect ground)";
    },
  };
}
