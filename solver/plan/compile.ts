import type {
  FrequencyInput,
  GroundConnection,
  GroundInput,
  LoadInput,
  MaterialInput,
  Vec3,
  WireInput,
  WireModel,
} from "../model/types";
import type { CompiledPlan, PlanWarning, WireElementRef, WirePart } from "./analysis-types";
import { awgDiameter } from "./awg";
import { bandCentre, bandEdges } from "./bands";
import type {
  Anchor,
  FeedSystem,
  GroundTie,
  Mast,
  Plan,
  Point3,
  Support,
  WireGauge,
  WireRun,
} from "./schema";
import { PlanError } from "./schema";
import { compileWarnings, elementAt } from "./warnings";
import {
  catenaryInterior,
  distance3,
  nearestOnPolyline,
  polylineLength,
  roofHeightAt,
  towards,
} from "./yard-geometry";

/**
 * Plan → wire model, keeping the way back from every wire to the plan element it came from.
 *
 * Choices (each one a WHY):
 * - A wire run becomes ONE wire whose polyline holds the start droop, every span (sag as a catenary
 *   polyline) and the end droop, so the feed and load fractions are along the run's whole conductor,
 *   droops included, from its start end. It is split into more wires only where it is bonded to a metal
 *   mast part-way along (the solver joins wires only at their ends); those pieces are `id`, `id#2`, ...
 * - Insulators, rope, guys and non-conductive supports carry no current: they are not in the wire model.
 *   Rope at an end anchor moves the wire's end that far from the support toward the next anchor. Next to
 *   a metal mast an insulated end keeps at least the mast radius + 10 cm clear, so the thin-wire model
 *   does not see two wires touching.
 * - A conductive mast becomes a vertical wire of its radius: grounded masts start at z = 0 with the chosen
 *   tie (contact/rod/ideal), or at the hub of their radial field; insulated masts start a small gap
 *   (default 5 cm) up. Over perfect ground a radial field adds nothing the image plane does not already
 *   give, so it compiles as an ideal connection at z = 0 (fewer unknowns, same answer).
 * - Radials over real ground are wires a few centimetres above the soil (default 5 cm): the thin-wire
 *   model with a ground at z = 0 cannot bury a wire.
 * - The fed run analysed is `analysis.activeRun` or the first run with a feed. Other fed runs are
 *   terminated in their feed system's reference resistance, as a matched feed line would terminate them.
 */

export interface CompileOptions {
  /** Frequencies for the wire model; default the centres of the plan's bands. */
  frequenciesMHz?: FrequencyInput;
}

const MIN_MAST_CLEARANCE = 0.1;
const DEFAULT_INSULATED_GAP = 0.05;
const DEFAULT_RADIAL_HEIGHT = 0.05;
const DEFAULT_RADIAL_DIAMETER = awgDiameter(14);
/** Lowest a droop may hang: z = 0 would make the solver tie it to the ground. */
const MIN_WIRE_HEIGHT = 0.05;
/** Sagged spans get this many straight pieces (even, so mid-span is a vertex). Each piece costs the
 *  solver at least three segments, so keep it small. */
const SAG_PIECES = 4;

export function isConductiveMast(s: Support): s is Mast {
  return s.type === "mast" && (s.material === "aluminium" || s.material === "steel");
}

export function wireDiameter(g: WireGauge): number {
  return "awg" in g ? awgDiameter(g.awg) : g.diameter;
}

export function referenceOhmsOf(system: FeedSystem): number {
  return system.kind === "reference" ? system.ohms : (system.lineOhms ?? 50) * system.ratio;
}

/** Steel masts: the solver knows stainless steel; galvanised carbon steel is magnetic and lossier than this. */
function mastMaterial(m: Mast): MaterialInput {
  return m.material === "aluminium" ? "aluminium" : "stainless steel";
}

function tieConnection(tie: GroundTie): GroundConnection {
  if (tie.kind === "contact") return "contact";
  if (tie.kind === "rod") return { rod: { length: tie.length, radius: tie.diameter / 2 } };
  return "ideal";
}

export function planGround(plan: Plan): GroundInput {
  const g = plan.ground;
  if (g.kind === "perfect") return { kind: "perfect" };
  const out: GroundInput = { kind: "real" };
  if (g.preset !== undefined) out.preset = g.preset;
  if (g.conductivity !== undefined) out.conductivity = g.conductivity;
  if (g.permittivity !== undefined) out.permittivity = g.permittivity;
  if (g.method !== undefined) out.method = g.method;
  return out;
}

