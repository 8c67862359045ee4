import { resolveRealGround } from "../../solver/ground/presets";
import type { GroundMethod } from "../../solver/model/types";
import { BAND_NAMES, type ItuRegion } from "../../solver/plan/bands";
import {
  type Anchor,
  type BandName,
  type Droop,
  type Plan,
  type PlanGround,
  PlanGroundSchema,
  type Point2,
  type Support,
  type WireRun,
} from "../../solver/plan/schema";
import { allIds, findElement, mintId, supportCentre, supportHeight } from "./elements";
import { anchorPoint, sketchRun } from "./geometry";

/**
 * Editing commands: pure functions from a plan to a new plan. They never mutate their input, so the
 * store can keep the old plan as an undo snapshot and React can compare by reference. A command that
 * does not apply returns the plan unchanged (same reference): the store then records nothing.
 */

const round = (v: number, step = 0.01) => Math.round(v / step) * step;

export function snap(v: number, step: number | null): number {
  return step ? round(v, step) : v;
}

/**
 * The list with element `id` replaced by f(element), or the very same list when f changed nothing, so
 * unchanged plans keep their identity (the store and the undo history compare by reference).
 */
function replaceById<T extends { id: string }>(list: T[], id: string, f: (x: T) => T): T[] {
  let changed = false;
  const out = list.map((x) => {
    if (x.id !== id) return x;
    const next = f(x);
    if (next !== x) changed = true;
    return next;
  });
  return changed ? out : list;
}

function mapSupport(plan: Plan, id: string, f: (s: Support) => Support): Plan {
  const supports = replaceById(plan.supports, id, f);
  return supports === plan.supports ? plan : { ...plan, supports };
}

function mapRun(plan: Plan, id: string, f: (r: WireRun) => WireRun): Plan {
  const wireRuns = replaceById(plan.wireRuns, id, f);
  return wireRuns === plan.wireRuns ? plan : { ...plan, wireRuns };
}

function mapAnchors(plan: Plan, f: (a: Anchor) => Anchor): Plan {
  let changed = false;
  const wireRuns = plan.wireRuns.map((r) => {
    let runChanged = false;
    const anchors = r.anchors.map((a) => {
      const next = f(a);
      if (next !== a) runChanged = true;
      return next;
    });
    if (!runChanged) return r;
    changed = true;
    return { ...r, anchors };
  });
  return changed ? { ...plan, wireRuns } : plan;
}

const shift = (p: Point2, dx: number, dy: number): Point2 => [p[0] + dx, p[1] + dy];

/**
 * Move a support so its centre sits at `to` on the ground. Areas and lines move as a whole, and so do
 * the roof and fence anchor points on them, so wires stay attached.
 */
export function moveSupport(plan: Plan, id: string, to: Point2): Plan {
  const s = plan.supports.find((x) => x.id === id);
  if (!s) return plan;
  const [cx, cy] = supportCentre(s);
  const dx = to[0] - cx;
  const dy = to[1] - cy;
  if (dx === 0 && dy === 0) return plan;
  let next = mapSupport(plan, id, (sup) => {
    switch (sup.type) {
      case "tree":
      case "mast":
        return {
          ...sup,
          position: [to[0], to[1]] as Point2,
          ...(sup.type === "mast" && sup.guys
            ? { guys: sup.guys.map((g) => ({ ...g, anchor: shift(g.anchor, dx, dy) })) }
            : {}),
        } as Support;
      case "building":
        return { ...sup, footprint: sup.footprint.map((p) => shift(p, dx, dy)) };
      case "fence":
        return { ...sup, path: sup.path.map((p) => shift(p, dx, dy)) };
    }
  });
  next = mapAnchors(next, (a) => {
    if (a.kind === "free" || a.support !== id) return a;
    if (a.kind === "roof") return { ...a, at: shift(a.at, dx, dy) };
    return a.at ? { ...a, at: shift(a.at, dx, dy) } : a;
  });
  return next;
}

