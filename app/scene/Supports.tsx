import { Line } from "@react-three/drei";
import type { ThreeEvent } from "@react-three/fiber";
import { memo, useMemo } from "react";
import * as THREE from "three";
import type { Building, Fence, Mast, Plan, Point2, Support, Tree } from "../../solver/plan/schema";
import { isMetalMast, supportCentre } from "../plan/elements";
import { roofHeightAt } from "../plan/geometry";
import { useApp } from "../store/react";
import { formatLength, type LengthUnit } from "../units";
import { type DragMode, useDrag } from "./interaction";
import { palette } from "./palette";
import { YardLabel } from "./YardLabel";

interface ItemProps<S extends Support> {
  s: S;
  unit: LengthUnit;
  selected: boolean;
  hovered: boolean;
  drag: ReturnType<typeof useDrag>;
  onHover: (id: string | null) => void;
}

/** Wraps the shared drag starter for one support (its centre is where a move is measured from). */
const downFor =
  (s: Support, drag: ReturnType<typeof useDrag>) => (e: ThreeEvent<PointerEvent>, mode: DragMode) =>
    drag(e, mode, supportCentre(s));

const tint = (base: string, selected: boolean, hovered: boolean) =>
  selected ? palette.selected : hovered ? palette.hover : base;

function hoverHandlers(id: string, onHover: (id: string | null) => void) {
  return {
    onPointerOver: (e: ThreeEvent<PointerEvent>) => {
      e.stopPropagation();
      onHover(id);
    },
    onPointerOut: () => onHover(null),
  };
}

/** A height handle: a small diamond at the top, dragged up and down. */
function HeightHandle({
  at,
  onDown,
}: {
  at: [number, number, number];
  onDown: (e: ThreeEvent<PointerEvent>) => void;
}) {
  return (
    <mesh position={at} onPointerDown={onDown} name="height-handle">
      <octahedronGeometry args={[0.35]} />
      <meshBasicMaterial color={palette.selected} />
    </mesh>
  );
}

const TreeItem = memo(function TreeItem({ s, unit, selected, hovered, drag, onHover }: ItemProps<Tree>) {
  const onDown = downFor(s, drag);
  const [x, y] = s.position;
  const total = s.totalHeight ?? s.height + 2;
  const trunk = s.trunkDiameter ?? 0.35;
  const canopy = s.canopyRadius ?? Math.max(1.5, total * 0.25);
  const canopyZ = Math.max(total - canopy, total * 0.55);
  const move = (e: ThreeEvent<PointerEvent>) =>
    onDown(e, { kind: "move-support", id: s.id, grab: [e.point.x, e.point.y] });
  return (
    <group {...hoverHandlers(s.id, onHover)}>
      <mesh position={[x, y, canopyZ / 2]} rotation={[Math.PI / 2, 0, 0]} onPointerDown={move}>
        <cylinderGeometry args={[trunk * 0.35, trunk / 2, canopyZ, 10]} />
        <meshLambertMaterial color={tint(palette.trunk, selected, hovered)} />
      </mesh>
      <mesh position={[x, y, canopyZ]} scale={[1, 1, 0.85]} onPointerDown={move}>
        <icosahedronGeometry args={[canopy, 1]} />
        <meshLambertMaterial
          color={tint(palette.canopy, selected, hovered)}
          transparent
          opacity={0.42}
          flatShading
          depthWrite={false}
        />
      </mesh>
      {/* The usable attach height: a ring around the trunk where the rope goes over. */}
      <mesh position={[x, y, s.height]}>
        <torusGeometry args={[Math.max(0.3, trunk), 0.05, 6, 20]} />
        <meshBasicMaterial color={palette.trunk} />
      </mesh>
      {selected && (
        <HeightHandle
          at={[x, y, s.height + 0.6]}
          onDown={(e) => onDown(e, { kind: "support-height", id: s.id, base: s.position })}
        />
      )}
      <YardLabel
        position={[x, y, s.height]}
        className="label label-left"
        priority={2}
        text={formatLength(s.height, unit)}
      />
    </group>
  );
});

