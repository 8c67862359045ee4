import { describe, expect, it } from "vitest";
import { moveSupport } from "../../../app/plan/commands";
import { freshness } from "../../../app/store/analysis-slice";
import { createAppStore } from "../../../app/store/store";
import { type AnalysisApi, connectAnalysis } from "../../../app/worker-client";
import type { PlanAnalysis } from "../../../solver/plan/analysis-types";
import type { Plan } from "../../../solver/plan/schema";
import type { WorkerOutcome } from "../../../solver/worker";
import { fixturePlan } from "./fixture";

/** A fake worker API: records each call and lets the test answer it. The "analysis" names its plan. */
function fakeApi() {
  const calls: { plan: Plan; quick: boolean; answer: (o?: Partial<WorkerOutcome>) => void }[] = [];
  const api: AnalysisApi = {
    analyzePlan: (plan, { quick }) =>
      new Promise<WorkerOutcome>((resolve) => {
        calls.push({
          plan,
          quick,
          answer: (o) =>
            resolve({
              ok: true,
              analysis: { quick, tag: plan } as unknown as PlanAnalysis,
              ...o,
            } as WorkerOutcome),
        });
      }),
  };
  return { api, calls };
}
const flush = () => new Promise((r) => setTimeout(r, 0));
const oakAt = (x: number) => (p: Plan) => moveSupport(p, "oak", [x, 0]);

describe("the store and the analysis worker, wired together", () => {
  it("asks for quick passes while dragging and the full sweep on release; shows only newer results", async () => {
    const store = createAppStore(fixturePlan());
    const { api, calls } = fakeApi();
    connectAnalysis(store, api);
    // Opening: quick, then full.
    calls[0].answer();
    await flush();
    calls[1].answer();
    await flush();
    expect(calls.map((c) => c.quick)).toEqual([true, false]);
    expect(freshness(store.getState())).toBe("current");

    const s = store.getState();
    s.beginGesture();
    s.updateGesture(oakAt(-7));
    s.updateGesture(oakAt(-6));
    s.updateGesture(oakAt(-5));
    // One quick pass started at -7; -6 was overtaken before it could start and is never sent.
    expect(calls).toHaveLength(3);
    expect(calls[2].quick).toBe(true);
    calls[2].answer();
    await flush();
    expect(freshness(store.getState())).toBe("stale"); // the answer is for -7, the plan is at -5
    expect(calls).toHaveLength(4);
    expect(calls[3].quick).toBe(true);
    s.commitGesture();
    calls[3].answer();
    await flush();
    expect(freshness(store.getState())).toBe("quick");
    // Released: the full sweep of the final position follows.
    expect(calls).toHaveLength(5);
    expect(calls[4].quick).toBe(false);
    const final = store.getState().plan;
    expect(calls[4].plan).toBe(final);
    calls[4].answer();
    await flush();
    expect(freshness(store.getState())).toBe("current");
    const shown = store.getState().result!.analysis as unknown as { tag: Plan };
    expect(shown.tag).toBe(final);
  });

  it("reports a plan the solver refuses, pointing at the element, and recovers on the next edit", async () => {
    const store = createAppStore(fixturePlan());
    const { api, calls } = fakeApi();
    connectAnalysis(store, api);
    calls[0].answer({
      ok: false,
      message: 'anchor "a-oak": above the tree',
      elementId: "a-oak",
    } as Partial<WorkerOutcome>);
    await flush();
    expect(freshness(store.getState())).toBe("failed");
    expect(store.getState().failure?.failure.elementId).toBe("a-oak");
    store.getState().applyEdit(oakAt(-7), "immediately");
    await flush();
    const last = calls.at(-1)!;
    last.answer();
    await flush();
    expect(freshness(store.getState())).not.toBe("failed");
  });
});