/**
 * Set a tree's or mast's height (a fence's too). Anchors that sat at the old top follow the new top, and
 * anchors that would end up above it come down to it: raising a tree with the wire over its top raises
 * the wire, which is what a user means.
 */
export function setSupportHeight(plan: Plan, id: string, height: number): Plan {
  const s = plan.supports.find((x) => x.id === id);
  if (!s || s.type === "building" || !(height > 0) || s.height === height) return plan;
  const old = s.height;
  let next = mapSupport(plan, id, (sup) => ({ ...sup, height }) as Support);
  next = mapAnchors(next, (a) => {
    if (a.kind !== "support" || a.support !== id) return a;
    if (Math.abs(a.height - old) < 1e-6 || a.height > height) return { ...a, height };
    return a;
  });
  if (s.type === "mast" && s.guys) {
    next = mapSupport(next, id, (sup) =>
      sup.type === "mast" && sup.guys
        ? {
            ...sup,
            guys: sup.guys.map((g) => (g.attachHeight > height ? { ...g, attachHeight: height } : g)),
          }
        : sup,
    );
  }
  return next;
}

/** Move an anchor: a free anchor to a point in space; a support anchor up or down its support. */
export function setAnchorHeight(plan: Plan, anchorId: string, height: number): Plan {
  return mapAnchors(plan, (a) => {
    if (a.id !== anchorId) return a;
    if (a.kind === "support") return a.height === height ? a : { ...a, height };
    if (a.kind === "free") return { ...a, position: [a.position[0], a.position[1], height] };
    return { ...a, above: Math.max(0, height) };
  });
}

export function moveFreeAnchor(plan: Plan, anchorId: string, to: Point2): Plan {
  return mapAnchors(plan, (a) =>
    a.id === anchorId && a.kind === "free" ? { ...a, position: [to[0], to[1], a.position[2]] } : a,
  );
}

export type NewSupportKind = "tree" | "metal-mast" | "wood-pole" | "building" | "fence";

/** Add a support at a ground point with sensible, clearly ordinary defaults; returns the plan and the new id. */
export function addSupport(plan: Plan, kind: NewSupportKind, at: Point2): { plan: Plan; id: string } {
  const prefix = kind === "metal-mast" ? "mast" : kind === "wood-pole" ? "pole" : kind;
  const id = mintId(plan, prefix);
  const [x, y] = at;
  let support: Support;
  switch (kind) {
    case "tree":
      support = {
        type: "tree",
        id,
        name: "New tree",
        position: [x, y],
        height: 9,
        totalHeight: 11,
        canopyRadius: 3,
      };
      break;
    case "metal-mast":
      support = {
        type: "mast",
        id,
        name: "New metal mast",
        position: [x, y],
        height: 9,
        diameter: 0.05,
        material: "aluminium",
        base: { kind: "grounded", tie: { kind: "contact" } },
      };
      break;
    case "wood-pole":
      support = {
        type: "mast",
        id,
        name: "New wooden pole",
        position: [x, y],
        height: 7,
        diameter: 0.12,
        material: "wood",
        base: { kind: "insulated" },
      };
      break;
    case "building":
      support = {
        type: "building",
        id,
        name: "New building",
        footprint: [
          [x - 2.5, y - 2],
          [x + 2.5, y - 2],
          [x + 2.5, y + 2],
          [x - 2.5, y + 2],
        ],
        eaveHeight: 2.5,
        ridgeHeight: 4,
        ridgeDeg: 90,
      };
      break;
    case "fence":
      support = {
        type: "fence",
        id,
        name: "New fence",
        path: [
          [x - 3, y],
          [x + 3, y],
        ],
        height: 1.8,
        material: "wood",
      };
      break;
  }
  return { plan: { ...plan, supports: [...plan.supports, support] }, id };
}

/** Where a new wire run can attach: a tree or mast (at a height), or a free point in space. */
export type AnchorTarget = { support: string; height?: number } | { point: [number, number, number] };

