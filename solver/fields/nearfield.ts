/**
 * Electric and magnetic field at points near the wires, from the segment currents and the charges that
 * continuity puts on them (e^{jωt}; Balanis, Antenna Theory, 4th ed., §3.6 and §4.2: E = −jωA − ∇Φ,
 * H = ∇×A/μ0):
 *   E = −jωμ0 ∫ I t̂ g dl′ − (1/ε0) [∫ q ∇g dl′ + Σ Q_node ∇g],     H = ∫ I ∇g × t̂ dl′,
 *   g = e^{−jkR}/(4πR),  ∇g = −(1 + jkR) e^{−jkR}/(4πR²) · R̂,  R̂ = (r − r′)/R.
 * q is the segment's constant line charge (charges.ts); Q_node the point charge where the current jumps:
 * (I_in − I_out)/(jω) at nodes shared by consecutive segments, ±I/(jω) at other segment ends (zero for
 * the usual rooftop currents, which vanish at free ends and are continuous).
 * Perfect ground adds the image: mirrored geometry with negated current (so negated charge).
 * The thin-wire reduced distance R = √(|r − r′|² + a²) keeps the field finite on the wire; off it the
 * relative difference is ~(a/d)². Integration: Gauss–Legendre, 8 points on each of m sub-intervals, m
 * from the segment's length over its distance to the point and over the wavelength.
 */

import { C0, EPS0, MU0 } from "../model/constants";
import { ModelError } from "../model/errors";
import type { MeshView, SegmentCurrents, Vec3 } from "../model/types";
import { checkMeshAndCurrents, checkPositive } from "./validate";

export type NearFieldGround = "free" | "perfect";

/** Complex field vectors, interleaved [xRe, xIm, yRe, yIm, zRe, zIm]: E in V/m, H in A/m. */
export interface NearField {
  e: Float64Array;
  h: Float64Array;
}

// 8-point Gauss–Legendre on [0, 1] (Abramowitz & Stegun, Table 25.4).
const GL_X = [
  0.01985507175123188, 0.10166676129318664, 0.2372337950418355, 0.4082826787521751, 0.5917173212478249,
  0.7627662049581645, 0.8983332387068134, 0.9801449282487681,
];
const GL_W = [
  0.05061426814518813, 0.11119051722668724, 0.15685332293894363, 0.181341891689181, 0.181341891689181,
  0.15685332293894363, 0.11119051722668724, 0.05061426814518813,
];

interface Source {
  /** start xyz, end xyz per segment */
  p: Float64Array;
  radius: Float64Array;
  iRe: Float64Array; // start, end pairs
  iIm: Float64Array;
  n: number;
  /** Point charges: xyz and complex value (C), one per node or unmatched end. */
  qPos: number[];
  qRe: number[];
  qIm: number[];
}

function sources(mesh: MeshView, currents: SegmentCurrents, omega: number, ground: NearFieldGround): Source {
  const copies = ground === "perfect" ? 2 : 1;
  const n = mesh.segments;
  const src: Source = {
    p: new Float64Array(6 * n * copies),
    radius: new Float64Array(n * copies),
    iRe: new Float64Array(2 * n * copies),
    iIm: new Float64Array(2 * n * copies),
    n: n * copies,
    qPos: [],
    qRe: [],
    qIm: [],
  };
  for (let c = 0; c < copies; c++) {
    const sz = c === 0 ? 1 : -1; // mirror z for the image
    const si = c === 0 ? 1 : -1; // and negate its current
    for (let i = 0; i < n; i++) {
      const o = c * n + i;
      for (let a = 0; a < 3; a++) {
        src.p[6 * o + a] = mesh.starts[3 * i + a] * (a === 2 ? sz : 1);
        src.p[6 * o + 3 + a] = mesh.ends[3 * i + a] * (a === 2 ? sz : 1);
      }
      src.radius[o] = mesh.radii?.[i] ?? 0;
      src.iRe[2 * o] = si * currents.startRe[i];
      src.iIm[2 * o] = si * currents.startIm[i];
      src.iRe[2 * o + 1] = si * currents.endRe[i];
      src.iIm[2 * o + 1] = si * currents.endIm[i];
    }
  }
  // Point charges: Q = (I_in − I_out)/(jω) = −j(I_in − I_out)/ω. A segment end met by the next segment's
  // start at the same point is one node; other ends stand alone.
  const add = (x: number, y: number, z: number, inRe: number, inIm: number, outRe: number, outIm: number) => {
    const dRe = inRe - outRe;
    const dIm = inIm - outIm;
    if (dRe === 0 && dIm === 0) return;
    src.qPos.push(x, y, z);
    src.qRe.push(dIm / omega);
    src.qIm.push(-dRe / omega);
  };
  const p = src.p;
  for (let o = 0; o < src.n; o++) {
    const prevJoins =
      o > 0 &&
      o % n !== 0 &&
      Math.hypot(p[6 * o] - p[6 * o - 3], p[6 * o + 1] - p[6 * o - 2], p[6 * o + 2] - p[6 * o - 1]) === 0;
    if (!prevJoins) add(p[6 * o], p[6 * o + 1], p[6 * o + 2], 0, 0, src.iRe[2 * o], src.iIm[2 * o]);
    const next = o + 1;
    const nextJoins =
      next < src.n &&
      next % n !== 0 &&
      Math.hypot(
        p[6 * next] - p[6 * o + 3],
        p[6 * next + 1] - p[6 * o + 4],
        p[6 * next + 2] - p[6 * o + 5],
      ) === 0;
    const outRe = nextJoins ? src.iRe[2 * next] : 0;
    const outIm = nextJoins ? src.iIm[2 * next] : 0;
    add(p[6 * o + 3], p[6 * o + 4], p[6 * o + 5], src.iRe[2 * o + 1], src.iIm[2 * o + 1], outRe, outIm);
  }
  return src;
}

