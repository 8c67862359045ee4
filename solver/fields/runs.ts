/**
 * Straight runs: maximal chains of consecutive segments (up to MAX_RUN_SEGMENTS) that are collinear,
 * equally long, joined end to start, and carry a continuous current. On a run the current is
 * Σ_k I_k Λ_k(l) over equally spaced nodes, which lets the far-field kernel treat a whole run as one
 * function of r̂·t̂ (see radiation.ts). Any mesh works: a segment that fits no chain is a run of one.
 */

import type { MeshView, SegmentCurrents } from "../model/types";
import { checkMeshAndCurrents } from "./validate";

export interface Runs {
  count: number;
  /** Segments in each run (nodes = segments + 1). */
  segments: Int32Array;
  /** Offset of each run's first node in nodeRe/nodeIm. */
  nodeOffset: Int32Array;
  /** First node position (xyz), unit direction (xyz) and segment length of each run. */
  origin: Float64Array;
  direction: Float64Array;
  segmentLength: Float64Array;
  /** Node currents along each run, amperes. */
  nodeRe: Float64Array;
  nodeIm: Float64Array;
}

/** Relative tolerances: below these a run's idealised geometry and current differ from the mesh by < 1e-9. */
const GEOMETRY_TOL = 1e-10;
const CURRENT_TOL = 1e-11;
/** Longer runs are cut in pieces: keeps each run's band limit, and so its table (cost ∝ n²), small. */
export const MAX_RUN_SEGMENTS = 128;

export function buildRuns(mesh: MeshView, currents: SegmentCurrents): Runs {
  checkMeshAndCurrents(mesh, currents);
  const n = mesh.segments;
  const { starts: s, ends: e } = mesh;
  const { startRe, startIm, endRe, endIm } = currents;
  let scale = 0;
  for (let i = 0; i < n; i++) {
    scale = Math.max(scale, Math.hypot(startRe[i], startIm[i]), Math.hypot(endRe[i], endIm[i]));
  }
  const segs: number[] = [];
  const firstSeg: number[] = [];
  let prevLen = 0;
  let ptx = 0;
  let pty = 0;
  let ptz = 0;
  for (let i = 0; i < n; i++) {
    const dx = e[3 * i] - s[3 * i];
    const dy = e[3 * i + 1] - s[3 * i + 1];
    const dz = e[3 * i + 2] - s[3 * i + 2];
    const len = Math.hypot(dx, dy, dz);
    const tx = dx / len;
    const ty = dy / len;
    const tz = dz / len;
    let joins = false;
    if (i > 0) {
      const gap = Math.hypot(
        s[3 * i] - e[3 * i - 3],
        s[3 * i + 1] - e[3 * i - 2],
        s[3 * i + 2] - e[3 * i - 1],
      );
      const jump = Math.hypot(startRe[i] - endRe[i - 1], startIm[i] - endIm[i - 1]);
      joins =
        gap <= GEOMETRY_TOL * len &&
        Math.abs(len - prevLen) <= GEOMETRY_TOL * len &&
        Math.hypot(tx - ptx, ty - pty, tz - ptz) <= GEOMETRY_TOL &&
        jump <= CURRENT_TOL * scale;
    }
    if (joins && segs[segs.length - 1] < MAX_RUN_SEGMENTS) segs[segs.length - 1]++;
    else {
      segs.push(1);
      firstSeg.push(i);
    }
    prevLen = len;
    ptx = tx;
    pty = ty;
    ptz = tz;
  }
  const count = segs.length;
  const runs: Runs = {
    count,
    segments: Int32Array.from(segs),
    nodeOffset: new Int32Array(count),
    origin: new Float64Array(3 * count),
    direction: new Float64Array(3 * count),
    segmentLength: new Float64Array(count),
    nodeRe: new Float64Array(n + count),
    nodeIm: new Float64Array(n + count),
  };
  let node = 0;
  for (let r = 0; r < count; r++) {
    const i0 = firstSeg[r];
    const dx = e[3 * i0] - s[3 * i0];
    const dy = e[3 * i0 + 1] - s[3 * i0 + 1];
    const dz = e[3 * i0 + 2] - s[3 * i0 + 2];
    const len = Math.hypot(dx, dy, dz);
    runs.origin.set([s[3 * i0], s[3 * i0 + 1], s[3 * i0 + 2]], 3 * r);
    runs.direction.set([dx / len, dy / len, dz / len], 3 * r);
    runs.segmentLength[r] = len;
    runs.nodeOffset[r] = node;
    runs.nodeRe[node] = startRe[i0];
    runs.nodeIm[node] = startIm[i0];
    for (let m = 0; m < segs[r]; m++) {
      runs.nodeRe[node + 1 + m] = endRe[i0 + m];
      runs.nodeIm[node + 1 + m] = endIm[i0 + m];
    }
    node += segs[r] + 1;
  }
  return runs;
}
