import type { Vec3, Warning, WireModel } from "../model/types";
import type { CompiledPlan, PlanWarning, WirePart } from "./analysis-types";
import type { Plan, Point3 } from "./schema";
import {
  distance3,
  distanceToPolyline3,
  nearestOnPolyline,
  pointInPolygon,
  roofHeightAt,
} from "./yard-geometry";

/**
 * Plan warnings that need only geometry (the solver's own warnings are mapped in `mapSolverWarnings`).
 * Each points at the plan element to fix.
 */

/**
 * Tallest a support of each kind is expected to be, metres. Sanity limits to catch typing errors
 * (a tree "110" that meant 11.0), not engineering limits: common practice, no published source.
 */
export const MAX_SUPPORT_HEIGHT = {
  tree: 40,
  building: 40,
  fence: 3,
  mast: { aluminium: 20, steel: 40, wood: 20, fibreglass: 20 },
} as const;

/** Height a standing adult can reach, metres (default; the plan may set another). Common practice,
 *  no published source; local codes may require more. */
export const DEFAULT_REACH_HEIGHT = 2.4;
const DEFAULT_TRUNK_DIAMETER = 0.3;

interface Context {
  model: WireModel;
  parts: WirePart[];
  freeEnds: CompiledPlan["freeEnds"];
  activeRunId: string;
}

/** Points every ~0.25 m along a wire, with the distance along it. */
function samples(points: Vec3[]): { p: Point3; s: number }[] {
  const out: { p: Point3; s: number }[] = [];
  let s = 0;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const L = distance3(a as Point3, b as Point3);
    const n = Math.max(1, Math.ceil(L / 0.25));
    for (let j = i === 1 ? 0 : 1; j <= n; j++) {
      const t = j / n;
      out.push({
        p: [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, a[2] + (b[2] - a[2]) * t],
        s: s + L * t,
      });
    }
    s += L;
  }
  return out;
}

/** The plan element at distance s along a wire (a droop id, the run id, a mast id). */
export function elementAt(parts: WirePart[], wire: string, s: number): string | undefined {
  const mine = parts.filter((p) => p.wire === wire);
  const hit = mine.find((p) => s >= p.fromM - 1e-9 && s <= p.toM + 1e-9);
  const found = hit ?? mine[mine.length - 1];
  return found?.elementId;
}