const MastItem = memo(function MastItem({ s, unit, selected, hovered, drag, onHover }: ItemProps<Mast>) {
  const onDown = downFor(s, drag);
  const [x, y] = s.position;
  const metal = isMetalMast(s);
  const colour = metal ? palette.metal : s.material === "wood" ? palette.wood : palette.fibreglass;
  const grounded = s.base.kind === "grounded";
  const gap = s.base.kind === "insulated" ? (s.base.gap ?? 0.05) : 0;
  // Drawn a little thicker than life so a 5 cm pole is visible across a garden.
  const r = Math.max(s.diameter / 2, 0.06);
  const shaft = s.height - gap;
  const move = (e: ThreeEvent<PointerEvent>) =>
    onDown(e, { kind: "move-support", id: s.id, grab: [e.point.x, e.point.y] });
  return (
    <group {...hoverHandlers(s.id, onHover)}>
      <mesh position={[x, y, gap + shaft / 2]} rotation={[Math.PI / 2, 0, 0]} onPointerDown={move}>
        <cylinderGeometry args={[r * 0.8, r, shaft, 12]} />
        {metal ? (
          <meshStandardMaterial color={tint(colour, selected, hovered)} metalness={0.6} roughness={0.35} />
        ) : (
          <meshLambertMaterial color={tint(colour, selected, hovered)} />
        )}
      </mesh>
      {grounded ? (
        // Grounded: a dark plate into the soil, with a stake symbol.
        <mesh position={[x, y, 0.02]}>
          <cylinderGeometry args={[r * 4, r * 4, 0.04, 16]} />
          <meshLambertMaterial color={palette.groundTie} />
        </mesh>
      ) : (
        // Insulated: a white base insulator with the visible gap.
        <mesh position={[x, y, gap / 2]} rotation={[Math.PI / 2, 0, 0]}>
          <cylinderGeometry args={[r * 2.2, r * 2.2, Math.max(gap, 0.08), 12]} />
          <meshLambertMaterial color={palette.insulatorBase} />
        </mesh>
      )}
      {s.guys?.map((g) => (
        <Line
          key={g.id}
          points={[
            [x, y, g.attachHeight],
            [g.anchor[0], g.anchor[1], 0],
          ]}
          color={palette.rope}
          lineWidth={1}
          dashed
          dashSize={0.3}
          gapSize={0.2}
        />
      ))}
      {selected && (
        <HeightHandle
          at={[x, y, s.height + 0.5]}
          onDown={(e) => onDown(e, { kind: "support-height", id: s.id, base: s.position })}
        />
      )}
      <YardLabel
        position={[x, y, s.height]}
        className={`label ${metal ? "label-metal" : ""}`}
        priority={2}
        offset="translate(14px, -50%)"
        text={`${formatLength(s.height, unit)} · ${metal ? `metal, ${grounded ? "grounded" : "insulated"}` : s.material}`}
      />
    </group>
  );
});

function roofGeometry(b: Building): THREE.BufferGeometry {
  // Walls up to the eaves; the roof as a triangle fan from the centroid, each vertex at the roof height
  // there. For a rectangle with the ridge along an axis this is the gable roof; for other outlines it is
  // a fair picture.
  const pts = b.footprint;
  const n = pts.length;
  const v: number[] = [];
  const c = supportCentre(b);
  const ridge = b.ridgeHeight;
  const a = (b.ridgeDeg * Math.PI) / 180;
  const u: Point2 = [Math.sin(a), Math.cos(a)];
  // Ridge end points: where the ridge line leaves the footprint (found by projecting vertices on it).
  const along = pts.map((p) => (p[0] - c[0]) * u[0] + (p[1] - c[1]) * u[1]);
  const lo = Math.min(...along);
  const hi = Math.max(...along);
  const r0: [number, number, number] = [c[0] + u[0] * lo, c[1] + u[1] * lo, ridge];
  const r1: [number, number, number] = [c[0] + u[0] * hi, c[1] + u[1] * hi, ridge];
  for (let i = 0; i < n; i++) {
    const p = pts[i];
    const q = pts[(i + 1) % n];
    const hp = roofHeightAt(b, p);
    const hq = roofHeightAt(b, q);
    // Wall quad from ground to the roof line over this edge (gable ends reach the ridge).
    v.push(p[0], p[1], 0, q[0], q[1], 0, q[0], q[1], hq, p[0], p[1], 0, q[0], q[1], hq, p[0], p[1], hp);
  }
  const walls = new THREE.BufferGeometry();
  walls.setAttribute("position", new THREE.Float32BufferAttribute(v, 3));
  walls.computeVertexNormals();
  // Roof: each footprint edge to the nearer ridge end points.
  const rv: number[] = [];
  for (let i = 0; i < n; i++) {
    const p = pts[i];
    const q = pts[(i + 1) % n];
    const pz = roofHeightAt(b, p);
    const qz = roofHeightAt(b, q);
    const ap = (p[0] - c[0]) * u[0] + (p[1] - c[1]) * u[1];
    const aq = (q[0] - c[0]) * u[0] + (q[1] - c[1]) * u[1];
    const rp = ap < (lo + hi) / 2 ? r0 : r1;
    const rq = aq < (lo + hi) / 2 ? r0 : r1;
    rv.push(p[0], p[1], pz, q[0], q[1], qz, ...rq);
    if (rp !== rq) rv.push(p[0], p[1], pz, ...rq, ...rp);
  }
  const roof = new THREE.BufferGeometry();
  roof.setAttribute("position", new THREE.Float32BufferAttribute(rv, 3));
  roof.computeVertexNormals();
  walls.userData.roof = roof;
  walls.userData.ridge = [r0, r1];
  return walls;
}

