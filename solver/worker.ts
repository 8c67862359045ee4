import * as Comlink from "comlink";
import type { PlanAnalysis } from "./plan/analysis-types";
import { analyzePlan } from "./plan/analyze";

/**
 * The Web Worker door: exposes the plan analysis through comlink and nothing else. Errors are turned
 * into data here, because comlink's error transport keeps only the message and the app needs the
 * element a bad plan points at.
 */
export type WorkerOutcome =
  | { ok: true; analysis: PlanAnalysis }
  | { ok: false; message: string; path?: string; elementId?: string };

const api = {
  analyzePlan(plan: Parameters<typeof analyzePlan>[0], options: { quick: boolean }): WorkerOutcome {
    try {
      return { ok: true, analysis: analyzePlan(plan, options) };
    } catch (e) {
      const err = e as Error & { path?: string; elementId?: string };
      return {
        ok: false,
        message: err?.message ?? String(e),
        ...(err?.path ? { path: err.path } : {}),
        ...(err?.elementId ? { elementId: err.elementId } : {}),
      };
    }
  },
};

export type AnalysisWorkerApi = typeof api;

Comlink.expose(api);