/** A new run through the clicked targets (at least two), AWG 14 copper, not fed until the user says. */
export function addWireRun(plan: Plan, targets: readonly AnchorTarget[]): { plan: Plan; id: string } | null {
  if (targets.length < 2) return null;
  const id = mintId(plan, "run");
  const minted = new Set([id]);
  const anchors: Anchor[] = [];
  for (const t of targets) {
    const aid = mintId(plan, "anchor", minted);
    minted.add(aid);
    if ("point" in t) {
      anchors.push({
        kind: "free",
        id: aid,
        name: "",
        position: [t.point[0], t.point[1], Math.max(0, t.point[2])],
      });
      continue;
    }
    const s = plan.supports.find((x) => x.id === t.support);
    if (!s) return null;
    if (s.type === "building") {
      const c = supportCentre(s);
      anchors.push({ kind: "roof", id: aid, name: "", support: s.id, at: c, above: 0.3, rope: 0.5 });
    } else if (s.type === "fence") {
      anchors.push({
        kind: "support",
        id: aid,
        name: "",
        support: s.id,
        height: s.height,
        at: supportCentre(s),
      });
    } else {
      const h = Math.min(t.height ?? supportHeight(s), s.height);
      anchors.push({ kind: "support", id: aid, name: "", support: s.id, height: h, rope: 1 });
    }
  }
  const run: WireRun = { id, name: "New wire run", anchors, wire: { awg: 14 }, material: "copper" };
  return { plan: { ...plan, wireRuns: [...plan.wireRuns, run] }, id };
}

/** Add (or replace) a straight-down droop leg at one end of a run. */
export function setDroop(
  plan: Plan,
  runId: string,
  end: "start" | "end",
  length: number,
): { plan: Plan; id: string } | null {
  const run = plan.wireRuns.find((r) => r.id === runId);
  if (!run || !(length > 0)) return null;
  const existing = run.droops?.find((d) => d.end === end);
  const id = existing?.id ?? mintId(plan, "droop");
  const droop: Droop = {
    id,
    name: existing?.name ?? `${end === "start" ? "Start" : "End"} droop`,
    end,
    length,
  };
  const droops = [...(run.droops ?? []).filter((d) => d.end !== end), droop];
  return { plan: mapRun(plan, runId, (r) => ({ ...r, droops })), id };
}

export function setDroopLength(plan: Plan, droopId: string, length: number): Plan {
  if (!(length > 0)) return plan;
  const ref = findElement(plan, droopId);
  if (ref?.kind !== "droop") return plan;
  return mapRun(plan, ref.run.id, (r) => ({
    ...r,
    droops: r.droops?.map((d) => (d.id === droopId ? { id: d.id, name: d.name, end: d.end, length } : d)),
  }));
}

/**
 * Put the feed on a run at a fraction of its conductor. One fed run is analysed at a time: the run
 * becomes the active one; other runs keep their feeds (the schema allows several).
 */
export function setFeed(plan: Plan, runId: string, at: number): Plan {
  const run = plan.wireRuns.find((r) => r.id === runId);
  if (!run) return plan;
  const clamped = Math.min(1, Math.max(0, at));
  const feed = { at: clamped, system: run.feed?.system ?? { kind: "transformer" as const, ratio: 1 } };
  const next = mapRun(plan, runId, (r) => ({ ...r, feed }));
  const others = next.wireRuns.some((r) => r.id !== runId && r.feed);
  return others ? { ...next, analysis: { ...next.analysis, activeRun: runId } } : next;
}

