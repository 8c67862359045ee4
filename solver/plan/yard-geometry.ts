import type { Building, Point2, Point3 } from "./schema";

/** Small pieces of yard geometry shared by compile and the warnings: roofs, polylines, catenaries. */

const deg = Math.PI / 180;

export function polygonCentroid(poly: Point2[]): Point2 {
  // Area-weighted centroid (shoelace); falls back to the vertex mean for degenerate polygons.
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < poly.length; i++) {
    const [x0, y0] = poly[i];
    const [x1, y1] = poly[(i + 1) % poly.length];
    const c = x0 * y1 - x1 * y0;
    a += c;
    cx += (x0 + x1) * c;
    cy += (y0 + y1) * c;
  }
  if (Math.abs(a) < 1e-12) {
    const n = poly.length;
    return [poly.reduce((s, p) => s + p[0], 0) / n, poly.reduce((s, p) => s + p[1], 0) / n];
  }
  return [cx / (3 * a), cy / (3 * a)];
}

export function pointInPolygon(p: Point2, poly: Point2[]): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i];
    const [xj, yj] = poly[j];
    if (yi > p[1] !== yj > p[1] && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Distance from p to the closest point of a polyline, and that point. */
export function nearestOnPolyline(p: Point2, line: Point2[]): { distance: number; point: Point2 } {
  let best = { distance: Number.POSITIVE_INFINITY, point: line[0] as Point2 };
  for (let i = 1; i < line.length; i++) {
    const [ax, ay] = line[i - 1];
    const [bx, by] = line[i];
    const dx = bx - ax;
    const dy = by - ay;
    const l2 = dx * dx + dy * dy;
    const t = l2 > 0 ? Math.max(0, Math.min(1, ((p[0] - ax) * dx + (p[1] - ay) * dy) / l2)) : 0;
    const q: Point2 = [ax + dx * t, ay + dy * t];
    const d = Math.hypot(p[0] - q[0], p[1] - q[1]);
    if (d < best.distance) best = { distance: d, point: q };
  }
  return best;
}

/** Distance from p to the closest point of a 3D polyline. */
export function distanceToPolyline3(p: Point3, line: Point3[]): number {
  let best = Number.POSITIVE_INFINITY;
  for (let i = 1; i < line.length; i++) {
    const a = line[i - 1];
    const b = line[i];
    const d = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
    const l2 = d[0] ** 2 + d[1] ** 2 + d[2] ** 2;
    const t =
      l2 > 0
        ? Math.max(0, Math.min(1, ((p[0] - a[0]) * d[0] + (p[1] - a[1]) * d[1] + (p[2] - a[2]) * d[2]) / l2))
        : 0;
    best = Math.min(best, Math.hypot(p[0] - a[0] - d[0] * t, p[1] - a[1] - d[1] * t, p[2] - a[2] - d[2] * t));
  }
  return best;
}

/**
 * Roof height at p for a gable roof: the ridge runs through the footprint's centroid along `ridgeDeg`
 * and the roof falls linearly to the eaves at the footprint vertex farthest from the ridge line.
 * Returns undefined outside the footprint.
 */
export function roofHeightAt(b: Building, p: Point2): number | undefined {
  if (!pointInPolygon(p, b.footprint)) return undefined;
  const c = polygonCentroid(b.footprint);
  const u: Point2 = [Math.sin(b.ridgeDeg * deg), Math.cos(b.ridgeDeg * deg)];
  const off = (q: Point2) => Math.abs((q[0] - c[0]) * u[1] - (q[1] - c[1]) * u[0]);
  const half = Math.max(...b.footprint.map(off));
  if (half < 1e-9) return b.ridgeHeight;
  return b.ridgeHeight - (b.ridgeHeight - b.eaveHeight) * Math.min(1, off(p) / half);
}

/** Catenary parameter a for a span of chord length L with mid-span sag s: s = a (cosh(L / 2a) − 1). */
export function catenaryParameter(L: number, s: number): number {
  // s falls monotonically as a grows; bisect on log a (robust for any sag the schema allows).
  let lo = Math.log(L * 1e-3);
  let hi = Math.log((L * L) / (8 * s) + L) + 5;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    const a = Math.exp(mid);
    const sag = a * (Math.cosh(L / (2 * a)) - 1);
    if (sag > s) lo = mid;
    else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

/**
 * A sagging span from A to B as a polyline with `pieces` straight pieces (even, so mid-span is a vertex).
 * The drop below the chord follows the level-span catenary of the same chord length and mid-span sag,
 * applied vertically: exact for a level span, a close approximation for gentle slopes. Returns the
 * interior vertices only (A and B excluded).
 */
export function catenaryInterior(A: Point3, B: Point3, sag: number, pieces: number): Point3[] {
  const L = Math.hypot(B[0] - A[0], B[1] - A[1], B[2] - A[2]);
  const a = catenaryParameter(L, sag);
  const out: Point3[] = [];
  for (let i = 1; i < pieces; i++) {
    const t = i / pieces;
    const x = (t - 0.5) * L;
    const drop = sag - a * (Math.cosh(x / a) - 1);
    out.push([A[0] + (B[0] - A[0]) * t, A[1] + (B[1] - A[1]) * t, A[2] + (B[2] - A[2]) * t - drop]);
  }
  return out;
}

export function polylineLength(points: Point3[]): number {
  let s = 0;
  for (let i = 1; i < points.length; i++) {
    s += Math.hypot(
      points[i][0] - points[i - 1][0],
      points[i][1] - points[i - 1][1],
      points[i][2] - points[i - 1][2],
    );
  }
  return s;
}

/** Length-weighted mean height of a set of polylines. */
export function meanHeight(lines: Point3[][]): number {
  let num = 0;
  let den = 0;
  for (const pts of lines) {
    for (let i = 1; i < pts.length; i++) {
      const l = Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1], pts[i][2] - pts[i - 1][2]);
      num += (l * (pts[i][2] + pts[i - 1][2])) / 2;
      den += l;
    }
  }
  return den > 0 ? num / den : 0;
}

export function distance3(a: Point3, b: Point3): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** Point at distance s along A→B. */
export function towards(a: Point3, b: Point3, s: number): Point3 {
  const L = distance3(a, b);
  const t = L > 0 ? s / L : 0;
  return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];
}