interface Where {
  path: (string | number)[];
}

function err(plan: Plan, where: Where, message: string, elementId?: string): never {
  // Build the same `wireRuns[0] "dipole": anchors[1] "east": height` labels parsePlan uses.
  let text = "";
  let node: unknown = plan;
  let last: string | undefined;
  for (const part of where.path) {
    if (typeof part === "number") {
      node = (node as unknown[])[part];
      const id = (node as { id?: string } | undefined)?.id;
      text += `[${part}]${id ? ` "${id}"` : ""}`;
      if (id) last = id;
    } else {
      text += text === "" ? part : text.endsWith('"') ? `: ${part}` : `.${part}`;
      node = (node as Record<string, unknown> | undefined)?.[part];
    }
  }
  throw new PlanError(text, message, elementId ?? last);
}

/** Where an anchor is in space (before rope), from its support. */
export function anchorPosition(plan: Plan, anchor: Anchor, where: Where): Point3 {
  if (anchor.kind === "free") return [...anchor.position];
  const s = plan.supports.find((x) => x.id === anchor.support);
  if (!s) return err(plan, { path: [...where.path, "support"] }, `no support with id "${anchor.support}"`);
  if (anchor.kind === "roof") {
    if (s.type !== "building") return err(plan, { path: [...where.path, "support"] }, "not a building");
    const h = roofHeightAt(s, anchor.at);
    if (h === undefined) {
      return err(
        plan,
        { path: [...where.path, "at"] },
        `[${anchor.at.join(", ")}] is not on the roof of "${s.id}"`,
      );
    }
    return [anchor.at[0], anchor.at[1], h + (anchor.above ?? 0)];
  }
  if (s.type === "fence") {
    // Snap to the fence line: the user clicked near it.
    const q = nearestOnPolyline(anchor.at ?? s.path[0], s.path).point;
    return [q[0], q[1], anchor.height];
  }
  if (s.type === "building")
    return err(plan, { path: [...where.path, "kind"] }, 'a building takes a "roof" anchor');
  return [s.position[0], s.position[1], anchor.height];
}

interface Piece {
  points: Vec3[];
  parts: Omit<WirePart, "wire">[];
}

