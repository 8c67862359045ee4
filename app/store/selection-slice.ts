import type { StateCreator } from "zustand/vanilla";
import type { AnchorTarget, NewSupportKind } from "../plan/commands";
import type { AppState } from "./store";

/** What the pointer does in the yard. Each tool is a small state machine driven by the scene. */
export type Tool =
  | { kind: "select" }
  | { kind: "add-support"; support: NewSupportKind }
  /** Click supports (or the ground for a free point) one after another; Enter or a double click ends. */
  | { kind: "add-wire"; targets: AnchorTarget[] }
  /** Click a wire run to put the feed there. */
  | { kind: "place-feed" };

export type CameraView = "orbit" | "top" | "side";

/** Selection, hover, tool and view: never in undo history, never saved with the plan. */
export interface SelectionSlice {
  selectedId: string | null;
  hoverId: string | null;
  tool: Tool;
  /** Bumped to ask the camera for a view; the nonce lets the same view be asked for twice. */
  cameraRequest: { view: CameraView; nonce: number };
  showLobe: boolean;
  showCurrents: boolean;
  /** Snap step for dragging, metres (null: off). */
  snapStep: number | null;
  /** A transient message for the status line (refused delete, bad file...). */
  notice: { text: string; tone: "info" | "error"; nonce: number } | null;
  select: (id: string | null) => void;
  hover: (id: string | null) => void;
  setTool: (tool: Tool) => void;
  requestView: (view: CameraView) => void;
  toggleLobe: () => void;
  toggleCurrents: () => void;
  setSnap: (step: number | null) => void;
  notify: (text: string, tone?: "info" | "error") => void;
}

export const createSelectionSlice: StateCreator<AppState, [], [], SelectionSlice> = (set, get) => ({
  selectedId: null,
  hoverId: null,
  tool: { kind: "select" },
  cameraRequest: { view: "orbit", nonce: 0 },
  showLobe: false,
  showCurrents: true,
  snapStep: 0.5,
  notice: null,
  select: (id) => {
    if (get().selectedId !== id) set({ selectedId: id });
  },
  hover: (id) => {
    if (get().hoverId !== id) set({ hoverId: id });
  },
  setTool: (tool) => set({ tool }),
  requestView: (view) => set({ cameraRequest: { view, nonce: get().cameraRequest.nonce + 1 } }),
  toggleLobe: () => set({ showLobe: !get().showLobe }),
  toggleCurrents: () => set({ showCurrents: !get().showCurrents }),
  setSnap: (snapStep) => set({ snapStep }),
  notify: (text, tone = "info") => set({ notice: { text, tone, nonce: (get().notice?.nonce ?? 0) + 1 } }),
});
