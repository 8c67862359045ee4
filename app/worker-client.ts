import * as Comlink from "comlink";
import type { Plan } from "../solver/plan/schema";
import type { AnalysisWorkerApi, WorkerOutcome } from "../solver/worker";
import { LatestWinsScheduler } from "./analysis/scheduler";
import type { AppStore } from "./store/store";

/**
 * Connects the store to the analysis worker. Every plan revision asks for an analysis: during a drag a
 * quick pass only, otherwise quick then full. Results land in the analysis slice tagged with their
 * revision; the scheduler guarantees a stale one never replaces a newer one.
 */
export function connectAnalysis(store: AppStore, worker?: Worker): () => void {
  const w =
    worker ??
    new Worker(new URL("../solver/worker.ts", import.meta.url), { type: "module", name: "analysis" });
  const api = Comlink.wrap<AnalysisWorkerApi>(w);
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
      window.dispatchEvent(
        new CustomEvent("analysis-delivered", { detail: { revision: d.revision, kind: d.kind } }),
      );
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
    w.terminate();
  };
}