/** The run's conductor as pieces (split at mid-run bonds), with the parts along each. */
export function runGeometry(
  plan: Plan,
  runIndex: number,
): { pieces: Piece[]; bonds: { mast: string; point: Vec3 }[] } {
  const run = plan.wireRuns[runIndex];
  const at = (...p: (string | number)[]) => ({ path: ["wireRuns", runIndex, ...p] });
  const n = run.anchors.length;
  const pts: Point3[] = run.anchors.map((a, i) => anchorPosition(plan, a, at("anchors", i)));
  const bonds: { mast: string; point: Vec3 }[] = [];
  for (let i = 0; i < n; i++) {
    const a = run.anchors[i];
    if (a.kind === "support" && a.bonded) bonds.push({ mast: a.support, point: pts[i] as Vec3 });
  }
  // A wire passing a metal mast part-way along (not bonded) rides on an insulator: on top of the mast it
  // sits a clearance above it, lower down a clearance beside it (perpendicular to the run), so the
  // thin-wire model never sees the two conductors touch.
  for (let i = 1; i < n - 1; i++) {
    const a = run.anchors[i];
    if (a.kind !== "support" || a.bonded) continue;
    const s = plan.supports.find((x) => x.id === a.support);
    if (!s || !isConductiveMast(s)) continue;
    const clear = s.diameter / 2 + MIN_MAST_CLEARANCE;
    if (a.height >= s.height - 1e-6) {
      pts[i] = [pts[i][0], pts[i][1], s.height + clear];
      continue;
    }
    const dx = pts[i + 1][0] - pts[i - 1][0];
    const dy = pts[i + 1][1] - pts[i - 1][1];
    const h = Math.hypot(dx, dy) || 1;
    pts[i] = [pts[i][0] - (dy / h) * clear, pts[i][1] + (dx / h) * clear, pts[i][2]];
  }
  if (run.groundStart) {
    if (pts[0][2] > 0.5) {
      err(
        plan,
        at("anchors", 0),
        "a run tied to the ground (groundStart) must start at ground level (z = 0)",
      );
    }
    pts[0] = [pts[0][0], pts[0][1], 0];
  }
  for (let i = 1; i < n; i++) {
    if (distance3(pts[i], pts[i - 1]) < 1e-3)
      err(plan, at("anchors", i), "in the same place as the anchor before it");
  }
  // Rope at the two ends: the wire starts and stops short of the support.
  const ropeOf = (i: number): number => {
    const a = run.anchors[i];
    if (a.kind === "free" || (a.kind === "support" && a.bonded)) return 0;
    let rope = a.rope ?? 0;
    const s = plan.supports.find((x) => x.id === a.support);
    if (s && isConductiveMast(s)) rope = Math.max(rope, s.diameter / 2 + MIN_MAST_CLEARANCE);
    return rope;
  };
  const ropeStart = ropeOf(0);
  const ropeEnd = ropeOf(n - 1);
  if (n === 2 && ropeStart + ropeEnd >= distance3(pts[0], pts[1]) - 0.05) {
    err(
      plan,
      at("anchors", 0, "rope"),
      `the ropes (${(ropeStart + ropeEnd).toFixed(2)} m) leave no wire in the ${distance3(pts[0], pts[1]).toFixed(2)} m span`,
    );
  }
  if (ropeStart > 0 && ropeStart >= distance3(pts[0], pts[1]) - 0.05)
    err(plan, at("anchors", 0, "rope"), "longer than the first span");
  if (ropeEnd > 0 && ropeEnd >= distance3(pts[n - 1], pts[n - 2]) - 0.05)
    err(plan, at("anchors", n - 1, "rope"), "longer than the last span");
  const ends: Point3[] = pts.map((p) => [...p] as Point3);
  if (ropeStart > 0) ends[0] = towards(pts[0], pts[1], ropeStart);
  if (ropeEnd > 0) ends[n - 1] = towards(pts[n - 1], pts[n - 2], ropeEnd);

  const pieces: Piece[] = [];
  let cur: Piece = { points: [], parts: [] };
  let dist = 0;
  const push = (p: Point3) => {
    const last = cur.points[cur.points.length - 1];
    if (last) dist += distance3(last as Point3, p);
    cur.points.push([p[0], p[1], p[2]]);
  };
  const mark = (from: number, ref: WireElementRef) => cur.parts.push({ ...ref, fromM: from, toM: dist });

  const droop = (end: "start" | "end") => run.droops?.findIndex((d) => d.end === end) ?? -1;
  const droopPoint = (j: number, top: Point3): Point3 => {
    const d = run.droops![j];
    const p: Point3 = d.to ? [...d.to] : [top[0], top[1], top[2] - d.length!];
    if (p[2] < MIN_WIRE_HEIGHT) {
      err(
        plan,
        at("droops", j, d.to ? "to" : "length"),
        `hangs to ${p[2].toFixed(2)} m: it would touch the ground`,
      );
    }
    if (distance3(p, top) < 0.01) err(plan, at("droops", j), "has no length");
    return p;
  };
  const ds = droop("start");
  if (ds >= 0) {
    if (run.groundStart) err(plan, at("droops", ds), "a run tied to the ground cannot droop at its start");
    push(droopPoint(ds, ends[0]));
    push(ends[0]);
    mark(0, { elementId: run.droops![ds].id, kind: "droop", part: run.id });
  } else push(ends[0]);
  for (let i = 1; i < n; i++) {
    const from = dist;
    const sag = run.anchors[i - 1].sagToNext ?? 0;
    if (sag > 0) {
      const L = distance3(ends[i - 1], ends[i]);
      if (sag > L / 4)
        err(plan, at("anchors", i - 1, "sagToNext"), `more than a quarter of the ${L.toFixed(2)} m span`);
      for (const q of catenaryInterior(ends[i - 1], ends[i], sag, SAG_PIECES)) {
        if (q[2] < MIN_WIRE_HEIGHT) err(plan, at("anchors", i - 1, "sagToNext"), "sags to the ground");
        push(q);
      }
    }
    push(ends[i]);
    mark(from, { elementId: run.id, kind: "span", part: `${run.anchors[i - 1].id}–${run.anchors[i].id}` });
    const a = run.anchors[i];
    if (i < n - 1 && a.kind === "support" && a.bonded) {
      // Bonded mid-run: close this wire at the mast so the solver makes a junction there.
      pieces.push(cur);
      cur = { points: [[...ends[i]] as Vec3], parts: [] };
      dist = 0;
    }
  }
  const de = droop("end");
  if (de >= 0) {
    const from = dist;
    push(droopPoint(de, ends[n - 1]));
    mark(from, { elementId: run.droops![de].id, kind: "droop", part: run.id });
  }
  pieces.push(cur);
  return { pieces, bonds };
}

