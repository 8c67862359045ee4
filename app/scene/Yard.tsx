import { Canvas, type ThreeEvent, useThree } from "@react-three/fiber";
import { useCallback, useEffect } from "react";
import * as THREE from "three";
import { sketchRun } from "../plan/geometry";
import { freshness } from "../store/analysis-slice";
import { useApp, useAppStore } from "../store/react";
import { pickGround } from "../tools";
import { CameraRig } from "./CameraRig";
import { Ground, lotBounds } from "./Ground";
import { Hazards } from "./Hazards";
import { palette } from "./palette";
import { ResultsOverlay } from "./ResultsOverlay";
import { Supports } from "./Supports";
import { Wires } from "./Wires";
import { LabelDeclutter } from "./YardLabel";

// The plan frame is z-up (x east, y north); draw in it directly so no coordinate ever needs swapping.
THREE.Object3D.DEFAULT_UP.set(0, 0, 1);

/**
 * Lets browser tests and the bench find things on screen: projects a plan point to page pixels.
 * Read-only; it changes nothing in the store.
 */
function ScreenProbe() {
  const { camera, gl } = useThree();
  useEffect(() => {
    const w = window as unknown as { __yardProbe?: unknown };
    w.__yardProbe = {
      project: (x: number, y: number, z: number) => {
        const v = new THREE.Vector3(x, y, z).project(camera);
        const r = gl.domElement.getBoundingClientRect();
        return [r.left + ((v.x + 1) / 2) * r.width, r.top + ((1 - v.y) / 2) * r.height];
      },
    };
    return () => {
      w.__yardProbe = undefined;
    };
  }, [camera, gl]);
  return null;
}

function Contents() {
  const store = useAppStore();
  const plan = useApp((s) => s.plan);
  const result = useApp((s) => s.result);
  const stale = useApp((s) => freshness(s) === "stale" || freshness(s) === "failed");
  const showCurrents = useApp((s) => s.showCurrents);
  const showLobe = useApp((s) => s.showLobe);
  const b = lotBounds(plan.lot.outline);
  // Stable, so the memoised ground is not re-rendered for every result.
  const onGround = useCallback(
    (e: ThreeEvent<PointerEvent>) => {
      if (e.button !== 0) return;
      // Let orbiting start on empty ground; only a tool turns a ground click into an edit.
      const tool = store.getState().tool.kind;
      if (tool === "select") {
        if (e.delta < 2) store.getState().select(null);
        return;
      }
      e.stopPropagation();
      pickGround(store, [e.point.x, e.point.y], e.nativeEvent.shiftKey);
    },
    [store],
  );
  const band = result?.analysis.bands[0];
  const active =
    plan.wireRuns.find((r) => r.id === result?.analysis.activeRunId) ?? plan.wireRuns.find((r) => r.feed);
  const feed = active ? sketchRun(plan, active)?.feedPoint : null;
  return (
    <>
      <color attach="background" args={[palette.sky]} />
      {/* The far ground fades into the sky instead of ending at an edge. */}
      <fog attach="fog" args={[palette.sky, b.size * 3, b.size * 9]} />
      <hemisphereLight args={["#ffffff", "#8a9a7a", 1.6]} />
      <directionalLight position={[-20, -30, 40]} intensity={1.4} />
      <CameraRig centre={[b.cx, b.cy]} size={b.size} />
      <ScreenProbe />
      <LabelDeclutter />
      <Ground lot={plan.lot} unit={plan.units} onGroundPointer={onGround} />
      <Hazards plan={plan} />
      <Supports plan={plan} />
      <Wires plan={plan} />
      {result && band && (
        <ResultsOverlay
          analysis={result.analysis}
          band={band}
          stale={stale}
          showCurrents={showCurrents}
          lobeAt={showLobe && feed ? feed : null}
        />
      )}
    </>
  );
}

/** The 3D yard. Renders on demand only: nothing is drawn while nothing changes. */
export function Yard() {
  return (
    <div className="yard" data-testid="yard">
      <Canvas
        frameloop="demand"
        dpr={[1, 2]}
        camera={{ fov: 45, near: 0.1, far: 2000, up: [0, 0, 1], position: [-20, -40, 25] }}
        gl={{ antialias: true }}
        onPointerMissed={() => undefined}
      >
        <Contents />
      </Canvas>
    </div>
  );
}