/** Adds the field of a point charge (qRe, qIm) at distance vector (dx, dy, dz) from it into out.e. */
function pointCharge(
  k: number,
  eps: number,
  dx: number,
  dy: number,
  dz: number,
  a2: number,
  qRe: number,
  qIm: number,
  e: Float64Array,
): void {
  const r2 = dx * dx + dy * dy + dz * dz + a2;
  const r = Math.sqrt(r2);
  // −∇g = (1 + jkR) e^{−jkR}/(4πR²) R̂ ; E = Q(−∇g)/ε
  const c = Math.cos(k * r);
  const s = -Math.sin(k * r);
  const fRe = (c - k * r * s) / (4 * Math.PI * r2 * r * eps);
  const fIm = (s + k * r * c) / (4 * Math.PI * r2 * r * eps);
  const vRe = qRe * fRe - qIm * fIm;
  const vIm = qRe * fIm + qIm * fRe;
  e[0] += vRe * dx;
  e[1] += vIm * dx;
  e[2] += vRe * dy;
  e[3] += vIm * dy;
  e[4] += vRe * dz;
  e[5] += vIm * dz;
}

/** Near field at one point. */
export function nearFieldAt(
  mesh: MeshView,
  currents: SegmentCurrents,
  frequencyHz: number,
  ground: NearFieldGround,
  point: Vec3,
): NearField {
  checkMeshAndCurrents(mesh, currents);
  checkPositive("frequencyHz", frequencyHz, "frequency");
  if (ground !== "free" && ground !== "perfect") {
    throw new ModelError(
      "ground",
      `near fields support "free" and "perfect" ground, got ${JSON.stringify(ground)}`,
    );
  }
  if (!point.every(Number.isFinite)) throw new ModelError("point", "coordinates must be finite numbers");
  const omega = 2 * Math.PI * frequencyHz;
  return fieldFromSources(sources(mesh, currents, omega, ground), omega, point);
}

/** Near field at many points (xyz flattened); returns E and H per point, 6 numbers each. */
export function nearFieldPoints(
  mesh: MeshView,
  currents: SegmentCurrents,
  frequencyHz: number,
  ground: NearFieldGround,
  points: Float64Array,
): NearField {
  checkMeshAndCurrents(mesh, currents);
  checkPositive("frequencyHz", frequencyHz, "frequency");
  if (ground !== "free" && ground !== "perfect") {
    throw new ModelError(
      "ground",
      `near fields support "free" and "perfect" ground, got ${JSON.stringify(ground)}`,
    );
  }
  const omega = 2 * Math.PI * frequencyHz;
  const src = sources(mesh, currents, omega, ground);
  const np = Math.floor(points.length / 3);
  const out: NearField = { e: new Float64Array(6 * np), h: new Float64Array(6 * np) };
  for (let q = 0; q < np; q++) {
    const pt: Vec3 = [points[3 * q], points[3 * q + 1], points[3 * q + 2]];
    if (!pt.every(Number.isFinite))
      throw new ModelError(`points[${q}]`, "coordinates must be finite numbers");
    const f = fieldFromSources(src, omega, pt);
    out.e.set(f.e, 6 * q);
    out.h.set(f.h, 6 * q);
  }
  return out;
}

