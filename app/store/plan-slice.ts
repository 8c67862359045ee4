import type { StateCreator } from "zustand/vanilla";
import type { Plan } from "../../solver/plan/schema";
import { emptyHistory, type History, record, redo, type UndoPolicy, undo } from "./history";
import type { AppState } from "./store";

/**
 * The document. `revision` counts every change of `plan` (drag steps included): the analysis is keyed
 * by it, so a result can always be matched to the plan it was computed from.
 */
export interface PlanSlice {
  plan: Plan;
  revision: number;
  history: History<Plan>;
  /** The plan as it was when the current gesture began (the mark); null when no gesture is open. */
  gestureOrigin: Plan | null;
  /** Apply an edit. "immediately" records one undo step, "never" none, "eventually" only inside a gesture. */
  applyEdit: (recipe: (plan: Plan) => Plan, policy: UndoPolicy) => void;
  /** Start a gesture (a drag): remember the mark. */
  beginGesture: () => void;
  /** Replace the plan with `recipe(origin)`: each step is computed from the mark, so steps squash. */
  updateGesture: (recipe: (origin: Plan) => Plan) => void;
  /** End the gesture: one undo step from the mark to here (none if nothing changed). */
  commitGesture: () => void;
  /** Escape: back to the mark, nothing recorded. */
  cancelGesture: () => void;
  undo: () => void;
  redo: () => void;
  /** Replace the whole plan (open a file, restore autosave). Opening a file is undoable ("immediately"). */
  replacePlan: (plan: Plan, policy: UndoPolicy) => void;
}

export const createPlanSlice =
  (initial: Plan): StateCreator<AppState, [], [], PlanSlice> =>
  (set, get) => ({
    plan: initial,
    revision: 0,
    history: emptyHistory(),
    gestureOrigin: null,

    applyEdit: (recipe, policy) => {
      const { plan, history, revision, gestureOrigin } = get();
      const next = recipe(plan);
      if (next === plan) return;
      const recordNow = policy === "immediately" && gestureOrigin === null;
      set({ plan: next, revision: revision + 1, history: recordNow ? record(history, plan) : history });
    },

    beginGesture: () => {
      if (get().gestureOrigin === null) set({ gestureOrigin: get().plan });
    },

    updateGesture: (recipe) => {
      const { gestureOrigin, plan, revision } = get();
      if (gestureOrigin === null) return;
      const next = recipe(gestureOrigin);
      if (next === plan) return;
      set({ plan: next, revision: revision + 1 });
    },

    commitGesture: () => {
      const { gestureOrigin, plan, history } = get();
      if (gestureOrigin === null) return;
      set({
        gestureOrigin: null,
        history: plan === gestureOrigin ? history : record(history, gestureOrigin),
      });
    },

    cancelGesture: () => {
      const { gestureOrigin, plan, revision } = get();
      if (gestureOrigin === null) return;
      set({
        gestureOrigin: null,
        ...(plan === gestureOrigin ? {} : { plan: gestureOrigin, revision: revision + 1 }),
      });
    },

    undo: () => {
      const s = get();
      if (s.gestureOrigin !== null) return s.cancelGesture();
      const step = undo(s.history, s.plan);
      if (step) set({ plan: step.doc, history: step.history, revision: s.revision + 1 });
    },

    redo: () => {
      const s = get();
      if (s.gestureOrigin !== null) return;
      const step = redo(s.history, s.plan);
      if (step) set({ plan: step.doc, history: step.history, revision: s.revision + 1 });
    },

    replacePlan: (plan, policy) => {
      const s = get();
      set({
        plan,
        revision: s.revision + 1,
        gestureOrigin: null,
        history: policy === "immediately" ? record(s.history, s.plan) : s.history,
      });
    },
  });
