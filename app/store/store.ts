import { createStore, type StoreApi } from "zustand/vanilla";
import type { Plan } from "../../solver/plan/schema";
import { type AnalysisSlice, createAnalysisSlice } from "./analysis-slice";
import { createPlanSlice, type PlanSlice } from "./plan-slice";
import { createSelectionSlice, type SelectionSlice } from "./selection-slice";

/** The whole app state: slices spread into one vanilla store (usable without React, as the tests do). */
export type AppState = PlanSlice & SelectionSlice & AnalysisSlice;
export type AppStore = StoreApi<AppState>;

export function createAppStore(initial: Plan): AppStore {
  return createStore<AppState>()((...a) => ({
    ...createPlanSlice(initial)(...a),
    ...createSelectionSlice(...a),
    ...createAnalysisSlice(...a),
  }));
}
