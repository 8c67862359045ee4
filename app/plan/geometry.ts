import type { Anchor, Building, Plan, Point3, WireRun } from "../../solver/plan/schema";

/**
 * Where things are in 3D, for drawing and for the handles. This is a sketch of the layout in the plan
 * frame (x east-ish, y north-ish, z up, metres); the solver's own compilation decides the exact wire
 * geometry, and the current overlay is drawn from the solver's mesh, not from this.
 */

/** Height of a gable roof at a ground point: eaves along the long sides, ridge through the centroid. */
export function roofHeightAt(b: Building, at: readonly [number, number]): number {
  const [cx, cy] = centroid(b.footprint);
  const a = (b.ridgeDeg * Math.PI) / 180;
  // Ridge direction, clockwise from +y: (sin a, cos a). Distance from the ridge line across it:
  const nx = Math.cos(a);
  const ny = -Math.sin(a);
  const across = (p: readonly [number, number]) => Math.abs((p[0] - cx) * nx + (p[1] - cy) * ny);
  const half = Math.max(1e-9, ...b.footprint.map(across));
  const t = Math.min(1, across(at) / half);
  return b.ridgeHeight + (b.eaveHeight - b.ridgeHeight) * t;
}

export function centroid(pts: readonly (readonly [number, number])[]): [number, number] {
  let x = 0;
  let y = 0;
  for (const p of pts) {
    x += p[0];
    y += p[1];
  }
  return [x / pts.length, y / pts.length];
}

/** The attachment point of an anchor (at the support, before any rope). Null if it names a missing support. */
export function anchorPoint(plan: Plan, anchor: Anchor): Point3 | null {
  if (anchor.kind === "free") return anchor.position;
  const s = plan.supports.find((x) => x.id === anchor.support);
  if (!s) return null;
  if (anchor.kind === "roof") {
    if (s.type !== "building") return null;
    return [anchor.at[0], anchor.at[1], roofHeightAt(s, anchor.at) + (anchor.above ?? 0)];
  }
  if (s.type === "tree" || s.type === "mast") return [s.position[0], s.position[1], anchor.height];
  if (s.type === "fence" && anchor.at) return [anchor.at[0], anchor.at[1], anchor.height];
  return null;
}

function sub(a: Point3, b: Point3): Point3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
function len(v: Point3): number {
  return Math.hypot(v[0], v[1], v[2]);
}
function towards(from: Point3, to: Point3, d: number): Point3 {
  const v = sub(to, from);
  const l = len(v) || 1;
  const t = Math.min(d / l, 0.45);
  return [from[0] + v[0] * t, from[1] + v[1] * t, from[2] + v[2] * t];
}

export interface RunSketch {
  /** The conductor from the start end to the far end, droops included, as one polyline. */
  conductor: Point3[];
  /** Rope/insulator stretches between a support and the wire (non-conductive). */
  ropes: [Point3, Point3][];
  /** Where the insulators sit (the wire's ends at the ropes). */
  insulators: Point3[];
  /** Anchor id → the point the wire passes (after rope). */
  anchorPoints: Map<string, Point3>;
  droopLegs: { id: string; from: Point3; to: Point3 }[];
  feedPoint: Point3 | null;
  /** Conductor length, metres. */
  length: number;
}

const SAG_STEPS = 10;