/** Vertical wires (and radials) of one conductive mast, split at the heights where runs are bonded. */
function mastWires(
  plan: Plan,
  mast: Mast,
  bondHeights: number[],
  wires: WireInput[],
  parts: WirePart[],
): void {
  const [x, y] = mast.position;
  const radius = mast.diameter / 2;
  const perfect = plan.ground.kind === "perfect";
  let base = mast.base.kind === "insulated" ? (mast.base.gap ?? DEFAULT_INSULATED_GAP) : 0;
  let connection: GroundConnection | undefined;
  if (mast.base.kind === "grounded") {
    const tie = mast.base.tie;
    if (tie.kind === "radials" && !perfect) base = tie.height ?? DEFAULT_RADIAL_HEIGHT;
    else connection = tie.kind === "radials" ? "ideal" : tieConnection(tie);
  }
  const cuts = [...new Set(bondHeights)]
    .filter((h) => h > base + 1e-6 && h < mast.height - 1e-6)
    .sort((a, b) => a - b);
  const levels = [base, ...cuts, mast.height];
  for (let k = 1; k < levels.length; k++) {
    const id = k === 1 ? mast.id : `${mast.id}#${k}`;
    const w: WireInput = {
      id,
      points: [
        [x, y, levels[k - 1]],
        [x, y, levels[k]],
      ],
      radius,
      material: mastMaterial(mast),
    };
    if (k === 1 && connection) w.groundConnection = connection;
    wires.push(w);
    parts.push({ wire: id, fromM: 0, toM: levels[k] - levels[k - 1], elementId: mast.id, kind: "mast" });
  }
  // The radials join the mast's base point, which is the hub.
  if (mast.base.kind === "grounded" && mast.base.tie.kind === "radials" && !perfect) {
    radialWires(mast.id, [x, y, base], mast.base.tie, wires, parts);
  }
}

function radialWires(
  elementId: string,
  hub: Vec3,
  tie: Extract<GroundTie, { kind: "radials" }>,
  wires: WireInput[],
  parts: WirePart[],
): void {
  const radius = (tie.diameter ?? DEFAULT_RADIAL_DIAMETER) / 2;
  for (let k = 0; k < tie.count; k++) {
    const phi = (2 * Math.PI * k) / tie.count;
    const id = `${elementId}/radial-${k + 1}`;
    const end: Vec3 = [hub[0] + tie.length * Math.cos(phi), hub[1] + tie.length * Math.sin(phi), hub[2]];
    wires.push({ id, points: [[...hub], end], radius, material: "copper" });
    parts.push({ wire: id, fromM: 0, toM: tie.length, elementId, kind: "radial", part: `radial ${k + 1}` });
  }
}

/** Fraction along the whole run (all pieces) → the piece's wire and its own fraction. */
function locate(pieceIds: string[], lengths: number[], fraction: number): { wire: string; at: number } {
  const total = lengths.reduce((a, b) => a + b, 0);
  let s = fraction * total;
  for (let i = 0; i < lengths.length; i++) {
    if (s <= lengths[i] + 1e-9 || i === lengths.length - 1) {
      return { wire: pieceIds[i], at: Math.min(1, Math.max(0, s / lengths[i])) };
    }
    s -= lengths[i];
  }
  return { wire: pieceIds[0], at: fraction };
}

export function activeRun(plan: Plan): WireRun {
  const id = plan.analysis?.activeRun;
  const run = plan.wireRuns.find((r) => (id === undefined || r.id === id) && r.feed);
  if (!run) throw new PlanError("wireRuns", "no run has a feed: give one run a feed position");
  return run;
}

