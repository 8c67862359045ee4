import { OrbitControls } from "@react-three/drei";
import { useThree } from "@react-three/fiber";
import { useEffect, useRef } from "react";
import type { OrbitControls as OrbitImpl } from "three-stdlib";
import { useApp } from "../store/react";

/** Orbit, pan and zoom; plus quick views on request (top, from the south side, the default 3/4 view). */
export function CameraRig({ centre, size }: { centre: [number, number]; size: number }) {
  const request = useApp((s) => s.cameraRequest);
  const controls = useRef<OrbitImpl>(null);
  const { camera, invalidate } = useThree();
  // Only a new view request moves the camera; plan edits (which change centre and size) never do.
  // biome-ignore lint/correctness/useExhaustiveDependencies: keyed on the request nonce on purpose
  useEffect(() => {
    const c = controls.current;
    const [cx, cy] = centre;
    const d = size * 1.45;
    if (request.view === "top") camera.position.set(cx, cy - 0.001, d * 1.25);
    else if (request.view === "side") camera.position.set(cx, cy - d * 1.3, 5);
    else camera.position.set(cx - d * 0.55, cy - d * 0.95, d * 0.6);
    camera.up.set(0, 0, 1);
    if (c) {
      c.target.set(cx, cy, request.view === "side" ? 4 : 2);
      c.update();
    }
    camera.lookAt(cx, cy, 2);
    invalidate();
  }, [request.nonce]);
  return (
    <OrbitControls
      ref={controls}
      makeDefault
      enableDamping={false}
      maxPolarAngle={Math.PI / 2 - 0.02}
      minDistance={3}
      maxDistance={size * 6}
      target={[centre[0], centre[1], 2]}
    />
  );
}