/** Sketch of a wire run: anchors, ropes, parabolic sag between anchors, droop legs, feed position. */
export function sketchRun(plan: Plan, run: WireRun): RunSketch | null {
  const raw = run.anchors.map((a) => anchorPoint(plan, a));
  if (raw.some((p) => p === null)) return null;
  const pts = raw as Point3[];
  const ropes: [Point3, Point3][] = [];
  const insulators: Point3[] = [];
  const wirePts = pts.slice();
  const last = pts.length - 1;
  const ropeOf = (a: Anchor) => (a.kind === "free" ? 0 : (a.rope ?? 0));
  if (ropeOf(run.anchors[0]) > 0) {
    wirePts[0] = towards(pts[0], pts[1], ropeOf(run.anchors[0]));
    ropes.push([pts[0], wirePts[0]]);
  }
  if (ropeOf(run.anchors[last]) > 0) {
    wirePts[last] = towards(pts[last], pts[last - 1], ropeOf(run.anchors[last]));
    ropes.push([pts[last], wirePts[last]]);
  }
  insulators.push(wirePts[0], wirePts[last]);
  const anchorPoints = new Map<string, Point3>();
  run.anchors.forEach((a, i) => {
    anchorPoints.set(a.id, wirePts[i]);
  });

  const spans: Point3[] = [wirePts[0]];
  for (let i = 0; i < last; i++) {
    const a = wirePts[i];
    const b = wirePts[i + 1];
    const sag = run.anchors[i].sagToNext ?? 0;
    if (sag === 0) {
      spans.push(b);
      continue;
    }
    for (let k = 1; k <= SAG_STEPS; k++) {
      const t = k / SAG_STEPS;
      // A parabola through both ends with the given mid-span sag: close to a catenary for small sag.
      spans.push([
        a[0] + (b[0] - a[0]) * t,
        a[1] + (b[1] - a[1]) * t,
        a[2] + (b[2] - a[2]) * t - 4 * sag * t * (1 - t),
      ]);
    }
  }
  const droopLegs: RunSketch["droopLegs"] = [];
  const legEnd = (end: "start" | "end"): Point3 | null => {
    const d = run.droops?.find((x) => x.end === end);
    if (!d) return null;
    const top = end === "start" ? wirePts[0] : wirePts[last];
    const bottom: Point3 = d.to ?? [top[0], top[1], Math.max(0, top[2] - (d.length ?? 0))];
    droopLegs.push({ id: d.id, from: top, to: bottom });
    return bottom;
  };
  const startLeg = legEnd("start");
  const endLeg = legEnd("end");
  const conductor = [...(startLeg ? [startLeg] : []), ...spans, ...(endLeg ? [endLeg] : [])];
  let length = 0;
  for (let i = 1; i < conductor.length; i++) length += len(sub(conductor[i], conductor[i - 1]));
  const feedPoint = run.feed ? pointAlong(conductor, run.feed.at * length) : null;
  return { conductor, ropes, insulators, anchorPoints, droopLegs, feedPoint, length };
}

export function pointAlong(poly: readonly Point3[], distance: number): Point3 {
  let left = distance;
  for (let i = 1; i < poly.length; i++) {
    const seg = len(sub(poly[i], poly[i - 1]));
    if (left <= seg || i === poly.length - 1) {
      const t = seg > 0 ? Math.min(1, left / seg) : 0;
      const a = poly[i - 1];
      const b = poly[i];
      return [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t];
    }
    left -= seg;
  }
  return poly[0];
}

/** Fraction along a run's conductor nearest to a 3D point (for placing the feed by clicking). */
export function fractionNearest(poly: readonly Point3[], p: Point3): number {
  let total = 0;
  let best = { d: Number.POSITIVE_INFINITY, at: 0 };
  const lengths: number[] = [];
  for (let i = 1; i < poly.length; i++) lengths.push(len(sub(poly[i], poly[i - 1])));
  const whole = lengths.reduce((s, x) => s + x, 0) || 1;
  for (let i = 1; i < poly.length; i++) {
    const a = poly[i - 1];
    const ab = sub(poly[i], a);
    const l2 = ab[0] ** 2 + ab[1] ** 2 + ab[2] ** 2 || 1;
    const t = Math.max(
      0,
      Math.min(1, ((p[0] - a[0]) * ab[0] + (p[1] - a[1]) * ab[1] + (p[2] - a[2]) * ab[2]) / l2),
    );
    const q: Point3 = [a[0] + ab[0] * t, a[1] + ab[1] * t, a[2] + ab[2] * t];
    const d = len(sub(p, q));
    if (d < best.d) best = { d, at: (total + t * lengths[i - 1]) / whole };
    total += lengths[i - 1];
  }
  return best.at;
}
