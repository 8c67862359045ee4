import { Line } from "@react-three/drei";
import type { ThreeEvent } from "@react-three/fiber";
import { memo, useEffect, useMemo } from "react";
import * as THREE from "three";
import type { Plan, Point2 } from "../../solver/plan/schema";
import { formatLength, gridStepMetres, type LengthUnit } from "../units";
import { palette } from "./palette";
import { YardLabel } from "./YardLabel";

interface Props {
  /** The lot and the unit only: a drag elsewhere in the plan leaves both unchanged, so no re-render. */
  lot: Plan["lot"];
  unit: LengthUnit;
  onGroundPointer: (e: ThreeEvent<PointerEvent>) => void;
}

/** Bounding box of the lot with a margin, for the ground plane, the grid and the camera. */
export function lotBounds(outline: readonly Point2[]): {
  cx: number;
  cy: number;
  size: number;
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
} {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  return {
    cx: (minX + maxX) / 2,
    cy: (minY + maxY) / 2,
    size: Math.max(maxX - minX, maxY - minY, 10),
    minX,
    maxX,
    minY,
    maxY,
  };
}

function gridGeometry(b: ReturnType<typeof lotBounds>, step: number, margin: number): THREE.BufferGeometry {
  const x0 = Math.floor((b.minX - margin) / step) * step;
  const x1 = Math.ceil((b.maxX + margin) / step) * step;
  const y0 = Math.floor((b.minY - margin) / step) * step;
  const y1 = Math.ceil((b.maxY + margin) / step) * step;
  const v: number[] = [];
  for (let x = x0; x <= x1 + 1e-9; x += step) v.push(x, y0, 0, x, y1, 0);
  for (let y = y0; y <= y1 + 1e-9; y += step) v.push(x0, y, 0, x1, y, 0);
  const g = new THREE.BufferGeometry();
  g.setAttribute("position", new THREE.Float32BufferAttribute(v, 3));
  return g;
}

/** The ground: a plane, a grid in the user's unit, the lot outline and a north marker. */
export const Ground = memo(function Ground({ lot, unit, onGroundPointer }: Props) {
  const b = lotBounds(lot.outline);
  const step = gridStepMetres(unit);
  const outlineKey = lot.outline;
  // Rebuilt only when the lot or the unit changes, not on every edit elsewhere in the plan.
  const [minor, major] = useMemo(() => {
    const bounds = lotBounds(outlineKey);
    const m = bounds.size * 0.6;
    return [gridGeometry(bounds, step.minor, m), gridGeometry(bounds, step.major, m)];
  }, [outlineKey, step.minor, step.major]);
  // Geometries passed by prop are ours to free when the lot or the unit changes.
  useEffect(
    () => () => {
      minor.dispose();
      major.dispose();
    },
    [minor, major],
  );
  const outline = lot.outline.map((p) => [p[0], p[1], 0.02] as [number, number, number]);
  const north = (lot.northDeg * Math.PI) / 180;
  // North marker beyond the lot's top-right corner, pointing at true north.
  const nx = b.maxX + 3;
  const ny = b.maxY + 1;
  const dir: [number, number] = [Math.sin(north), Math.cos(north)];
  const arrowLen = 4;
  return (
    <group>
      <mesh position={[b.cx, b.cy, -0.01]} onPointerDown={onGroundPointer} name="ground">
        {/* Far wider than the grid, so the horizon is ground from any side. */}
        <planeGeometry args={[b.size * 30, b.size * 30]} />
        <meshLambertMaterial color={palette.ground} />
      </mesh>
      <lineSegments geometry={minor} position={[0, 0, 0.003]}>
        <lineBasicMaterial color={palette.gridMinor} />
      </lineSegments>
      <lineSegments geometry={major} position={[0, 0, 0.006]}>
        <lineBasicMaterial color={palette.gridMajor} />
      </lineSegments>
      <Line
        points={[...outline, outline[0]]}
        color={palette.lot}
        lineWidth={2}
        dashed
        dashSize={0.8}
        gapSize={0.4}
      />
      <group position={[nx, ny, 0.05]}>
        <Line
          points={[
            [-dir[0] * arrowLen * 0.5, -dir[1] * arrowLen * 0.5, 0],
            [dir[0] * arrowLen * 0.5, dir[1] * arrowLen * 0.5, 0],
          ]}
          color={palette.north}
          lineWidth={3}
        />
        <mesh position={[dir[0] * arrowLen * 0.5, dir[1] * arrowLen * 0.5, 0]} rotation={[0, 0, -north]}>
          <coneGeometry args={[0.8, 1.8, 3]} />
          <meshBasicMaterial color={palette.north} />
        </mesh>
        <YardLabel
          position={[dir[0] * (arrowLen * 0.5 + 1.3), dir[1] * (arrowLen * 0.5 + 1.3), 0]}
          center
          className="label label-north"
          priority={2}
          text="N"
        />
      </group>
      <YardLabel
        position={[b.minX, b.minY - 1.2, 0]}
        className="label label-muted"
        priority={0}
        text={`grid ${formatLength(step.minor, unit, 0)}, bold every ${formatLength(step.major, unit, 0)}`}
      />
    </group>
  );
});
