import type { ThreeEvent } from "@react-three/fiber";
import { useThree } from "@react-three/fiber";
import { useCallback } from "react";
import * as THREE from "three";
import type { Plan, Point2 } from "../../solver/plan/schema";
import { moveFreeAnchor, moveSupport, setAnchorHeight, setSupportHeight, snap } from "../plan/commands";
import { useAppStore } from "../store/react";
import { pickTarget } from "../tools";

/**
 * Dragging in the yard, as a small state machine: Idle → (pointer down on a handle) Dragging → commit on
 * pointer up, or bail back to the mark on Escape. Each move recomputes the plan from the gesture's origin
 * (the mark), so a whole drag is one undo step and rounding never accumulates.
 */
export type DragMode =
  | { kind: "move-support"; id: string; grab: Point2 }
  | { kind: "support-height"; id: string; base: Point2 }
  | { kind: "move-anchor"; id: string }
  | { kind: "anchor-height"; id: string; base: Point2 };

const GROUND = new THREE.Plane(new THREE.Vector3(0, 0, 1), 0);

export function useDrag() {
  const store = useAppStore();
  const { camera, gl, controls, invalidate } = useThree();
  return useCallback(
    (e: ThreeEvent<PointerEvent>, mode: DragMode, centre: Point2) => {
      if (e.button !== 0) return;
      const s = store.getState();
      // The feed tool wants the wire: let the click pass through trees and roofs in front of it.
      if (s.tool.kind === "place-feed") return;
      e.stopPropagation();
      if (s.tool.kind === "add-wire" && (mode.kind === "move-support" || mode.kind === "support-height")) {
        pickTarget(store, { support: mode.id }, e.nativeEvent.shiftKey);
        return;
      }
      if (s.tool.kind !== "select") return;
      s.select(mode.id);
      s.beginGesture();
      const orbit = controls as unknown as { enabled: boolean } | null;
      if (orbit) orbit.enabled = false;
      const el = gl.domElement;
      const raycaster = new THREE.Raycaster();
      const ndc = new THREE.Vector2();
      const hit = new THREE.Vector3();
      const vertical = new THREE.Plane();
      const offset: Point2 =
        mode.kind === "move-support" ? [centre[0] - mode.grab[0], centre[1] - mode.grab[1]] : [0, 0];

      const rayAt = (ev: PointerEvent) => {
        const r = el.getBoundingClientRect();
        ndc.set(((ev.clientX - r.left) / r.width) * 2 - 1, -((ev.clientY - r.top) / r.height) * 2 + 1);
        raycaster.setFromCamera(ndc, camera);
        return raycaster.ray;
      };
      const onMove = (ev: PointerEvent) => {
        const ray = rayAt(ev);
        const step = store.getState().snapStep;
        let recipe: ((origin: Plan) => Plan) | null = null;
        if (mode.kind === "move-support" || mode.kind === "move-anchor") {
          if (!ray.intersectPlane(GROUND, hit)) return;
          const to: Point2 = [snap(hit.x + offset[0], step), snap(hit.y + offset[1], step)];
          recipe =
            mode.kind === "move-support"
              ? (origin) => moveSupport(origin, mode.id, to)
              : (origin) => moveFreeAnchor(origin, mode.id, to);
        } else {
          // A vertical plane through the handle, facing the camera: the pointer's height on it.
          const n = new THREE.Vector3().subVectors(
            camera.position,
            new THREE.Vector3(mode.base[0], mode.base[1], 0),
          );
          n.z = 0;
          if (n.lengthSq() < 1e-9) return;
          n.normalize();
          vertical.setFromNormalAndCoplanarPoint(n, new THREE.Vector3(mode.base[0], mode.base[1], 0));
          if (!ray.intersectPlane(vertical, hit)) return;
          const h = Math.max(0.5, snap(hit.z, step ? Math.min(step, 0.25) : null));
          recipe =
            mode.kind === "support-height"
              ? (origin) => setSupportHeight(origin, mode.id, h)
              : (origin) => setAnchorHeight(origin, mode.id, h);
        }
        store.getState().updateGesture(recipe);
        invalidate();
      };
      const finish = (commit: boolean) => {
        el.removeEventListener("pointermove", onMove);
        el.removeEventListener("pointerup", onUp);
        window.removeEventListener("keydown", onKey, true);
        if (orbit) orbit.enabled = true;
        if (commit) store.getState().commitGesture();
        else store.getState().cancelGesture();
        invalidate();
      };
      const onUp = () => finish(true);
      const onKey = (ev: KeyboardEvent) => {
        if (ev.key === "Escape") {
          ev.preventDefault();
          ev.stopPropagation();
          finish(false);
        }
      };
      el.setPointerCapture?.(e.pointerId);
      el.addEventListener("pointermove", onMove);
      el.addEventListener("pointerup", onUp);
      window.addEventListener("keydown", onKey, true);
    },
    [store, camera, gl, controls, invalidate],
  );
}
