/**
 * A bare wire end standing on lossy soil, solved with the half-space Green's function instead of a
 * lumped spreading resistance.
 *
 * The current I that reaches a z = 0 end does not stop there: it flows on into the soil. In a medium of
 * complex permittivity ε_c = ε_r − jσ/(ωε₀) a point source of current I is, for the fields, a point
 * charge q = I/(jω) (∇·J = I δ with J = jωε₀ε_c E); at the surface of the half-space its potential is
 * the free-space one times 1 − κ = 2/(1 + ε_c), the quasi-static image factor of a charge on the boundary
 * between two dielectrics (method of images; Jackson, Classical Electrodynamics, 3rd ed., §4.4 — section
 * from memory). The potential a radius a away, q/(2π a ε₀(1 + ε_c)), is that of a hemispherical electrode
 * of radius a: the self term below is the hemisphere's spreading impedance 1/(2π a (σ + jωε₀(1 + ε_r))),
 * which tends to the textbook ρ/(2πa) at d.c. (Tagg, Earth Resistances, 1964).
 *
 * What this adds to the Galerkin matrix: the half triangle at the end gets a point divergence −(its
 * value at the end, along the segment's direction) — the basis becomes charge-neutral, its second half
 * collapsed into the soil — and that point charge interacts with every other charge through
 * (1 − κ)·e^{−jkR}/R: its direct field and its quasi-static image, the parts of its field that the
 * mixed-potential image terms of the fill leave out. The rest of its reflected field, the part that is
 * not quasi-static, is already in the matrix: the Sommerfeld remainder (solver/ground/sommerfeld-*.ts)
 * is a field dyadic acting on the half triangle's current up to its end, and a current element's field
 * includes the charge at the end where it stops. As σ → ∞, 1 − κ → 0 and the contact becomes the ideal
 * connection of perfect ground, as it should.
 *
 * Thin-wire reading: the contact is a hemisphere of the wire's radius (the reduced kernel's R ≥ a). How a
 * real end sits in the soil (a flat cut, a buried tip, corrosion) changes it; the model says so.
 */
import type { Mesh } from "../geometry/types";
import type { GroundFrequency, GroundKernel } from "../ground/kernel";
import { gaussRule } from "./quadrature";

export interface SoilContactNode {
  /** Index into model.wires. */
  wire: number;
  /** The half triangle at the end. */
  basis: number;
  /** Its point divergence at the end: −sign if the end is its segment's end node, +sign at the start. */
  divergence: number;
  /** The end point (z = 0) and the wire's radius there. */
  x: number;
  y: number;
  z: number;
  radius: number;
}

/** The grounded ends of the mesh, each as its half triangle and end point. */
export function soilContactNodes(mesh: Mesh): SoilContactNode[] {
  const S = mesh.segs;
  const out: SoilContactNode[] = [];
  for (const g of mesh.groundPorts) {
    const s = g.port.segment;
    const t = g.port.atEnd ? S.len[s] : 0;
    for (let i = mesh.segPieceStart[s]; i < mesh.segPieceStart[s + 1]; i++) {
      const pc = mesh.segPieces[i];
      if ((mesh.pieceAtEnd[pc] === 1) !== g.port.atEnd) continue;
      const sign = mesh.pieceSign[pc];
      out.push({
        wire: g.wire,
        basis: mesh.pieceBasis[pc],
        divergence: g.port.atEnd ? -sign : sign,
        x: S.start[3 * s] + t * S.dir[3 * s],
        y: S.start[3 * s + 1] + t * S.dir[3 * s + 1],
        z: S.start[3 * s + 2] + t * S.dir[3 * s + 2],
        radius: S.radius[s],
      });
    }
  }
  return out;
}

const RULE = gaussRule(8);

/**
 * ∫_q e^{−jkR}/R dl′ from a point to segment q, reduced kernel R = √(|r − r′|² + a²): the 1/R part in
 * closed form (asinh), the smooth rest (e^{−jkR} − 1)/R by 8-point Gauss. Written into out[0..1].
 */
export function pointSegmentIntegral(
  mesh: Mesh,
  q: number,
  px: number,
  py: number,
  pz: number,
  k: number,
  out: Float64Array,
): void {
  const S = mesh.segs;
  const q3 = 3 * q;
  const l = S.len[q];
  const a = S.radius[q];
  const tx = S.dir[q3];
  const ty = S.dir[q3 + 1];
  const tz = S.dir[q3 + 2];
  const wx = px - S.start[q3];
  const wy = py - S.start[q3 + 1];
  const wz = pz - S.start[q3 + 2];
  const s0 = wx * tx + wy * ty + wz * tz;
  const rho2 = Math.max(0, wx * wx + wy * wy + wz * wz - s0 * s0) + a * a;
  const rho = Math.sqrt(rho2);
  let re = Math.asinh((l - s0) / rho) - Math.asinh(-s0 / rho);
  let im = 0;
  for (let i = 0; i < RULE.n; i++) {
    const d = RULE.u[i] * l - s0;
    const R = Math.sqrt(rho2 + d * d);
    const kr = k * R;
    const wt = (RULE.w[i] * l) / R;
    re += wt * (Math.cos(kr) - 1);
    im -= wt * Math.sin(kr);
  }
  out[0] = re;
  out[1] = im;
}

/**
 * Distance between two contacts' charges, regularised by the larger of their radii: a thin wire's charge
 * inside a fat wire's hemisphere sees the fat one's potential, and the other way round (so the pair term
 * stays symmetric). For a contact with itself, its radius.
 */
