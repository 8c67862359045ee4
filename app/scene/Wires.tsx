import { Line } from "@react-three/drei";
import type { ThreeEvent } from "@react-three/fiber";
import { memo } from "react";
import type { Plan, Point3, WireRun } from "../../solver/plan/schema";
import { setFeed as setFeedAt } from "../plan/commands";
import { fractionNearest, sketchRun } from "../plan/geometry";
import { useApp, useAppStore } from "../store/react";
import { formatLength, type LengthUnit } from "../units";
import { useDrag } from "./interaction";
import { palette } from "./palette";
import { FEED, YardLabel } from "./YardLabel";

const mid = (a: Point3, b: Point3): Point3 => [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2, (a[2] + b[2]) / 2];

const RunItem = memo(function RunItem({ plan, run, unit }: { plan: Plan; run: WireRun; unit: LengthUnit }) {
  const store = useAppStore();
  const selectedId = useApp((s) => s.selectedId);
  const hoverId = useApp((s) => s.hoverId);
  const drag = useDrag();
  const sketch = sketchRun(plan, run);
  if (!sketch) return null;
  const selected =
    selectedId === run.id ||
    run.anchors.some((a) => a.id === selectedId) ||
    run.droops?.some((d) => d.id === selectedId);
  const colour = selected ? palette.selected : hoverId === run.id ? palette.hover : palette.wire;
  const onDown = (e: ThreeEvent<PointerEvent>) => {
    if (e.button !== 0) return;
    e.stopPropagation();
    const s = store.getState();
    if (s.tool.kind === "place-feed") {
      const at = fractionNearest(sketch.conductor, [e.point.x, e.point.y, e.point.z]);
      s.applyEdit((p) => {
        const next = p.wireRuns.find((r) => r.id === run.id);
        if (!next) return p;
        return setFeedAt(p, run.id, at);
      }, "immediately");
      s.setTool({ kind: "select" });
      s.select(run.id);
      return;
    }
    s.select(run.id);
  };
  const span = sketch.conductor;
  // The length label sits a third of the way along, clear of the feed label at the centre.
  const labelAt = span[Math.floor(span.length / 3)];
  return (
    <group
      onPointerOver={(e) => {
        e.stopPropagation();
        store.getState().hover(run.id);
      }}
      onPointerOut={() => store.getState().hover(null)}
    >
      {/* A fat invisible tube to make the thin wire easy to click. */}
      <Line points={span} color={colour} lineWidth={selected ? 4 : 2.5} onPointerDown={onDown} />
      {sketch.ropes.map(([a, b]) => (
        <Line
          key={`${a.join()}`}
          points={[a, b]}
          color={palette.rope}
          lineWidth={1.5}
          dashed
          dashSize={0.15}
          gapSize={0.1}
        />
      ))}
      {sketch.insulators.map((p) => (
        <mesh key={p.join()} position={p}>
          <sphereGeometry args={[0.14, 10, 8]} />
          <meshLambertMaterial color={palette.insulator} />
        </mesh>
      ))}
      {run.anchors.map((a) => {
        const p = sketch.anchorPoints.get(a.id);
        if (!p || a.kind !== "free") return null;
        return (
          <mesh
            key={a.id}
            position={p}
            onPointerDown={(e) => drag(e, { kind: "move-anchor", id: a.id }, [p[0], p[1]])}
          >
            <boxGeometry args={[0.3, 0.3, 0.3]} />
            <meshBasicMaterial color={selectedId === a.id ? palette.selected : palette.wire} />
          </mesh>
        );
      })}
      {sketch.droopLegs.map((d) => (
        <group key={d.id}>
          <mesh position={d.to}>
            <sphereGeometry args={[0.09, 8, 6]} />
            <meshBasicMaterial color={palette.wire} />
          </mesh>
          <YardLabel
            position={mid(d.from, d.to)}
            className="label label-small"
            offset="translate(8px, -50%)"
            text={`droop ${formatLength(Math.hypot(d.from[0] - d.to[0], d.from[1] - d.to[1], d.from[2] - d.to[2]), unit)}`}
          />
        </group>
      ))}
      {sketch.feedPoint && (
        <group position={sketch.feedPoint}>
          <mesh>
            <boxGeometry args={[0.35, 0.35, 0.35]} />
            <meshBasicMaterial color={palette.feed} />
          </mesh>
          <Line
            points={[
              [0, 0, 0],
              [0, 0, -sketch.feedPoint[2]],
            ]}
            color={palette.feed}
            lineWidth={1.5}
            dashed
            dashSize={0.3}
            gapSize={0.2}
          />
          {/* Half-way down the feed's drop line: clear of the wire's own labels up at the span. */}
          <YardLabel
            position={[0, 0, -sketch.feedPoint[2] / 2]}
            className="label label-feed"
            offset="translate(8px, -50%)"
            priority={FEED}
            text={`feed · ${formatLength(sketch.feedPoint[2], unit)} up`}
          />
        </group>
      )}
      {labelAt && (
        <YardLabel
          position={labelAt}
          className="label label-small"
          offset="translate(-50%, -160%)"
          priority={2}
          text={`${formatLength(sketch.length, unit)} of wire`}
        />
      )}
    </group>
  );
});

export const Wires = memo(function Wires({ plan }: { plan: Plan }) {
  return (
    <group>
      {plan.wireRuns.map((r) => (
        <RunItem key={r.id} plan={plan} run={r} unit={plan.units} />
      ))}
    </group>
  );
});
