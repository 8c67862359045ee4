import type { Point2 } from "../solver/plan/schema";
import { type AnchorTarget, addSupport, addWireRun, snap } from "./plan/commands";
import type { AppStore } from "./store/store";

/**
 * What a click in the yard means for the current tool. The wire tool collects targets: click a support
 * (or the ground, for a free point 2 m up), then the next; the run is made on the second click, or
 * with Shift held the tool keeps collecting until Enter.
 */
export function pickGround(store: AppStore, at: Point2, shift: boolean): void {
  const s = store.getState();
  const p: Point2 = [snap(at[0], s.snapStep), snap(at[1], s.snapStep)];
  if (s.tool.kind === "add-support") {
    const kind = s.tool.support;
    let id = "";
    s.applyEdit((plan) => {
      const r = addSupport(plan, kind, p);
      id = r.id;
      return r.plan;
    }, "immediately");
    s.setTool({ kind: "select" });
    s.select(id);
    return;
  }
  if (s.tool.kind === "add-wire") {
    pickTarget(store, { point: [p[0], p[1], 2] }, shift);
    return;
  }
  if (s.tool.kind === "select") s.select(null);
}

export function pickTarget(store: AppStore, target: AnchorTarget, shift: boolean): void {
  const s = store.getState();
  if (s.tool.kind !== "add-wire") return;
  const targets = [...s.tool.targets, target];
  if (targets.length >= 2 && !shift) finishWire(store, targets);
  else s.setTool({ kind: "add-wire", targets });
}

export function finishWire(store: AppStore, targets?: AnchorTarget[]): void {
  const s = store.getState();
  const list = targets ?? (s.tool.kind === "add-wire" ? s.tool.targets : []);
  if (list.length < 2) {
    s.notify("A wire run needs two anchors: click a second support or a point on the ground.");
    return;
  }
  let id = "";
  s.applyEdit((plan) => {
    const r = addWireRun(plan, list);
    if (!r) return plan;
    id = r.id;
    return r.plan;
  }, "immediately");
  s.setTool({ kind: "select" });
  if (id) {
    s.select(id);
    s.notify("Wire run added. Put the feed on it with “Place feed”, or add droops in the inspector.");
  }
}