/** Set a plain numeric or text field on any element by id (the inspector's generic edit). */
export function setField(plan: Plan, id: string, key: string, value: unknown): Plan {
  const ref = findElement(plan, id);
  if (!ref) return plan;
  const put = <T extends object>(obj: T): T =>
    (obj as Record<string, unknown>)[key] === value ? obj : ({ ...obj, [key]: value } as T);
  switch (ref.kind) {
    case "support":
      return mapSupport(plan, id, put);
    case "wireRun":
      return mapRun(plan, id, put);
    case "anchor":
      return mapAnchors(plan, (a) => (a.id === id ? put(a) : a));
    case "droop":
      return mapRun(plan, ref.run.id, (r) => ({
        ...r,
        droops: r.droops?.map((d) => (d.id === id ? put(d) : d)),
      }));
    case "load":
      return mapRun(plan, ref.run.id, (r) => ({
        ...r,
        loads: r.loads?.map((l) => (l.id === id ? put(l) : l)),
      }));
    case "walkway":
      return { ...plan, walkways: plan.walkways.map((w) => (w.id === id ? put(w) : w)) };
    case "keepOut":
      return { ...plan, keepOuts: plan.keepOuts.map((k) => (k.id === id ? put(k) : k)) };
    case "powerLine":
      return { ...plan, powerLines: plan.powerLines.map((p) => (p.id === id ? put(p) : p)) };
    case "guy":
      return mapSupport(plan, ref.support.id, (s) =>
        s.type === "mast" ? { ...s, guys: s.guys?.map((g) => (g.id === id ? put(g) : g)) } : s,
      );
  }
}

/** A command that may refuse: the plan (unchanged when refused) and, if so, the reason in words. */
export type EditResult = { plan: Plan; refused?: undefined } | { plan: Plan; refused: string };
export type DeleteResult = EditResult;

/**
 * Delete an element. Wires attached to a deleted support keep their shape: their anchors become free
 * points where the support held them. Refuses (with the reason) what would leave no plan to analyse.
 */
export function deleteElement(plan: Plan, id: string): DeleteResult {
  const ref = findElement(plan, id);
  if (!ref) return { plan };
  switch (ref.kind) {
    case "support": {
      const freed = mapAnchors(plan, (a) => {
        if (a.kind === "free" || a.support !== id) return a;
        const p = anchorPoint(plan, a) ?? [0, 0, 0];
        return {
          kind: "free",
          id: a.id,
          name: a.name,
          position: p,
          ...(a.sagToNext ? { sagToNext: a.sagToNext } : {}),
        };
      });
      return { plan: { ...freed, supports: freed.supports.filter((s) => s.id !== id) } };
    }
    case "wireRun": {
      if (plan.wireRuns.length === 1) return { plan, refused: "A plan needs at least one wire run." };
      const wireRuns = plan.wireRuns.filter((r) => r.id !== id);
      const hasFeed = wireRuns.some((r) => r.feed);
      const analysis =
        plan.analysis?.activeRun === id ? { ...plan.analysis, activeRun: undefined } : plan.analysis;
      if (!hasFeed) return { plan, refused: "That is the only fed run: put the feed on another run first." };
      return { plan: { ...plan, wireRuns, analysis } };
    }
    case "anchor": {
      if (ref.run.anchors.length <= 2) {
        return { plan, refused: "A run needs two anchors: delete the run instead." };
      }
      return {
        plan: mapRun(plan, ref.run.id, (r) => ({ ...r, anchors: r.anchors.filter((a) => a.id !== id) })),
      };
    }
    case "droop":
      return {
        plan: mapRun(plan, ref.run.id, (r) => ({ ...r, droops: r.droops?.filter((d) => d.id !== id) })),
      };
    case "load":
      return {
        plan: mapRun(plan, ref.run.id, (r) => ({ ...r, loads: r.loads?.filter((l) => l.id !== id) })),
      };
    case "guy":
      return {
        plan: mapSupport(plan, ref.support.id, (s) =>
          s.type === "mast" ? { ...s, guys: s.guys?.filter((g) => g.id !== id) } : s,
        ),
      };
    case "walkway":
      return { plan: { ...plan, walkways: plan.walkways.filter((w) => w.id !== id) } };
    case "keepOut":
      return { plan: { ...plan, keepOuts: plan.keepOuts.filter((k) => k.id !== id) } };
    case "powerLine":
      return { plan: { ...plan, powerLines: plan.powerLines.filter((p) => p.id !== id) } };
  }
}

