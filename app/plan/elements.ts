import type {
  Anchor,
  Droop,
  Guy,
  KeepOut,
  Plan,
  PlanLoad,
  PowerLine,
  Support,
  Walkway,
  WireRun,
} from "../../solver/plan/schema";

/**
 * Every plan element the user can select, found by its id. Ids are unique across the whole plan
 * (the schema checks it), so one id is enough to point at anything: a support, a run, an anchor...
 */
export type ElementRef =
  | { kind: "support"; id: string; support: Support; index: number }
  | { kind: "walkway"; id: string; walkway: Walkway; index: number }
  | { kind: "keepOut"; id: string; keepOut: KeepOut; index: number }
  | { kind: "powerLine"; id: string; powerLine: PowerLine; index: number }
  | { kind: "wireRun"; id: string; run: WireRun; index: number }
  | { kind: "anchor"; id: string; anchor: Anchor; run: WireRun; runIndex: number; index: number }
  | { kind: "droop"; id: string; droop: Droop; run: WireRun; runIndex: number; index: number }
  | { kind: "load"; id: string; load: PlanLoad; run: WireRun; runIndex: number; index: number }
  | { kind: "guy"; id: string; guy: Guy; support: Support; supportIndex: number; index: number };

export function findElement(plan: Plan, id: string | null | undefined): ElementRef | null {
  if (!id) return null;
  for (let i = 0; i < plan.supports.length; i++) {
    const s = plan.supports[i];
    if (s.id === id) return { kind: "support", id, support: s, index: i };
    if (s.type === "mast") {
      const j = s.guys?.findIndex((g) => g.id === id) ?? -1;
      if (j >= 0) return { kind: "guy", id, guy: s.guys![j], support: s, supportIndex: i, index: j };
    }
  }
  for (let i = 0; i < plan.wireRuns.length; i++) {
    const run = plan.wireRuns[i];
    if (run.id === id) return { kind: "wireRun", id, run, index: i };
    const a = run.anchors.findIndex((x) => x.id === id);
    if (a >= 0) return { kind: "anchor", id, anchor: run.anchors[a], run, runIndex: i, index: a };
    const d = run.droops?.findIndex((x) => x.id === id) ?? -1;
    if (d >= 0) return { kind: "droop", id, droop: run.droops![d], run, runIndex: i, index: d };
    const l = run.loads?.findIndex((x) => x.id === id) ?? -1;
    if (l >= 0) return { kind: "load", id, load: run.loads![l], run, runIndex: i, index: l };
  }
  const w = plan.walkways.findIndex((x) => x.id === id);
  if (w >= 0) return { kind: "walkway", id, walkway: plan.walkways[w], index: w };
  const k = plan.keepOuts.findIndex((x) => x.id === id);
  if (k >= 0) return { kind: "keepOut", id, keepOut: plan.keepOuts[k], index: k };
  const p = plan.powerLines.findIndex((x) => x.id === id);
  if (p >= 0) return { kind: "powerLine", id, powerLine: plan.powerLines[p], index: p };
  return null;
}

/** Every id in use, for minting new ones. */
export function allIds(plan: Plan): Set<string> {
  const ids = new Set<string>();
  for (const s of plan.supports) {
    ids.add(s.id);
    if (s.type === "mast")
      s.guys?.forEach((g) => {
        ids.add(g.id);
      });
  }
  for (const r of plan.wireRuns) {
    ids.add(r.id);
    r.anchors.forEach((a) => {
      ids.add(a.id);
    });
    r.droops?.forEach((d) => {
      ids.add(d.id);
    });
    r.loads?.forEach((l) => {
      ids.add(l.id);
    });
  }
  plan.walkways.forEach((w) => {
    ids.add(w.id);
  });
  plan.keepOuts.forEach((k) => {
    ids.add(k.id);
  });
  plan.powerLines.forEach((p) => {
    ids.add(p.id);
  });
  return ids;
}

/** A fresh id like "mast-2", never one the plan (or `also`) already uses. */
export function mintId(plan: Plan, prefix: string, also: Set<string> = new Set()): string {
  const used = allIds(plan);
  for (let n = 1; ; n++) {
    const candidate = `${prefix}-${n}`;
    if (!used.has(candidate) && !also.has(candidate)) return candidate;
  }
}

/** What the element is, in words, for the outline and the inspector's heading. */
export function describeKind(ref: ElementRef): string {
  switch (ref.kind) {
    case "support": {
      const s = ref.support;
      if (s.type === "mast") {
        const metal = s.material === "aluminium" || s.material === "steel";
        return `${metal ? "Metal" : "Non-conductive"} ${s.height >= 8 ? "mast" : "pole"} (${s.material}, ${s.base.kind})`;
      }
      return s.type === "tree" ? "Tree" : s.type === "building" ? "Building" : `Fence (${s.material})`;
    }
    case "wireRun":
      return ref.run.feed ? "Wire run (fed)" : "Wire run";
    case "anchor":
      return ref.anchor.kind === "free" ? "Free anchor point" : `Anchor on ${ref.anchor.support}`;
    case "droop":
      return `Droop leg at the ${ref.droop.end}`;
    case "load":
      return "Lumped load";
    case "guy":
      return "Guy line (non-conductive)";
    case "walkway":
      return "Walkway";
    case "keepOut":
      return "Keep-out area";
    case "powerLine":
      return "Overhead power line";
  }
}

export function displayName(ref: ElementRef): string {
  const named =
    ref.kind === "support"
      ? ref.support.name
      : ref.kind === "wireRun"
        ? ref.run.name
        : ref.kind === "anchor"
          ? ref.anchor.name
          : ref.kind === "droop"
            ? ref.droop.name
            : ref.kind === "load"
              ? ref.load.name
              : ref.kind === "guy"
                ? ref.guy.name
                : ref.kind === "walkway"
                  ? ref.walkway.name
                  : ref.kind === "keepOut"
                    ? ref.keepOut.name
                    : ref.powerLine.name;
  return named || ref.id;
}

export function isMetalMast(s: Support): boolean {
  return s.type === "mast" && (s.material === "aluminium" || s.material === "steel");
}

/** Ground-plane position of a support for handles and labels (centroid for areas and lines). */
export function supportCentre(s: Support): [number, number] {
  if (s.type === "tree" || s.type === "mast") return s.position;
  const pts = s.type === "building" ? s.footprint : s.path;
  let x = 0;
  let y = 0;
  for (const p of pts) {
    x += p[0];
    y += p[1];
  }
  return [x / pts.length, y / pts.length];
}

/** Tallest point of a support: the attach height limit anchors must respect. */
export function supportHeight(s: Support): number {
  return s.type === "building" ? s.ridgeHeight : s.type === "fence" ? s.height : s.height;
}
