import { useFrame, useThree } from "@react-three/fiber";
import { useLayoutEffect, useRef, useState } from "react";
import * as THREE from "three";
import type { Point3 } from "../../solver/plan/schema";

/**
 * A text label pinned to a point of the yard, drawn as a plain DOM element over the canvas and styled
 * by the `.label` classes.
 *
 * Why not drei's `<Html>`: it mounts a nested React root per label and unmounts it synchronously in a
 * layout-effect cleanup, which React's dev build reports ("Attempted to synchronously unmount a root
 * while React was already rendering") whenever StrictMode replays effects or a label remounts; it also
 * re-renders that nested root on every render of its parent, i.e. on every drag step and result. A
 * label here is text only, so a div whose `textContent` we set is enough: no root, nothing to unmount
 * but a DOM node, and the text is written only when it changes.
 */
interface Props {
  /** In the parent group's frame. */
  position?: Point3;
  text: string;
  className: string;
  /** Centre the label on the point (otherwise its top-left corner sits there). */
  center?: boolean;
  /** A CSS transform for the label box, replacing the centring (e.g. "translate(0, 20px)"). */
  offset?: string;
}

const world = new THREE.Vector3();
const toObject = new THREE.Vector3();
const lookDir = new THREE.Vector3();
// Nearer labels above farther ones, within this z-index band (below the panels' overlays).
const Z_TOP = 10;

export function YardLabel({ position = [0, 0, 0], text, className, center = false, offset }: Props) {
  const group = useRef<THREE.Group>(null);
  const { gl, events, invalidate } = useThree();
  const [outer] = useState(() => {
    const el = document.createElement("div");
    el.style.cssText = "position:absolute;top:0;left:0;transform-origin:0 0;pointer-events:none;";
    el.appendChild(document.createElement("div"));
    return el;
  });
  const inner = outer.firstChild as HTMLDivElement;
  const last = useRef({ x: Number.NaN, y: Number.NaN, z: -1, shown: true });
  const target = (events.connected as HTMLElement | undefined) ?? gl.domElement.parentElement;

  useLayoutEffect(() => {
    if (!target) return;
    target.appendChild(outer);
    // Place it on the next frame (a demand-driven canvas may not draw one by itself).
    last.current.x = Number.NaN;
    invalidate();
    return () => outer.remove();
  }, [target, outer, invalidate]);

  useLayoutEffect(() => {
    if (inner.className !== className) inner.className = className;
    if (inner.textContent !== text) inner.textContent = text;
    inner.style.position = "absolute";
    inner.style.transform = offset ?? (center ? "translate(-50%, -50%)" : "");
  }, [inner, className, text, center, offset]);

  useFrame(({ camera, size }) => {
    const g = group.current;
    if (!g) return;
    g.getWorldPosition(world);
    camera.getWorldDirection(lookDir);
    toObject.subVectors(world, camera.position);
    const shown = toObject.dot(lookDir) > 0;
    const l = last.current;
    if (shown !== l.shown) {
      outer.style.display = shown ? "" : "none";
      l.shown = shown;
    }
    if (!shown) return;
    const dist = toObject.length();
    world.project(camera);
    const x = Math.round((world.x * 0.5 + 0.5) * size.width);
    const y = Math.round((0.5 - world.y * 0.5) * size.height);
    if (x !== l.x || y !== l.y) {
      outer.style.transform = `translate3d(${x}px,${y}px,0)`;
      l.x = x;
      l.y = y;
    }
    const far = (camera as THREE.PerspectiveCamera).far || 1000;
    const z = Math.max(0, Math.round(Z_TOP * (1 - dist / far)));
    if (z !== l.z) {
      outer.style.zIndex = String(z);
      l.z = z;
    }
  });

  return <group ref={group} position={position} />;
}
