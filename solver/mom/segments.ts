/**
 * Straight segments in flat typed arrays: the frequency-independent geometry that the fill, the ground
 * kernels and the far field read. Built once per model (and once more, mirrored, for image grounds).
 */

export interface SegmentSet {
  n: number;
  /** Start point, xyz flattened. */
  start: Float64Array;
  /** Unit direction start → end, xyz flattened. */
  dir: Float64Array;
  /** Midpoint, xyz flattened. */
  mid: Float64Array;
  len: Float64Array;
  radius: Float64Array;
}

export function makeSegmentSet(starts: Float64Array, ends: Float64Array, radii: Float64Array): SegmentSet {
  const n = radii.length;
  const dir = new Float64Array(3 * n);
  const mid = new Float64Array(3 * n);
  const len = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const dx = ends[3 * i] - starts[3 * i];
    const dy = ends[3 * i + 1] - starts[3 * i + 1];
    const dz = ends[3 * i + 2] - starts[3 * i + 2];
    const l = Math.hypot(dx, dy, dz);
    len[i] = l;
    dir[3 * i] = dx / l;
    dir[3 * i + 1] = dy / l;
    dir[3 * i + 2] = dz / l;
    mid[3 * i] = (starts[3 * i] + ends[3 * i]) / 2;
    mid[3 * i + 1] = (starts[3 * i + 1] + ends[3 * i + 1]) / 2;
    mid[3 * i + 2] = (starts[3 * i + 2] + ends[3 * i + 2]) / 2;
  }
  return { n, start: Float64Array.from(starts), dir, mid, len, radius: Float64Array.from(radii) };
}

/** The mirror image in z = 0: points (x, y, −z), same parametrisation (start stays start). */
export function mirrorSegmentSet(s: SegmentSet): SegmentSet {
  const start = Float64Array.from(s.start);
  const dir = Float64Array.from(s.dir);
  const mid = Float64Array.from(s.mid);
  for (let i = 0; i < s.n; i++) {
    start[3 * i + 2] = -start[3 * i + 2];
    dir[3 * i + 2] = -dir[3 * i + 2];
    mid[3 * i + 2] = -mid[3 * i + 2];
  }
  return { n: s.n, start, dir, mid, len: s.len, radius: s.radius };
}