export function compileWarnings(plan: Plan, ctx: Context): PlanWarning[] {
  const out: PlanWarning[] = [];
  const warnOnce = new Set<string>();
  const add = (w: PlanWarning) => {
    const key = `${w.code}|${w.elementId}|${w.message}`;
    if (!warnOnce.has(key)) {
      warnOnce.add(key);
      out.push(w);
    }
  };

  // Supports taller than their kind allows.
  for (const s of plan.supports) {
    const h =
      s.type === "building" ? s.ridgeHeight : s.type === "tree" ? (s.totalHeight ?? s.height) : s.height;
    const max = s.type === "mast" ? MAX_SUPPORT_HEIGHT.mast[s.material] : MAX_SUPPORT_HEIGHT[s.type];
    if (h > max) {
      add({
        code: "support-too-tall",
        message: `${s.type} "${s.name || s.id}" is ${h} m tall; a ${s.type === "mast" ? `${s.material} mast` : s.type} over ${max} m is unusual — check the height`,
        elementId: s.id,
      });
    }
    if (s.type === "fence" && s.material === "metal") {
      add({
        code: "metal-fence-not-modelled",
        message: `metal fence "${s.name || s.id}" is drawn but not modelled; it can couple to a low wire`,
        elementId: s.id,
      });
    }
  }

  const runWires = new Set(
    ctx.parts.filter((p) => p.kind === "span" || p.kind === "droop").map((p) => p.wire),
  );
  const anchorsOn = new Map<string, Point3[]>();
  for (const run of plan.wireRuns) {
    for (const a of run.anchors) {
      if (a.kind === "free") continue;
      const s = plan.supports.find((x) => x.id === a.support);
      if (!s) continue;
      const p: Point3 =
        a.kind === "roof"
          ? [a.at[0], a.at[1], 0]
          : s.type === "fence"
            ? [...nearestOnPolyline(a.at ?? s.path[0], s.path).point, 0]
            : s.type === "building"
              ? [0, 0, 0]
              : [s.position[0], s.position[1], 0];
      anchorsOn.set(s.id, [...(anchorsOn.get(s.id) ?? []), p]);
    }
  }
  const nearOwnAnchor = (supportId: string, p: Point3, r: number) =>
    (anchorsOn.get(supportId) ?? []).some((q) => Math.hypot(p[0] - q[0], p[1] - q[1]) < r);

  for (const w of ctx.model.wires) {
    if (!runWires.has(w.id)) continue;
    const pts = samples(w.points);
    for (const s of plan.supports) {
      if (s.type === "building") {
        for (const { p, s: along } of pts) {
          const roof = roofHeightAt(s, [p[0], p[1]]);
          if (roof !== undefined && p[2] < roof - 0.05 && !nearOwnAnchor(s.id, p, 0.3)) {
            add({
              code: "wire-through-roof",
              message: `the wire passes through the roof of "${s.name || s.id}" (${p[2].toFixed(1)} m under a ${roof.toFixed(1)} m roof)`,
              elementId: elementAt(ctx.parts, w.id, along),
            });
            break;
          }
        }
      }
      if (s.type === "tree") {
        const r = (s.trunkDiameter ?? DEFAULT_TRUNK_DIAMETER) / 2;
        const top = s.totalHeight ?? s.height;
        for (const { p, s: along } of pts) {
          const d = Math.hypot(p[0] - s.position[0], p[1] - s.position[1]);
          if (d < r && p[2] < top && !nearOwnAnchor(s.id, p, r + 0.3)) {
            add({
              code: "wire-through-trunk",
              message: `the wire passes through the trunk of "${s.name || s.id}"`,
              elementId: elementAt(ctx.parts, w.id, along),
            });
            break;
          }
        }
      }
    }
    // Power lines: keep every wire farther away than it could fall (common practice, no published source).
    for (const line of plan.powerLines) {
      const tallest = Math.max(...w.points.map((p) => p[2]));
      const fall = Math.max(3, tallest);
      for (const { p, s: along } of pts) {
        if (distanceToPolyline3(p, line.points as Point3[]) < fall) {
          add({
            code: "near-power-line",
            message: `within ${fall.toFixed(1)} m of the power line "${line.name || line.id}": a falling wire or support could touch it. Keep well clear; follow local codes`,
            elementId: elementAt(ctx.parts, w.id, along),
          });
          break;
        }
      }
    }
  }

  // Wire ends within reach above a walkway or in a keep-out area: the RF voltage at a free end can burn.
  const reach = plan.analysis?.reachHeight ?? DEFAULT_REACH_HEIGHT;
  const radialWires = new Set(ctx.parts.filter((p) => p.kind === "radial").map((p) => p.wire));
  for (const e of ctx.freeEnds) {
    // Radials lie on the ground: a trip hazard to route round paths, not a hanging live end.
    if (e.point[2] >= reach || radialWires.has(e.wire)) continue;
    const owner =
      e.end === "start" ? elementAt(ctx.parts, e.wire, 0) : elementAt(ctx.parts, e.wire, Infinity);
    const p2: [number, number] = [e.point[0], e.point[1]];
    for (const walk of plan.walkways) {
      if (nearestOnPolyline(p2, walk.path).distance <= walk.width / 2 + 0.5) {
        add({
          code: "wire-end-within-reach",
          message: `a wire end hangs ${e.point[2].toFixed(2)} m up over "${walk.name || walk.id}", within reach (${reach} m): RF voltage at wire ends can burn — raise it or move it`,
          elementId: owner ?? e.elementId,
        });
      }
    }
    for (const k of plan.keepOuts) {
      if (pointInPolygon(p2, k.outline)) {
        add({
          code: "wire-end-within-reach",
          message: `a wire end hangs ${e.point[2].toFixed(2)} m up inside keep-out "${k.name || k.id}", within reach (${reach} m)`,
          elementId: owner ?? e.elementId,
        });
      }
    }
  }

  // Feed at a junction: the delta gap then sits between several wires and the feed impedance is ill-defined.
  const feed = ctx.model.feed;
  const fw = ctx.model.wires.find((w) => w.id === feed.wire);
  if (fw && (feed.at < 1e-6 || feed.at > 1 - 1e-6)) {
    const p = (feed.at < 0.5 ? fw.points[0] : fw.points[fw.points.length - 1]) as Point3;
    const others = ctx.model.wires.filter(
      (w) =>
        w.id !== fw.id &&
        (distance3(w.points[0] as Point3, p) < 1e-6 ||
          distance3(w.points[w.points.length - 1] as Point3, p) < 1e-6),
    );
    if (others.length >= 2) {
      add({
        code: "feed-at-junction",
        message: `the feed sits where ${others.length + 1} wires meet: move it a little along the run`,
        elementId: ctx.activeRunId,
      });
    }
  }

  // Wire on the reel vs wire the layout needs.
  for (const run of plan.wireRuns) {
    if (run.length === undefined) continue;
    const need = ctx.parts
      .filter(
        (p) => (p.kind === "span" && p.elementId === run.id) || (p.kind === "droop" && p.part === run.id),
      )
      .reduce((s, p) => s + (p.toM - p.fromM), 0);
    if (need > run.length + 0.01) {
      add({
        code: "run-too-short",
        message: `"${run.name || run.id}" needs ${need.toFixed(2)} m of wire between its supports but has ${run.length} m: add rope, move a support or shorten the droops`,
        elementId: run.id,
      });
    }
  }
  return out;
}

/** Solver warnings (which name wires) pointed back at plan elements. */
export function mapSolverWarnings(warnings: Warning[], compiled: CompiledPlan): PlanWarning[] {
  return warnings.map((w) => {
    const elementId = w.wire ? compiled.wireElement[w.wire]?.elementId : undefined;
    const thin = /thin|segment-short|radius|wires-close/.test(w.code);
    return {
      code: thin ? "thin-wire" : "solver",
      message: w.message,
      ...(elementId ? { elementId } : {}),
    };
  });
}
