import { Line } from "@react-three/drei";
import { memo, useMemo } from "react";
import * as THREE from "three";
import type { KeepOut, Plan, Point2, Walkway } from "../../solver/plan/schema";
import { useApp, useAppStore } from "../store/react";
import { palette } from "./palette";

/** A flat strip along a polyline, `width` wide, just above the ground. */
function stripGeometry(path: readonly Point2[], width: number): THREE.BufferGeometry {
  const v: number[] = [];
  for (let i = 1; i < path.length; i++) {
    const [ax, ay] = path[i - 1];
    const [bx, by] = path[i];
    const l = Math.hypot(bx - ax, by - ay) || 1;
    const nx = (-(by - ay) / l) * (width / 2);
    const ny = ((bx - ax) / l) * (width / 2);
    const z = 0.015;
    v.push(
      ax + nx,
      ay + ny,
      z,
      ax - nx,
      ay - ny,
      z,
      bx - nx,
      by - ny,
      z,
      ax + nx,
      ay + ny,
      z,
      bx - nx,
      by - ny,
      z,
      bx + nx,
      by + ny,
      z,
    );
  }
  const g = new THREE.BufferGeometry();
  g.setAttribute("position", new THREE.Float32BufferAttribute(v, 3));
  g.computeVertexNormals();
  return g;
}

function polygonGeometry(outline: readonly Point2[]): THREE.BufferGeometry {
  const shape = new THREE.Shape(outline.map(([x, y]) => new THREE.Vector2(x, y)));
  const g = new THREE.ShapeGeometry(shape);
  g.translate(0, 0, 0.02);
  return g;
}

function WalkwayItem({ w, selected }: { w: Walkway; selected: boolean }) {
  const geo = useMemo(() => stripGeometry(w.path, w.width), [w.path, w.width]);
  const store = useAppStore();
  return (
    <mesh
      geometry={geo}
      onPointerDown={(e) => {
        if (store.getState().tool.kind !== "select") return;
        e.stopPropagation();
        store.getState().select(w.id);
      }}
    >
      <meshLambertMaterial color={selected ? palette.hover : palette.walkway} side={THREE.DoubleSide} />
    </mesh>
  );
}

function KeepOutItem({ k, selected }: { k: KeepOut; selected: boolean }) {
  const geo = useMemo(() => polygonGeometry(k.outline), [k.outline]);
  const store = useAppStore();
  const outline = [...k.outline, k.outline[0]].map(([x, y]) => [x, y, 0.03] as [number, number, number]);
  return (
    <group>
      <mesh
        geometry={geo}
        onPointerDown={(e) => {
          if (store.getState().tool.kind !== "select") return;
          e.stopPropagation();
          store.getState().select(k.id);
        }}
      >
        <meshBasicMaterial
          color={palette.keepOut}
          transparent
          opacity={selected ? 0.4 : 0.22}
          side={THREE.DoubleSide}
          depthWrite={false}
        />
      </mesh>
      <Line points={outline} color={palette.keepOut} lineWidth={2} dashed dashSize={0.4} gapSize={0.25} />
    </group>
  );
}

/** Walkways, keep-out areas and overhead power lines (drawn with a warning stripe). */
// Memoised on the plan: a result arriving re-renders the scene around it, not this.
export const Hazards = memo(function Hazards({ plan }: { plan: Plan }) {
  const selectedId = useApp((s) => s.selectedId);
  return (
    <group>
      {plan.walkways.map((w) => (
        <WalkwayItem key={w.id} w={w} selected={w.id === selectedId} />
      ))}
      {plan.keepOuts.map((k) => (
        <KeepOutItem key={k.id} k={k} selected={k.id === selectedId} />
      ))}
      {plan.powerLines.map((p) => (
        <group key={p.id}>
          <Line points={p.points} color={palette.powerLine} lineWidth={3} />
          <Line
            points={p.points}
            color={palette.powerLineWarn}
            lineWidth={1.5}
            dashed
            dashSize={0.6}
            gapSize={0.6}
          />
          {p.points.map((q) => (
            <mesh key={q.join()} position={[q[0], q[1], q[2] / 2]} rotation={[Math.PI / 2, 0, 0]}>
              <cylinderGeometry args={[0.12, 0.14, q[2], 8]} />
              <meshLambertMaterial color="#6b5a45" />
            </mesh>
          ))}
        </group>
      ))}
    </group>
  );
});
