import { useEffect, useLayoutEffect, useMemo, useRef } from "react";
import * as THREE from "three";
import type { BandAnalysis, PlanAnalysis } from "../../solver/plan/analysis-types";
import type { Point3 } from "../../solver/plan/schema";
import { currentColour, palette } from "./palette";
import { SAFETY, YardLabel } from "./YardLabel";

/**
 * What the solver found, drawn on the yard: the current along every wire (colour and thickness by |I|,
 * from the solver's own segments), the high-voltage points, and optionally the 3D pattern lobe.
 */
interface Props {
  analysis: PlanAnalysis;
  band: BandAnalysis;
  stale: boolean;
  showCurrents: boolean;
  /** Where to centre the 3D pattern lobe (the feed point), or null to hide it. */
  lobeAt: Point3 | null;
}

const Y = new THREE.Vector3(0, 1, 0);

function CurrentTubes({
  analysis,
  band,
  stale,
}: {
  analysis: PlanAnalysis;
  band: BandAnalysis;
  stale: boolean;
}) {
  const ref = useRef<THREE.InstancedMesh>(null);
  const mesh = analysis.mesh;
  const cur = band.centre.segmentCurrents;
  const n = mesh.segments;
  const mags = useMemo(() => {
    const m = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      // |I| at the segment's middle: the mean of its linear end values.
      const re = (cur.startRe[i] + cur.endRe[i]) / 2;
      const im = (cur.startIm[i] + cur.endIm[i]) / 2;
      m[i] = Math.hypot(re, im);
    }
    return m;
  }, [cur, n]);
  useLayoutEffect(() => {
    const inst = ref.current;
    if (!inst) return;
    let peak = 0;
    for (let i = 0; i < n; i++) peak = Math.max(peak, mags[i]);
    const m = new THREE.Matrix4();
    const q = new THREE.Quaternion();
    const a = new THREE.Vector3();
    const b = new THREE.Vector3();
    const d = new THREE.Vector3();
    const s = new THREE.Vector3();
    const c = new THREE.Color();
    for (let i = 0; i < n; i++) {
      a.fromArray(mesh.starts, i * 3);
      b.fromArray(mesh.ends, i * 3);
      d.subVectors(b, a);
      const len = d.length();
      q.setFromUnitVectors(Y, d.normalize());
      const t = peak > 0 ? mags[i] / peak : 0;
      // Thick enough to read across a garden: |I| shows as both colour and girth.
      const r = 0.07 + 0.22 * t;
      s.set(r, len, r);
      m.compose(a.add(b).multiplyScalar(0.5), q, s);
      inst.setMatrixAt(i, m);
      const [cr, cg, cb] = currentColour(t);
      c.setRGB(cr, cg, cb);
      inst.setColorAt(i, c);
    }
    inst.instanceMatrix.needsUpdate = true;
    if (inst.instanceColor) inst.instanceColor.needsUpdate = true;
    inst.computeBoundingSphere();
  }, [mesh, mags, n]);
  return (
    <instancedMesh ref={ref} args={[undefined, undefined, n]} key={n} raycast={() => null}>
      <cylinderGeometry args={[1, 1, 1, 8]} />
      <meshBasicMaterial transparent opacity={stale ? 0.35 : 0.95} />
    </instancedMesh>
  );
}

