import { describe, expect, it } from "vitest";
import * as cmd from "../../../app/plan/commands";
import { findElement } from "../../../app/plan/elements";
import { freshness } from "../../../app/store/analysis-slice";
import { HISTORY_LIMIT } from "../../../app/store/history";
import { createAppStore } from "../../../app/store/store";
import type { PlanAnalysis } from "../../../solver/plan/analysis-types";
import { parsePlan } from "../../../solver/plan/schema";
import { fixturePlan } from "./fixture";

const oakX = (s: ReturnType<typeof createAppStore>) => {
  const oak = s.getState().plan.supports.find((x) => x.id === "oak");
  return oak && oak.type === "tree" ? oak.position[0] : Number.NaN;
};

describe("the plan slice: edits, gestures and undo", () => {
  it("records one undo step per immediate edit, and undo/redo walk it", () => {
    const store = createAppStore(fixturePlan());
    const s = store.getState();
    s.applyEdit((p) => cmd.setSupportHeight(p, "oak", 12), "immediately");
    s.applyEdit((p) => cmd.setSupportHeight(p, "oak", 13), "immediately");
    expect(store.getState().history.past).toHaveLength(2);
    const height = () => findElement(store.getState().plan, "a-oak");
    expect(height()).toMatchObject({ anchor: { height: 13 } });
    store.getState().undo();
    expect(height()).toMatchObject({ anchor: { height: 12 } });
    store.getState().undo();
    expect(height()).toMatchObject({ anchor: { height: 10 } });
    store.getState().redo();
    expect(height()).toMatchObject({ anchor: { height: 12 } });
  });

  it("squashes a drag into one step computed from the mark, and Escape bails back to it", () => {
    const store = createAppStore(fixturePlan());
    const before = store.getState().plan;
    const drag = (dx: number) =>
      store.getState().updateGesture((origin) => cmd.moveSupport(origin, "oak", [-8 + dx, 0]));
    store.getState().beginGesture();
    drag(1);
    drag(2);
    drag(3);
    expect(oakX(store)).toBe(-5);
    store.getState().commitGesture();
    expect(store.getState().history.past).toHaveLength(1);
    store.getState().undo();
    expect(store.getState().plan).toBe(before);

    store.getState().beginGesture();
    drag(4);
    store.getState().cancelGesture();
    expect(store.getState().plan).toBe(before);
    expect(store.getState().history.past).toHaveLength(0);
  });

  it("keeps every revision distinct, so results can be matched to the plan they came from", () => {
    const store = createAppStore(fixturePlan());
    const seen = new Set([store.getState().revision]);
    store.getState().applyEdit((p) => cmd.setSupportHeight(p, "oak", 11), "immediately");
    seen.add(store.getState().revision);
    store.getState().undo();
    seen.add(store.getState().revision);
    store.getState().redo();
    seen.add(store.getState().revision);
    expect(seen.size).toBe(4);
  });

  it("records nothing for an edit that changes nothing, or for 'never'", () => {
    const store = createAppStore(fixturePlan());
    store.getState().applyEdit((p) => cmd.setSupportHeight(p, "oak", 10), "immediately");
    store.getState().applyEdit((p) => cmd.setSupportHeight(p, "oak", 11), "never");
    expect(store.getState().history.past).toHaveLength(0);
  });

  it("keeps selection, hover, view and results out of the history", () => {
    const store = createAppStore(fixturePlan());
    store.getState().applyEdit((p) => cmd.setSupportHeight(p, "oak", 11), "immediately");
    store.getState().select("oak");
    store.getState().hover("birch");
    store.getState().requestView("top");
    store.getState().toggleLobe();
    store.getState().deliverResult(store.getState().revision, "full", {} as PlanAnalysis, 5);
    expect(store.getState().history.past).toHaveLength(1);
    store.getState().undo();
    // Undo changed the plan only: the selection and the (now stale) result are untouched.
    expect(store.getState().selectedId).toBe("oak");
    expect(store.getState().showLobe).toBe(true);
    expect(freshness(store.getState())).toBe("stale");
  });

  it("drops the oldest steps beyond the history limit", () => {
    const store = createAppStore(fixturePlan());
    for (let i = 0; i < HISTORY_LIMIT + 5; i++) {
      store.getState().applyEdit((p) => cmd.setSupportHeight(p, "oak", 5 + (i % 2)), "immediately");
    }
    expect(store.getState().history.past).toHaveLength(HISTORY_LIMIT);
  });
});

describe("editing commands keep the plan valid", () => {
  const valid = (p: unknown) => expect(() => parsePlan(JSON.parse(JSON.stringify(p)))).not.toThrow();

  it("raising a tree carries the wire at its top along; lowering clamps anchors above it", () => {
    const p = cmd.setSupportHeight(fixturePlan(), "oak", 12);
    expect(findElement(p, "a-oak")).toMatchObject({ anchor: { height: 12 } });
    const low = cmd.setSupportHeight(p, "birch", 7);
    expect(findElement(low, "a-birch")).toMatchObject({ anchor: { height: 7 } });
    valid(low);
  });

  it("moving a building carries its roof anchors", () => {
    const base = cmd.addWireRun(fixturePlan(), [{ support: "shed" }, { support: "pole" }])!;
    const moved = cmd.moveSupport(base.plan, "shed", [10, -4.5]);
    const run = moved.wireRuns.find((r) => r.id === base.id)!;
    const roof = run.anchors[0];
    expect(roof.kind).toBe("roof");
    if (roof.kind === "roof") expect(roof.at).toEqual([10, -4.5]);
    valid(moved);
  });

  it("deleting a support leaves its wires hanging where they were, as free points", () => {
    const p = cmd.deleteElement(fixturePlan(), "birch").plan;
    expect(p.supports.some((s) => s.id === "birch")).toBe(false);
    expect(findElement(p, "a-birch")).toMatchObject({ anchor: { kind: "free", position: [8, 0, 9] } });
    valid(p);
  });

  it("refuses to delete the last run or the last anchor pair, and says why", () => {
    const r = cmd.deleteElement(fixturePlan(), "dipole");
    expect(r.refused).toMatch(/at least one wire run/);
    expect(cmd.deleteElement(fixturePlan(), "a-oak").refused).toMatch(/two anchors/);
  });

  it("duplicates with fresh ids, offset, and an unfed copy of a run", () => {
    const d = cmd.duplicateElement(fixturePlan(), "pole")!;
    expect(d.id).not.toBe("pole");
    valid(d.plan);
    const r = cmd.duplicateElement(d.plan, "dipole")!;
    const copy = r.plan.wireRuns.find((x) => x.id === r.id)!;
    expect(copy.feed).toBeUndefined();
    valid(r.plan);
  });

  it("adds supports, a run between them, a droop and the feed; the plan still parses", () => {
    let p = fixturePlan();
    const a = cmd.addSupport(p, "wood-pole", [-10, 8]);
    const b = cmd.addSupport(a.plan, "metal-mast", [10, 8]);
    const run = cmd.addWireRun(b.plan, [{ support: a.id }, { support: b.id }])!;
    const droop = cmd.setDroop(run.plan, run.id, "start", 2)!;
    p = cmd.setFeed(droop.plan, run.id, 0.5);
    expect(p.analysis?.activeRun).toBe(run.id);
    valid(p);
  });

  it("snaps to the step it is given, and not at all without one", () => {
    expect(cmd.snap(1.26, 0.5)).toBe(1.5);
    expect(cmd.snap(1.26, null)).toBe(1.26);
  });
});