export function compilePlan(plan: Plan, options: CompileOptions = {}): CompiledPlan {
  const wires: WireInput[] = [];
  const parts: WirePart[] = [];
  const loads: LoadInput[] = [];
  const warnings: PlanWarning[] = [];
  const bondsByMast = new Map<string, number[]>();
  const active = activeRun(plan);
  let feed: { wire: string; at: number } | undefined;
  const runPieces = new Map<string, { ids: string[]; lengths: number[] }>();

  plan.wireRuns.forEach((run, r) => {
    const { pieces, bonds } = runGeometry(plan, r);
    for (const b of bonds) bondsByMast.set(b.mast, [...(bondsByMast.get(b.mast) ?? []), b.point[2]]);
    const radius = wireDiameter(run.wire) / 2;
    const ids = pieces.map((_, k) => (k === 0 ? run.id : `${run.id}#${k + 1}`));
    const lengths = pieces.map((p) => polylineLength(p.points as Point3[]));
    runPieces.set(run.id, { ids, lengths });
    pieces.forEach((p, k) => {
      const w: WireInput = { id: ids[k], points: p.points, radius, material: run.material };
      wires.push(w);
      for (const part of p.parts) parts.push({ ...part, wire: ids[k] });
    });
    if (run.groundStart) {
      const first = wires.find((w) => w.id === ids[0])!;
      if (run.groundStart.kind === "radials" && plan.ground.kind !== "perfect") {
        const h = run.groundStart.height ?? DEFAULT_RADIAL_HEIGHT;
        first.points[0] = [first.points[0][0], first.points[0][1], h];
        radialWires(run.id, first.points[0], run.groundStart, wires, parts);
      } else {
        first.groundConnection =
          run.groundStart.kind === "radials" ? "ideal" : tieConnection(run.groundStart);
      }
    }
    if (run.feed) {
      const spot = locate(ids, lengths, run.feed.at);
      if (run === active) feed = spot;
      else loads.push({ ...spot, ohms: referenceOhmsOf(run.feed.system) });
    }
    for (const l of run.loads ?? []) {
      const load: LoadInput = { ...locate(ids, lengths, l.at) };
      if (l.ohms !== undefined) load.ohms = l.ohms;
      if (l.henries !== undefined) load.henries = l.henries;
      if (l.farads !== undefined) load.farads = l.farads;
      if (l.arrangement !== undefined) load.arrangement = l.arrangement;
      loads.push(load);
    }
  });

  for (const s of plan.supports) {
    if (isConductiveMast(s)) mastWires(plan, s, bondsByMast.get(s.id) ?? [], wires, parts);
  }

  const wireElement: Record<string, WireElementRef> = {};
  const elementWires: Record<string, string[]> = {};
  for (const w of wires) {
    const first = parts.find((p) => p.wire === w.id)!;
    // A run's wire points at the run (its droop parts point at the droops through `parts`).
    const ref: WireElementRef =
      first.kind === "droop" || first.kind === "span"
        ? { elementId: plan.wireRuns.find((r) => runPieces.get(r.id)?.ids.includes(w.id))!.id, kind: "run" }
        : { elementId: first.elementId, kind: first.kind, ...(first.part ? { part: first.part } : {}) };
    wireElement[w.id] = ref;
  }
  for (const p of parts) {
    for (const id of new Set([p.elementId, wireElement[p.wire].elementId])) {
      if (!elementWires[id]) elementWires[id] = [];
      if (!elementWires[id].includes(p.wire)) elementWires[id].push(p.wire);
    }
  }

  const frequenciesMHz =
    options.frequenciesMHz ?? plan.bands.map((b) => bandCentre(bandEdges(b, plan.ituRegion)));
  const model: WireModel = {
    wires,
    feed: feed!,
    ground: planGround(plan),
    frequenciesMHz,
    referenceOhms: referenceOhmsOf(active.feed!.system),
  };
  if (loads.length) model.loads = loads;

  const freeEnds = findFreeEnds(wires, parts);
  warnings.push(...compileWarnings(plan, { model, parts, freeEnds, activeRunId: active.id }));
  return {
    model,
    wireElement,
    elementWires,
    parts,
    activeRunId: active.id,
    referenceOhms: model.referenceOhms!,
    freeEnds,
    warnings,
  };
}

/** Wire ends that touch no other wire end and not the ground: the current is zero there, the voltage high. */
function findFreeEnds(wires: WireInput[], parts: WirePart[]): CompiledPlan["freeEnds"] {
  const ends = wires.flatMap((w) => [
    { wire: w.id, end: "start" as const, point: w.points[0] },
    { wire: w.id, end: "end" as const, point: w.points[w.points.length - 1] },
  ]);
  return (
    ends
      // Plans always have a ground: an end on z = 0 is tied to it.
      .filter((e) => Math.abs(e.point[2]) >= 1e-6)
      .filter((e) => !ends.some((o) => o !== e && distance3(o.point as Point3, e.point as Point3) < 1e-6))
      .map((e) => ({
        ...e,
        point: [...e.point] as Vec3,
        elementId: elementAt(parts, e.wire, e.end === "start" ? 0 : Number.POSITIVE_INFINITY) ?? e.wire,
      }))
  );
}