const OFFSET = 2; // metres east for a duplicate, so it is visibly separate

/** Duplicate a support, walkway, keep-out or wire run, offset a little; a copied run is never fed. */
export function duplicateElement(plan: Plan, id: string): { plan: Plan; id: string } | null {
  const ref = findElement(plan, id);
  if (!ref) return null;
  const minted = new Set<string>();
  const fresh = (prefix: string) => {
    const n = mintId(plan, prefix, minted);
    minted.add(n);
    return n;
  };
  if (ref.kind === "support") {
    const s = ref.support;
    const nid = fresh(s.id.replace(/-\d+$/, "") || s.type);
    let copy: Support = { ...s, id: nid, name: s.name ? `${s.name} copy` : "" } as Support;
    if (copy.type === "mast" && copy.guys)
      copy = { ...copy, guys: copy.guys.map((g) => ({ ...g, id: fresh("guy") })) };
    const placed = { ...plan, supports: [...plan.supports, copy] };
    const [cx, cy] = supportCentre(s);
    return { plan: moveSupport(placed, nid, [cx + OFFSET, cy]), id: nid };
  }
  if (ref.kind === "wireRun") {
    const r = ref.run;
    const nid = fresh("run");
    const anchors = r.anchors.map((a): Anchor => {
      const aid = fresh("anchor");
      if (a.kind === "free")
        return { ...a, id: aid, position: [a.position[0] + OFFSET, a.position[1], a.position[2]] };
      // A copy cannot hang on the same support at the same point; make it free beside the original.
      const p = anchorPoint(plan, a) ?? [0, 0, 0];
      return { kind: "free", id: aid, name: a.name, position: [p[0] + OFFSET, p[1], p[2]] };
    });
    const copy: WireRun = {
      ...r,
      id: nid,
      name: r.name ? `${r.name} copy` : "",
      anchors,
      droops: r.droops?.map((d) => ({ ...d, id: fresh("droop") })),
      loads: r.loads?.map((l) => ({ ...l, id: fresh("load") })),
      feed: undefined,
    };
    return { plan: { ...plan, wireRuns: [...plan.wireRuns, copy] }, id: nid };
  }
  if (ref.kind === "walkway") {
    const nid = fresh("walkway");
    const copy = { ...ref.walkway, id: nid, path: ref.walkway.path.map((p) => shift(p, OFFSET, 0)) };
    return { plan: { ...plan, walkways: [...plan.walkways, copy] }, id: nid };
  }
  if (ref.kind === "keepOut") {
    const nid = fresh("keepout");
    const copy = { ...ref.keepOut, id: nid, outline: ref.keepOut.outline.map((p) => shift(p, OFFSET, 0)) };
    return { plan: { ...plan, keepOuts: [...plan.keepOuts, copy] }, id: nid };
  }
  return null;
}

/** Conductor length of a run as sketched (for the inspector's read-outs). */
export function runLength(plan: Plan, runId: string): number | null {
  const r = plan.wireRuns.find((x) => x.id === runId);
  return r ? (sketchRun(plan, r)?.length ?? null) : null;
}

// ---------- plan-level settings: the soil, the near-ground method, the bands, the ITU region ----------

/** The soil as the settings panel shows it: perfect, a named preset, or custom σ and εr. */
export type GroundChoice =
  | { kind: "perfect" }
  | { kind: "preset"; preset: string; conductivity: number; permittivity: number; method: GroundMethod }
  | { kind: "custom"; conductivity: number; permittivity: number; method: GroundMethod };

/**
 * Read the plan's ground as a choice. A preset with explicit values over it is shown as custom with the
 * values that apply (explicit ones override the preset, as the solver reads them). A ground the solver
 * would refuse (an unknown preset name from a hand-edited file) reads as null: the panel says so.
 */
