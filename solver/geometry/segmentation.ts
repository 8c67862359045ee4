/**
 * Where the nodes go along one wire: distances from the wire's first point.
 *
 * Automatic: each straight run is cut into pieces no longer than λ_min / segmentsPerWavelength, with at
 * least MIN_PER_RUN segments per run, and every required point (feed, loads) becomes a node exactly.
 * Fixed count: the wire's `segments` are shared among the runs by length (at least one each); required
 * points are then snapped to the nearest node by the caller.
 */

export const MIN_PER_RUN = 3;

/** Cumulative distance at each polyline vertex. */
export function vertexDistances(points: [number, number, number][]): Float64Array {
  const c = new Float64Array(points.length);
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    c[i] = c[i - 1] + Math.hypot(b[0] - a[0], b[1] - a[1], b[2] - a[2]);
  }
  return c;
}

/** Node distances, automatic segmentation. `required` are distances that must be nodes. */
export function autoNodes(cum: Float64Array, maxLen: number, required: number[], tol: number): number[] {
  const nodes: number[] = [0];
  for (let r = 1; r < cum.length; r++) {
    const c0 = cum[r - 1];
    const c1 = cum[r];
    const runLen = c1 - c0;
    const nRun = Math.max(MIN_PER_RUN, Math.ceil(runLen / maxLen - 1e-9));
    const cuts = [c0];
    for (const s of [...required].sort((x, y) => x - y)) {
      // Skip points on the run's ends and repeats (a feed and a load at one node).
      if (s > c0 + tol && s < c1 - tol && s > cuts[cuts.length - 1] + tol) cuts.push(s);
    }
    cuts.push(c1);
    for (let i = 1; i < cuts.length; i++) {
      const piece = cuts[i] - cuts[i - 1];
      const n = Math.max(1, Math.ceil(piece / maxLen - 1e-9), Math.round((nRun * piece) / runLen));
      for (let j = 1; j <= n; j++) nodes.push(j === n ? cuts[i] : cuts[i - 1] + (piece * j) / n);
    }
  }
  return nodes;
}

/** Node distances for a fixed total segment count shared among runs by length (largest remainder). */
export function fixedNodes(cum: Float64Array, total: number): number[] {
  const runs = cum.length - 1;
  const L = cum[runs];
  const exact: number[] = [];
  const counts: number[] = [];
  for (let r = 1; r <= runs; r++) {
    const e = (total * (cum[r] - cum[r - 1])) / L;
    exact.push(e);
    counts.push(Math.max(1, Math.floor(e)));
  }
  let sum = counts.reduce((a, b) => a + b, 0);
  const order = exact.map((e, i) => [e - Math.floor(e), i] as const).sort((a, b) => b[0] - a[0]);
  for (let i = 0; sum < total && i < order.length; i++, sum++) counts[order[i][1]]++;
  const nodes: number[] = [0];
  for (let r = 1; r <= runs; r++) {
    const n = counts[r - 1];
    for (let j = 1; j <= n; j++) nodes.push(j === n ? cum[r] : cum[r - 1] + ((cum[r] - cum[r - 1]) * j) / n);
  }
  return nodes;
}

/** The point at distance s along the polyline. */
export function pointAt(
  points: [number, number, number][],
  cum: Float64Array,
  s: number,
): [number, number, number] {
  let r = 1;
  while (r < cum.length - 1 && cum[r] < s) r++;
  const a = points[r - 1];
  const b = points[r];
  const len = cum[r] - cum[r - 1];
  const t = len > 0 ? Math.min(1, Math.max(0, (s - cum[r - 1]) / len)) : 0;
  return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];
}
