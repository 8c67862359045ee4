import * as Comlink from "comlink";
import type { Plan } from "../solver/plan/schema";
import type { AnalysisWorkerApi, WorkerOutcome } from "../solver/worker";
import { LatestWinsScheduler } from "./analysis/scheduler";
import type { AppStore } from "./store/store";

/** What the client needs of the worker: the one function it exposes. Tests pass a fake. */
export interface AnalysisApi {
  analyzePlan: (plan: Plan, options: { quick: boolean }) => Promise<WorkerOutcome>;
}

/** The real thing: one module worker running solver/worker.ts, reached through comlink. */
export function startWorker(): { api: AnalysisApi; stop: () => void } {
  const w = new Worker(new URL("../solver/worker.ts", import.meta.url), { type: "module", name: "analysis" });
  const remote = Comlink.wrap<AnalysisWorkerApi>(w);
  return {
    api: { analyzePlan: (plan, options) => remote.analyzePlan(plan, options) },
    stop: () => w.terminate(),
  };
}

/**
 * Connects the store to the analysis worker. Every plan revision asks for an analysis: during a drag a
 * quick pass only, otherwise quick then full. Results land in the analysis slice tagged with their
 * revision; the scheduler guarantees a stale one never replaces a newer one.
 */
export function connectAnalysis(
  store: AppStore,
  api: AnalysisApi,
  stop: () => void = () => undefined,
): () => void {
  const scheduler = new LatestWinsScheduler<Plan, WorkerOutcome>({
    run: (plan, kind) => api.analyzePlan(plan, { quick: kind === "quick" }),
    deliver: (d) => {
      const s = store.getState();
      if (!d.ok) {
        s.deliverFailure(d.revision, d.kind, { message: `The analysis failed: ${String(d.error)}` });
      } else if (d.result.ok) {
        s.deliverResult(d.revision, d.kind, d.result.analysis, d.elapsedMs);
      } else {
        const { message, path, elementId } = d.result;
        s.deliverFailure(d.revision, d.kind, { message, path, elementId });
      }
    },
    onBusy: (busy, job) =>
      store.getState().setRunning(busy && job ? { revision: job.revision, kind: job.kind } : null),
  });

  const ask = () => {
    const s = store.getState();
    scheduler.request(s.revision, s.plan, { interactive: s.gestureOrigin !== null });
  };
  const unsubscribe = store.subscribe((s, prev) => {
    const released = prev.gestureOrigin !== null && s.gestureOrigin === null;
    if (s.revision !== prev.revision || released) ask();
  });
  ask();
  return () => {
    unsubscribe();
    scheduler.dispose();
    stop();
  };
}
