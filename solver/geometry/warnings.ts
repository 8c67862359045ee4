/**
 * Thin-wire validity checks that do not stop the solve but deserve the user's eye.
 * Thresholds follow the usual thin-wire guidance (from memory): the reduced kernel wants segments
 * several radii long and a circumference well under a wavelength; wires closer than a few radii
 * interact through currents the thin-wire model cannot represent (no circumferential variation).
 */
import type { Warning } from "../model/types";
import type { Mesh } from "./types";

/** Segment length below this many radii triggers a warning. */
export const MIN_LENGTH_OVER_RADIUS = 4;
/** Radius above this fraction of the shortest wavelength triggers a warning. */
export const MAX_RADIUS_OVER_LAMBDA = 0.01;
/** Surface-to-surface gaps below this many radii (of the thicker wire) trigger a warning. */
export const MIN_GAP_OVER_RADIUS = 3;

export function geometryWarnings(mesh: Mesh, lambdaMin: number, tol: number): Warning[] {
  const out: Warning[] = [];
  const { segs, wireIds } = mesh;
  const wireOf = mesh.view.wireOfSegment;
  const shortWarned = new Set<number>();
  const thickWarned = new Set<number>();
  for (let i = 0; i < segs.n; i++) {
    const w = wireOf[i];
    const a = segs.radius[i];
    if (segs.len[i] < MIN_LENGTH_OVER_RADIUS * a && !shortWarned.has(w)) {
      shortWarned.add(w);
      out.push({
        code: "segment-short",
        message: `wire "${wireIds[w]}" has a segment ${segs.len[i].toPrecision(3)} m long, under ${MIN_LENGTH_OVER_RADIUS} radii: the thin-wire model loses accuracy`,
        wire: wireIds[w],
      });
    }
    if (a > MAX_RADIUS_OVER_LAMBDA * lambdaMin && !thickWarned.has(w)) {
      thickWarned.add(w);
      out.push({
        code: "thin-wire-radius",
        message: `wire "${wireIds[w]}" radius ${a} m exceeds λ/100 at the highest frequency: the thin-wire model loses accuracy`,
        wire: wireIds[w],
      });
    }
  }
  // Close approach between segments that do not share a node.
  const warned = new Set<string>();
  const S = segs.start;
  const D = segs.dir;
  for (let i = 0; i < segs.n; i++) {
    const hi = 0.5 * segs.len[i];
    const mxi = S[3 * i] + D[3 * i] * hi;
    const myi = S[3 * i + 1] + D[3 * i + 1] * hi;
    const mzi = S[3 * i + 2] + D[3 * i + 2] * hi;
    for (let j = i + 1; j < segs.n; j++) {
      // Cheap reject first (this loop is O(S²) and runs on every solve): the two segments are at
      // least |mid_i − mid_j| − (ℓ_i + ℓ_j)/2 apart, so far pairs never reach the exact test below.
      const hj = 0.5 * segs.len[j];
      const dx = S[3 * j] + D[3 * j] * hj - mxi;
      const dy = S[3 * j + 1] + D[3 * j + 1] * hj - myi;
      const dz = S[3 * j + 2] + D[3 * j + 2] * hj - mzi;
      const reach = hi + hj + (MIN_GAP_OVER_RADIUS + 1) * (segs.radius[i] + segs.radius[j]) + tol;
      if (dx * dx + dy * dy + dz * dz > reach * reach) continue;
      const wi = wireOf[i];
      const wj = wireOf[j];
      const key = `${Math.min(wi, wj)}:${Math.max(wi, wj)}`;
      if (warned.has(key)) continue;
      if (wi === wj && j === i + 1) continue;
      const dmin = segmentDistance(S, D, segs.len, i, j);
      const gapLimit = MIN_GAP_OVER_RADIUS * Math.max(segs.radius[i], segs.radius[j]);
      if (dmin <= tol) {
        // Touching. Fine if the two share a node (consecutive, or a junction of wire ends); otherwise
        // an end or a crossing lies on another wire's run, and the two are NOT joined electrically.
        if (!shareNode(S, D, segs.len, i, j, tol)) {
          warned.add(key);
          out.push({
            code: "wires-touch",
            message:
              wi === wj
                ? `wire "${wireIds[wi]}" crosses itself; crossings are not connections`
                : `wires "${wireIds[wi]}" and "${wireIds[wj]}" touch away from their end points; they are not joined (join wires end to end to connect them)`,
            wire: wireIds[wi],
          });
        }
        continue;
      }
      if (dmin < gapLimit + segs.radius[i] + segs.radius[j]) {
        warned.add(key);
        out.push({
          code: "wires-close",
          message:
            wi === wj
              ? `wire "${wireIds[wi]}" passes within ${dmin.toPrecision(3)} m of itself, under a few wire radii`
              : `wires "${wireIds[wi]}" and "${wireIds[wj]}" come within ${dmin.toPrecision(3)} m, under a few wire radii (not joined)`,
          wire: wireIds[wi],
        });
      }
    }
  }
  return out;
}

/** Do segments i and j have an end point in common? */
function shareNode(
  S: Float64Array,
  D: Float64Array,
  L: Float64Array,
  i: number,
  j: number,
  tol: number,
): boolean {
  for (const ei of [0, 1]) {
    for (const ej of [0, 1]) {
      let d2 = 0;
      for (let c = 0; c < 3; c++) {
        const a = S[3 * i + c] + ei * L[i] * D[3 * i + c];
        const b = S[3 * j + c] + ej * L[j] * D[3 * j + c];
        d2 += (a - b) * (a - b);
      }
      if (d2 <= tol * tol) return true;
    }
  }
  return false;
}

/** Shortest distance between two segments (closest points of two line pieces, clamped). */
export function segmentDistance(
  S: Float64Array,
  D: Float64Array,
  L: Float64Array,
  i: number,
  j: number,
): number {
  const ax = S[3 * i];
  const ay = S[3 * i + 1];
  const az = S[3 * i + 2];
  const ux = D[3 * i] * L[i];
  const uy = D[3 * i + 1] * L[i];
  const uz = D[3 * i + 2] * L[i];
  const bx = S[3 * j];
  const by = S[3 * j + 1];
  const bz = S[3 * j + 2];
  const vx = D[3 * j] * L[j];
  const vy = D[3 * j + 1] * L[j];
  const vz = D[3 * j + 2] * L[j];
  const wx = ax - bx;
  const wy = ay - by;
  const wz = az - bz;
  const a = ux * ux + uy * uy + uz * uz;
  const b = ux * vx + uy * vy + uz * vz;
  const c = vx * vx + vy * vy + vz * vz;
  const d = ux * wx + uy * wy + uz * wz;
  const e = vx * wx + vy * wy + vz * wz;
  const den = a * c - b * b;
  let s = den > 1e-14 * a * c ? (b * e - c * d) / den : 0;
  s = Math.min(1, Math.max(0, s));
  let t = (b * s + e) / c;
  if (t < 0) {
    t = 0;
    s = Math.min(1, Math.max(0, -d / a));
  } else if (t > 1) {
    t = 1;
    s = Math.min(1, Math.max(0, (b - d) / a));
  }
  const dx = wx + s * ux - t * vx;
  const dy = wy + s * uy - t * vy;
  const dz = wz + s * uz - t * vz;
  return Math.sqrt(dx * dx + dy * dy + dz * dz);
}
