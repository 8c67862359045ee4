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
  /**
   * Where labels overlap on screen, the lower priority one is hidden (see LabelDeclutter).
   * SAFETY and above is never hidden for a lesser label.
   */
  priority?: number;
}

/** Labels that must stay readable: the high-voltage warnings. */
export const SAFETY = 3;
/** The feed: above the other labels, but it gives way to a warning (its teal marker stays). */
export const FEED = 2.5;

/** One label as the declutter pass sees it: its screen box, measured once per text. */
interface Entry {
  outer: HTMLDivElement;
  inner: HTMLDivElement;
  priority: number;
  shown: boolean;
  x: number;
  y: number;
  z: number;
  /** The box relative to the anchor point, or null until measured for the current text. */
  box: { dx: number; dy: number; w: number; h: number } | null;
  hidden: boolean;
}

// Per canvas (keyed by its renderer), so two canvases would not declutter against each other.
const registries = new WeakMap<object, Set<Entry>>();
function registry(gl: object): Set<Entry> {
  let r = registries.get(gl);
  if (!r) {
    r = new Set();
    registries.set(gl, r);
  }
  return r;
}

const world = new THREE.Vector3();
const toObject = new THREE.Vector3();
const lookDir = new THREE.Vector3();
// Nearer labels above farther ones, within this z-index band (below the panels' overlays).
const Z_TOP = 10;

export function YardLabel({
  position = [0, 0, 0],
  text,
  className,
  center = false,
  offset,
  priority = 1,
}: Props) {
  const group = useRef<THREE.Group>(null);
  const { gl, events, invalidate } = useThree();
  const [outer] = useState(() => {
    const el = document.createElement("div");
    el.style.cssText = "position:absolute;top:0;left:0;transform-origin:0 0;pointer-events:none;";
    el.appendChild(document.createElement("div"));
    return el;
  });
  const inner = outer.firstChild as HTMLDivElement;
  const [entry] = useState<Entry>(() => ({
    outer,
    inner,
    priority,
    shown: true,
    x: Number.NaN,
    y: Number.NaN,
    z: -1,
    box: null,
    hidden: false,
  }));
  entry.priority = priority;
  const last = entry;
  const target = (events.connected as HTMLElement | undefined) ?? gl.domElement.parentElement;

  useLayoutEffect(() => {
    if (!target) return;
    target.appendChild(outer);
    const labels = registry(gl);
    labels.add(entry);
    // Place it on the next frame (a demand-driven canvas may not draw one by itself).
    entry.x = Number.NaN;
    invalidate();
    return () => {
      labels.delete(entry);
      outer.remove();
    };
  }, [target, outer, invalidate, gl, entry]);

  useLayoutEffect(() => {
    if (inner.className !== className) inner.className = className;
    if (inner.textContent !== text) inner.textContent = text;
    inner.style.position = "absolute";
    inner.style.transform = offset ?? (center ? "translate(-50%, -50%)" : "");
    entry.box = null; // re-measure: the text or its placement changed
    invalidate();
  }, [inner, className, text, center, offset, entry, invalidate]);

  // Before the declutter pass (-1), which runs before the render (0).
  useFrame(({ camera, size }) => {
    const g = group.current;
    if (!g) return;
    g.getWorldPosition(world);
    camera.getWorldDirection(lookDir);
    toObject.subVectors(world, camera.position);
    const shown = toObject.dot(lookDir) > 0;
    const l = last;
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
  }, -2);

  return <group ref={group} position={position} />;
}

const MARGIN = 0; // px around each box; labels that merely touch are both kept

/**
 * Hides labels that would overlap a more important (or, at equal importance, a nearer) one, every
 * frame, after the labels have been placed. Sizes are measured once per text, so a frame costs a few
 * comparisons, not a layout.
 */
export function LabelDeclutter() {
  const { gl } = useThree();
  useFrame(() => {
    const labels = [...registry(gl)].filter((e) => e.shown && Number.isFinite(e.x));
    for (const e of labels) {
      if (e.box) continue;
      const o = e.outer.getBoundingClientRect();
      const r = e.inner.getBoundingClientRect();
      e.box = { dx: r.left - o.left, dy: r.top - o.top, w: r.width, h: r.height };
    }
    labels.sort((a, b) => b.priority - a.priority || b.z - a.z);
    const placed: { e: Entry; l: number; t: number; r: number; b: number }[] = [];
    for (const e of labels) {
      const bx = e.box;
      if (!bx) continue;
      const l = e.x + bx.dx - MARGIN;
      const t = e.y + bx.dy - MARGIN;
      const r = l + bx.w + 2 * MARGIN;
      const b = t + bx.h + 2 * MARGIN;
      const clash = placed.find(
        (p) =>
          l < p.r &&
          r > p.l &&
          t < p.b &&
          b > p.t &&
          // A safety label gives way only to another like it (two warnings in one spot say it once).
          (e.priority < SAFETY || p.e.inner.textContent === e.inner.textContent),
      );
      const hide = clash !== undefined;
      if (hide !== e.hidden) {
        e.outer.style.visibility = hide ? "hidden" : "";
        e.hidden = hide;
      }
      if (!hide) placed.push({ e, l, t, r, b });
    }
  }, -1);
  return null;
}