export function contactDistance(c: SoilContactNode, e: SoilContactNode): number {
  const dx = c.x - e.x;
  const dy = c.y - e.y;
  const dz = c.z - e.z;
  const a = Math.max(c.radius, e.radius);
  return Math.sqrt(dx * dx + dy * dy + dz * dz + a * a);
}

/**
 * Power dissipated in the soil by the contacts' own spreading, watts: ½ Re Σ_ce I_c* Z_ce I_e over the
 * quasi-static point-charge terms Z_ce = (η/4πk)(1 − κ)/(jR_ce) — the hemisphere impedances and the
 * sharing between contacts at the same spot. Quasi-static on purpose: the retardation e^{−jkR} of the
 * full term carries a radiation-like part that cancels inside each charge-neutral basis and is not
 * dissipation. `current(c)` is contact c's charge times jω (the current into the soil, up to a sign
 * common to all contacts); `factor` is 1 − κ.
 */
export function contactSpreadingLoss(
  nodes: readonly SoilContactNode[],
  factor: ArrayLike<number>,
  f: GroundFrequency,
  current: (c: SoilContactNode) => [number, number],
): number {
  const s0 = f.eta / (4 * Math.PI * f.k);
  // Re[(−j s0 F)/R] = s0 Im(F)/R; the form is real-symmetric, so Re Σ I_c* (·) I_e = Σ (·) Re(I_c* I_e).
  const w = s0 * factor[1];
  let p = 0;
  const I = nodes.map(current);
  for (let c = 0; c < nodes.length; c++) {
    for (let e = 0; e < nodes.length; e++) {
      const R = contactDistance(nodes[c], nodes[e]); // its own radius when c = e
      const re = I[c][0] * I[e][0] + I[c][1] * I[e][1];
      p += (0.5 * w * re) / R;
    }
  }
  return p;
}

/**
 * The point-charge term between contacts c and e, ohms: (jη/4π)(−1/k)(1 − κ) d_c d_e e^{−jkR}/R with R
 * from contactDistance — for c = e the contact's own term, R = a (its hemisphere). Into out[0..1].
 */
export function contactPairImpedance(
  c: SoilContactNode,
  e: SoilContactNode,
  factor: ArrayLike<number>,
  f: GroundFrequency,
  out: Float64Array,
): void {
  const R = contactDistance(c, e);
  const d = c.divergence * e.divergence;
  const gr = Math.cos(f.k * R) / R;
  const gi = -Math.sin(f.k * R) / R;
  const s0 = (d * f.eta) / (4 * Math.PI * f.k);
  // −j s0 (F)(g) with F·g = (fr gr − fi gi) + j(fr gi + fi gr)
  const pr = factor[0] * gr - factor[1] * gi;
  const pi = factor[0] * gi + factor[1] * gr;
  out[0] = s0 * pi;
  out[1] = -s0 * pr;
}

/** The contact's own point-charge term, ohms: (jη/4π)(−1/k)(1 − κ) e^{−jka}/a, into out[0..1]. */
export function contactSelfImpedance(
  node: SoilContactNode,
  factor: ArrayLike<number>,
  f: GroundFrequency,
  out: Float64Array,
): void {
  contactPairImpedance(node, node, factor, f, out);
}

/**
 * ADD the point-charge terms of every rigorous soil contact into Z (n×n row-major, re/im split): point
 * against the line charge of every piece (both orders), and point against point.
 */
export function addSoilContacts(
  mesh: Mesh,
  nodes: readonly SoilContactNode[],
  ground: GroundKernel,
  f: GroundFrequency,
  zr: Float64Array,
  zi: Float64Array,
  n: number,
  factor: Float64Array,
  g: Float64Array,
): void {
  const soilContact = ground.soilContact;
  if (!soilContact || nodes.length === 0) return;
  // Every contact of one ground takes the same factor 1 − κ: fetch it once, keep the contacts it covers.
  const active = nodes.filter((nc) => soilContact(nc.wire, factor));
  const S = mesh.segs;
  const sps = mesh.segPieceStart;
  const s0 = f.eta / (4 * Math.PI * f.k);
  for (const nc of active) {
    // pre = (jη/4π)(−1/k)(1 − κ)·d_c = −j s0 F d_c
    const pr = s0 * factor[1] * nc.divergence;
    const pi = -s0 * factor[0] * nc.divergence;
    const mc = nc.basis;
    for (let q = 0; q < S.n; q++) {
      if (sps[q] === sps[q + 1]) continue;
      pointSegmentIntegral(mesh, q, nc.x, nc.y, nc.z, f.k, g);
      const vr0 = pr * g[0] - pi * g[1];
      const vi0 = pr * g[1] + pi * g[0];
      const invL = 1 / S.len[q];
      for (let b = sps[q]; b < sps[q + 1]; b++) {
        const pc = mesh.segPieces[b];
        const mb = mesh.pieceBasis[pc];
        // Line divergence of the piece: sign·(±1/ℓ) (u rises, 1 − u falls, along the segment).
        const div = mesh.pieceSign[pc] * (mesh.pieceAtEnd[pc] ? invL : -invL);
        zr[mc * n + mb] += div * vr0;
        zi[mc * n + mb] += div * vi0;
        zr[mb * n + mc] += div * vr0;
        zi[mb * n + mc] += div * vi0;
      }
    }
    // Point against point, itself included (its hemisphere); each ordered pair once.
    for (const ne of active) {
      contactPairImpedance(nc, ne, factor, f, g);
      zr[mc * n + ne.basis] += g[0];
      zi[mc * n + ne.basis] += g[1];
    }
  }
}