function fieldFromSources(src: Source, omega: number, point: Vec3): NearField {
  const k = omega / C0;
  const eps = EPS0;
  const e = new Float64Array(6);
  const h = new Float64Array(6);
  const [px, py, pz] = point;
  const p = src.p;
  for (let o = 0; o < src.n; o++) {
    const sx = p[6 * o];
    const sy = p[6 * o + 1];
    const sz = p[6 * o + 2];
    const ux = p[6 * o + 3] - sx;
    const uy = p[6 * o + 4] - sy;
    const uz = p[6 * o + 5] - sz;
    const len = Math.hypot(ux, uy, uz);
    const tx = ux / len;
    const ty = uy / len;
    const tz = uz / len;
    const a2 = src.radius[o] * src.radius[o];
    // Distance from the point to the segment, for the subdivision.
    const along = Math.min(Math.max(((px - sx) * tx + (py - sy) * ty + (pz - sz) * tz) / len, 0), 1);
    const d = Math.hypot(px - sx - along * ux, py - sy - along * uy, pz - sz - along * uz) + 1e-12 * len;
    const m = Math.min(256, Math.max(1, Math.ceil((2 * len) / d + k * len)));
    const i0Re = src.iRe[2 * o];
    const i0Im = src.iIm[2 * o];
    const i1Re = src.iRe[2 * o + 1];
    const i1Im = src.iIm[2 * o + 1];
    // Line charge q = (j/ω)(I1 − I0)/ℓ.
    const qRe = -(i1Im - i0Im) / (omega * len);
    const qIm = (i1Re - i0Re) / (omega * len);
    for (let sub = 0; sub < m; sub++) {
      for (let g = 0; g < 8; g++) {
        const u = (sub + GL_X[g]) / m;
        const w = (GL_W[g] * len) / m;
        const dx = px - (sx + u * ux);
        const dy = py - (sy + u * uy);
        const dz = pz - (sz + u * uz);
        const r2 = dx * dx + dy * dy + dz * dz + a2;
        const r = Math.sqrt(r2);
        const c = Math.cos(k * r);
        const s = -Math.sin(k * r);
        // g = e^{−jkR}/(4πR)
        const gRe = c / (4 * Math.PI * r);
        const gIm = s / (4 * Math.PI * r);
        // −dg/dR / R = (1 + jkR) e^{−jkR}/(4πR³)
        const fRe = (c - k * r * s) / (4 * Math.PI * r2 * r);
        const fIm = (s + k * r * c) / (4 * Math.PI * r2 * r);
        const iRe = i0Re + u * (i1Re - i0Re);
        const iIm = i0Im + u * (i1Im - i0Im);
        // E_A = −jωμ0 I g t̂
        const aRe = omega * MU0 * (iRe * gIm + iIm * gRe) * w;
        const aIm = -omega * MU0 * (iRe * gRe - iIm * gIm) * w;
        // E_Φ = (q/ε)(−∇g) = (q/ε) f (dx, dy, dz)
        const bRe = ((qRe * fRe - qIm * fIm) * w) / eps;
        const bIm = ((qRe * fIm + qIm * fRe) * w) / eps;
        e[0] += aRe * tx + bRe * dx;
        e[1] += aIm * tx + bIm * dx;
        e[2] += aRe * ty + bRe * dy;
        e[3] += aIm * ty + bIm * dy;
        e[4] += aRe * tz + bRe * dz;
        e[5] += aIm * tz + bIm * dz;
        // H = I ∇g × t̂ = I f (t̂ × (dx, dy, dz))   since ∇g = −f (dx, dy, dz)
        const hRe = (iRe * fRe - iIm * fIm) * w;
        const hIm = (iRe * fIm + iIm * fRe) * w;
        const cx = ty * dz - tz * dy;
        const cy = tz * dx - tx * dz;
        const cz = tx * dy - ty * dx;
        h[0] += hRe * cx;
        h[1] += hIm * cx;
        h[2] += hRe * cy;
        h[3] += hIm * cy;
        h[4] += hRe * cz;
        h[5] += hIm * cz;
      }
    }
  }
  for (let q = 0; q < src.qRe.length; q++) {
    const i = 3 * q;
    pointCharge(
      k,
      eps,
      px - src.qPos[i],
      py - src.qPos[i + 1],
      pz - src.qPos[i + 2],
      0,
      src.qRe[q],
      src.qIm[q],
      e,
    );
  }
  return { e, h };
}