function Lobe({ band }: { band: BandAnalysis }) {
  const grid = band.centre.pattern;
  const geo = useMemo(() => {
    if (!grid) return null;
    const { elevationsDeg: els, bearingsDeg: brs, gainDbi } = grid;
    const peak = band.centre.peakGainDbi;
    const floor = peak - 30;
    const scale = 9; // metres for the peak: big enough to read over a garden
    const pos: number[] = [];
    const idx: number[] = [];
    for (let i = 0; i < els.length; i++) {
      for (let j = 0; j < brs.length; j++) {
        const g = gainDbi[i * brs.length + j];
        const r = ((Math.max(floor, Number.isFinite(g) ? g : floor) - floor) / 30) * scale;
        const el = (els[i] * Math.PI) / 180;
        const br = (brs[j] * Math.PI) / 180;
        // Bearings are clockwise from the model's +y; the yard is drawn in the model frame.
        pos.push(r * Math.cos(el) * Math.sin(br), r * Math.cos(el) * Math.cos(br), r * Math.sin(el));
      }
    }
    const w = brs.length;
    for (let i = 0; i + 1 < els.length; i++) {
      for (let j = 0; j < w; j++) {
        const j1 = (j + 1) % w;
        if (j1 === 0 && Math.abs((brs[w - 1] - brs[0]) % 360) < 1e-6) continue;
        const a = i * w + j;
        const b = i * w + j1;
        const c = (i + 1) * w + j;
        const d = (i + 1) * w + j1;
        idx.push(a, b, d, a, d, c);
      }
    }
    const g = new THREE.BufferGeometry();
    g.setAttribute("position", new THREE.Float32BufferAttribute(pos, 3));
    g.setIndex(idx);
    g.computeVertexNormals();
    return g;
  }, [grid, band.centre.peakGainDbi]);
  // A geometry passed by prop is ours to free: every result builds a new one.
  useEffect(() => () => geo?.dispose(), [geo]);
  if (!geo) {
    return (
      <YardLabel
        position={[0, 0, 6]}
        center
        className="label label-muted"
        text="the 3D pattern is not in this result"
      />
    );
  }
  return (
    <group>
      <mesh geometry={geo} raycast={() => null}>
        <meshLambertMaterial
          color={palette.lobe}
          transparent
          opacity={0.28}
          side={THREE.DoubleSide}
          depthWrite={false}
        />
      </mesh>
      <lineSegments raycast={() => null}>
        <wireframeGeometry args={[geo]} />
        <lineBasicMaterial color={palette.lobe} transparent opacity={0.25} />
      </lineSegments>
    </group>
  );
}

export function ResultsOverlay({ analysis, band, stale, showCurrents, lobeAt }: Props) {
  // Keys stable across passes and drags (a wire has at most two free ends), so labels are not remounted.
  const seen = new Map<string, number>();
  // A radial field has a free tip per radial: mark every tip, but label the field once (eight identical
  // labels round a mast said nothing more and hid the yard).
  const labelledField = new Set<string>();
  const hv = analysis.highVoltagePoints
    .filter((p) => p.band === band.name)
    .map((p) => {
      const n = seen.get(p.wire) ?? 0;
      seen.set(p.wire, n + 1);
      const radial = analysis.compiled.wireElement[p.wire]?.kind === "radial";
      const label = !radial
        ? "⚡ high RF voltage"
        : labelledField.has(p.elementId)
          ? null
          : "⚡ high RF voltage at the radial tips";
      if (radial) labelledField.add(p.elementId);
      return { ...p, key: `${p.wire}#${n}`, label };
    });
  return (
    <group>
      {showCurrents && <CurrentTubes analysis={analysis} band={band} stale={stale} />}
      {hv.map((p) => (
        <group key={p.key} position={p.point}>
          <mesh raycast={() => null}>
            <sphereGeometry args={[0.22, 14, 10]} />
            <meshBasicMaterial color={palette.highVoltage} transparent opacity={stale ? 0.4 : 0.9} />
          </mesh>
          <mesh raycast={() => null}>
            <sphereGeometry args={[0.5, 14, 10]} />
            <meshBasicMaterial color={palette.highVoltage} transparent opacity={0.15} depthWrite={false} />
          </mesh>
          {p.label && (
            <YardLabel
              className="label label-danger"
              offset="translate(-50%, 16px)"
              priority={SAFETY}
              text={p.label}
            />
          )}
        </group>
      ))}
      {lobeAt && (
        // The pattern is the far field seen from the antenna, so its origin is the feed point, in the air.
        <group position={lobeAt}>
          <Lobe band={band} />
        </group>
      )}
    </group>
  );
}