export function groundChoice(ground: PlanGround): GroundChoice | null {
  if (ground.kind === "perfect") return { kind: "perfect" };
  let resolved: ReturnType<typeof resolveRealGround>;
  try {
    resolved = resolveRealGround(ground);
  } catch {
    return null;
  }
  const { conductivity, permittivity, method } = resolved;
  const overridden = ground.conductivity !== undefined || ground.permittivity !== undefined;
  return resolved.preset !== undefined && !overridden
    ? { kind: "preset", preset: resolved.preset, conductivity, permittivity, method }
    : { kind: "custom", conductivity, permittivity, method };
}

const sameGround = (a: PlanGround, b: PlanGround) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Set the soil: perfect ground, a named preset (solver/ground/presets.ts), or custom σ (S/m) and εr.
 * A real ground keeps the near-ground method the plan had. Refuses, with the reason, what the solver
 * would refuse (σ ≤ 0, εr < 1, an unknown preset): the plan stays as it was.
 */
export function setGround(
  plan: Plan,
  soil:
    | { kind: "perfect" }
    | { kind: "preset"; preset: string }
    | { kind: "custom"; conductivity: number; permittivity: number },
): EditResult {
  const method = plan.ground.kind === "real" ? plan.ground.method : undefined;
  const next: PlanGround =
    soil.kind === "perfect"
      ? { kind: "perfect" }
      : {
          kind: "real",
          ...(soil.kind === "preset"
            ? { preset: soil.preset }
            : { conductivity: soil.conductivity, permittivity: soil.permittivity }),
          ...(method !== undefined ? { method } : {}),
        };
  // The plan schema checks the shape and signs; the solver's resolver the preset name and εr ≥ 1, with
  // the same words the solver would use.
  const parsed = PlanGroundSchema.safeParse(next);
  if (!parsed.success) return { plan, refused: parsed.error.issues[0].message };
  if (next.kind === "real") {
    try {
      resolveRealGround(next);
    } catch (e) {
      return { plan, refused: e instanceof Error ? e.message : String(e) };
    }
  }
  return { plan: sameGround(plan.ground, next) ? plan : { ...plan, ground: next } };
}

/**
 * Set the near-ground method of a real ground. "auto" is the default and is stored as no method at all,
 * so a plan that never chose one stays as written. Over perfect ground there is no method: unchanged.
 */
export function setGroundMethod(plan: Plan, method: GroundMethod): Plan {
  const g = plan.ground;
  if (g.kind !== "real" || (g.method ?? "auto") === method) return plan;
  const { method: _old, ...rest } = g;
  return { ...plan, ground: method === "auto" ? rest : { ...rest, method } };
}

/**
 * Set the bands of interest, kept in the order of the band table (low to high) without repeats.
 * Refuses an empty list: the analysis needs at least one band.
 */
export function setBands(plan: Plan, bands: readonly BandName[]): EditResult {
  const wanted = new Set(bands);
  const next = BAND_NAMES.filter((b) => wanted.has(b));
  if (next.length === 0) return { plan, refused: "Keep at least one band: the analysis needs one to sweep." };
  const same = next.length === plan.bands.length && next.every((b, i) => b === plan.bands[i]);
  return { plan: same ? plan : { ...plan, bands: next } };
}

/** Turn one band on or off (the settings panel's checkbox); refuses turning off the last one. */
export function toggleBand(plan: Plan, band: BandName, on: boolean): EditResult {
  const others = plan.bands.filter((b) => b !== band);
  return setBands(plan, on ? [...others, band] : others);
}

/** Set the ITU region (1, 2 or 3), which sets the band edges the sweeps and SWR-at-edge figures use. */
export function setItuRegion(plan: Plan, region: ItuRegion): Plan {
  return plan.ituRegion === region ? plan : { ...plan, ituRegion: region };
}

export { supportCentre as centreOf } from "./elements";
export { allIds };
