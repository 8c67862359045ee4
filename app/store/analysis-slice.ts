import type { StateCreator } from "zustand/vanilla";
import type { PlanAnalysis } from "../../solver/plan/analysis-types";
import type { PassKind } from "../analysis/scheduler";
import type { AppState } from "./store";

/** Why a plan could not be analysed, pointing at the element when the solver knows which. */
export interface AnalysisFailure {
  message: string;
  path?: string;
  elementId?: string;
}

/** Results live outside the plan and outside undo: they are a function of a plan revision. */
export interface AnalysisSlice {
  /** The newest result delivered, with the revision and pass that produced it. */
  result: { revision: number; kind: PassKind; analysis: PlanAnalysis; elapsedMs: number } | null;
  /** The newest failure, if it is newer than the result. */
  failure: { revision: number; kind: PassKind; failure: AnalysisFailure } | null;
  /** The worker is computing (which revision, which pass). */
  running: { revision: number; kind: PassKind } | null;
  setRunning: (running: { revision: number; kind: PassKind } | null) => void;
  deliverResult: (revision: number, kind: PassKind, analysis: PlanAnalysis, elapsedMs: number) => void;
  deliverFailure: (revision: number, kind: PassKind, failure: AnalysisFailure) => void;
}

export const createAnalysisSlice: StateCreator<AppState, [], [], AnalysisSlice> = (set) => ({
  result: null,
  failure: null,
  running: null,
  setRunning: (running) => set({ running }),
  deliverResult: (revision, kind, analysis, elapsedMs) =>
    set((s) => ({
      result: { revision, kind, analysis, elapsedMs },
      failure: s.failure && s.failure.revision > revision ? s.failure : null,
    })),
  deliverFailure: (revision, kind, failure) => set({ failure: { revision, kind, failure } }),
});

export type ResultFreshness = "none" | "current" | "quick" | "stale" | "failed";

/** How the panel should describe what it shows. */
export function freshness(s: Pick<AppState, "result" | "failure" | "revision">): ResultFreshness {
  if (s.failure && s.failure.revision === s.revision) return "failed";
  if (!s.result) return "none";
  if (s.result.revision !== s.revision) return "stale";
  return s.result.kind === "quick" ? "quick" : "current";
}