const BuildingItem = memo(function BuildingItem({
  s,
  unit,
  selected,
  hovered,
  drag,
  onHover,
}: ItemProps<Building>) {
  const onDown = downFor(s, drag);
  const geo = useMemo(() => roofGeometry(s), [s]);
  const roof = geo.userData.roof as THREE.BufferGeometry;
  const ridge = geo.userData.ridge as [number, number, number][];
  const c = supportCentre(s);
  const move = (e: ThreeEvent<PointerEvent>) =>
    onDown(e, { kind: "move-support", id: s.id, grab: [e.point.x, e.point.y] });
  return (
    <group {...hoverHandlers(s.id, onHover)}>
      <mesh geometry={geo} onPointerDown={move}>
        <meshLambertMaterial color={tint(palette.wall, selected, hovered)} side={THREE.DoubleSide} />
      </mesh>
      <mesh geometry={roof} onPointerDown={move}>
        <meshLambertMaterial color={tint(palette.roof, selected, hovered)} side={THREE.DoubleSide} />
      </mesh>
      <Line points={ridge} color="#4a2a20" lineWidth={2} />
      <YardLabel
        position={[c[0], c[1], s.ridgeHeight + 0.4]}
        className="label"
        center
        text={`ridge ${formatLength(s.ridgeHeight, unit)}`}
      />
    </group>
  );
});

const FenceItem = memo(function FenceItem({ s, selected, hovered, drag, onHover }: ItemProps<Fence>) {
  const onDown = downFor(s, drag);
  const move = (e: ThreeEvent<PointerEvent>) =>
    onDown(e, { kind: "move-support", id: s.id, grab: [e.point.x, e.point.y] });
  const colour = tint(s.material === "metal" ? palette.fenceMetal : palette.fence, selected, hovered);
  return (
    <group {...hoverHandlers(s.id, onHover)}>
      {s.path.slice(1).map((q, i) => {
        const p = s.path[i];
        const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
        const ang = Math.atan2(q[1] - p[1], q[0] - p[0]);
        return (
          <mesh
            key={`${p[0]},${p[1]}`}
            position={[(p[0] + q[0]) / 2, (p[1] + q[1]) / 2, s.height / 2]}
            rotation={[0, 0, ang]}
            onPointerDown={move}
          >
            <boxGeometry args={[len, 0.06, s.height]} />
            <meshLambertMaterial color={colour} transparent opacity={0.75} />
          </mesh>
        );
      })}
    </group>
  );
});

/** Every support in the plan, selectable and draggable. */
export const Supports = memo(function Supports({ plan }: { plan: Plan }) {
  const selectedId = useApp((s) => s.selectedId);
  const hoverId = useApp((s) => s.hoverId);
  const hover = useApp((s) => s.hover);
  const drag = useDrag();
  return (
    <group>
      {plan.supports.map((s) => {
        // Props stay equal for untouched supports (immutable plan), so memo skips them on every edit.
        const common = {
          unit: plan.units,
          selected: s.id === selectedId,
          hovered: s.id === hoverId,
          onHover: hover,
          drag,
        };
        switch (s.type) {
          case "tree":
            return <TreeItem key={s.id} s={s} {...common} />;
          case "mast":
            return <MastItem key={s.id} s={s} {...common} />;
          case "building":
            return <BuildingItem key={s.id} s={s} {...common} />;
          case "fence":
            return <FenceItem key={s.id} s={s} {...common} />;
        }
        return null;
      })}
    </group>
  );
});
