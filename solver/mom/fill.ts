/**
 * Impedance-matrix fill: Galerkin with triangle bases, mixed-potential EFIE, e^{jωt}
 * (Harrington 1968 ch. 4; Gibson, The Method of Moments in Electromagnetics, thin-wire chapter):
 *
 *   Z_mn = (jη/4π) [ k ∫∫ (t̂_m·t̂_n) Λ_m Λ_n G  −  (1/k) ∫∫ Λ′_m Λ′_n G ]      (+ ground terms)
 *
 * Each basis is made of pieces sign·u or sign·(1 − u) on single segments, so each segment pair (p, q)
 * needs only the four integrals J_ab of pair-integrals.ts; they are scattered into every pair of pieces
 * on p and q. Z is symmetric (reciprocity): only p ≤ q are computed and mirrored.
 */

import type { Mesh } from "../geometry/types";
import type { GroundFrequency, GroundKernel } from "../ground/kernel";
import { findRuns, PairCache } from "./pair-cache";
import { addSoilContacts, type SoilContactNode, soilContactNodes } from "./soil-contact";

export interface FillScratch {
  j: Float64Array;
  g: Float64Array;
  /** Per-pair combined piece values: [vector(ea, eb) re/im for 4 combos, scalar re/im]. */
  c: Float64Array;
  /** The pieces in segment order (index = position in mesh.segPieces), flattened for the scatter. */
  basis: Int32Array;
  atEnd: Uint8Array;
  sign: Float64Array;
  /** Free-space pair integrals shared along straight evenly cut runs. */
  cache: PairCache;
  /** Grounded wire ends, for the point charge of a rigorous soil contact (soil-contact.ts). */
  contacts: SoilContactNode[];
  /** Two scratch complex numbers for the contact terms. */
  t1: Float64Array;
  t2: Float64Array;
}

/** `reusePairs: false` turns the run cache off (tests compare both ways). */
export function makeFillScratch(mesh: Mesh, reusePairs = true): FillScratch {
  const np = mesh.segPieces.length;
  const basis = new Int32Array(np);
  const atEnd = new Uint8Array(np);
  const sign = new Float64Array(np);
  for (let i = 0; i < np; i++) {
    const pc = mesh.segPieces[i];
    basis[i] = mesh.pieceBasis[pc];
    atEnd[i] = mesh.pieceAtEnd[pc];
    sign[i] = mesh.pieceSign[pc];
  }
  const cache = new PairCache(mesh.segs, mesh.segs, findRuns(mesh.segs, mesh.view.wireOfSegment), reusePairs);
  return {
    j: new Float64Array(8),
    g: new Float64Array(10),
    c: new Float64Array(10),
    basis,
    atEnd,
    sign,
    cache,
    contacts: soilContactNodes(mesh),
    t1: new Float64Array(2),
    t2: new Float64Array(2),
  };
}

/** Which terms to fill: both, only the free-space kernel, or only the ground's reflected terms. */
export type FillParts = "all" | "free" | "ground";

/** Overwrite Z (n×n row-major, split re/im) with the free-space + ground interaction matrix. */
export function fillMatrix(
  mesh: Mesh,
  ground: GroundKernel,
  f: GroundFrequency,
  zr: Float64Array,
  zi: Float64Array,
  w: FillScratch,
  parts: FillParts = "all",
): void {
  const n = mesh.nBasis;
  zr.fill(0, 0, n * n);
  zi.fill(0, 0, n * n);
  const S = mesh.segs;
  const nSeg = S.n;
  const sps = mesh.segPieceStart;
  const k = f.k;
  const J = w.j;
  const G = w.g;
  const withGround = parts !== "free" && ground.hasPairTerms;
  const groundInLoop = withGround && ground.symmetric;
  const withFree = parts !== "ground";
  if (!withFree) J.fill(0); // ground-only fill: the free-space integrals stay zero
  w.cache.begin(k);
  for (let p = 0; p < nSeg && (withFree || groundInLoop); p++) {
    if (sps[p] === sps[p + 1]) continue;
    for (let q = p; q < nSeg; q++) {
      if (sps[q] === sps[q + 1]) continue;
      if (withFree) w.cache.get(p, q, J);
      for (let i = 0; i < 10; i++) G[i] = 0;
      if (groundInLoop) ground.pairTerms(p, q, G);
      combine(S.dir, p, q, J, G, k, f.eta, w.c);
      scatter(w, sps, S.len, p, q, w.c, zr, zi, n, true);
    }
  }
  if (withGround && !ground.symmetric) {
    // Ground terms that are not symmetric per pair: every ordered pair, no mirroring.
    J.fill(0);
    for (let p = 0; p < nSeg; p++) {
      if (sps[p] === sps[p + 1]) continue;
      for (let q = 0; q < nSeg; q++) {
        if (sps[q] === sps[q + 1]) continue;
        G.fill(0);
        ground.pairTerms(p, q, G);
        combine(S.dir, p, q, J, G, k, f.eta, w.c);
        scatter(w, sps, S.len, p, q, w.c, zr, zi, n, false);
      }
    }
  }
  // The soil's share of a bare contact is a reflected-field term: it goes with the ground part (its
  // phase distance from a point on z = 0 is the same to a source and to the source's image).
  if (parts !== "free") addSoilContacts(mesh, w.contacts, ground, f, zr, zi, n, w.t1, w.t2);
}

/**
 * Turn the pair integrals into the five numbers the pieces need, already scaled by jη/4π:
 * c[0..7] vector part for (ea, eb) = (0,0), (1,0), (0,1), (1,1) (piece u if e = 1, 1 − u if e = 0);
 * c[8..9] the scalar part −(1/k)∫∫G_φ, to be multiplied by the two piece slopes (±1/ℓ).
 */
function combine(
  dir: Float64Array,
  p: number,
  q: number,
  J: Float64Array,
  G: Float64Array,
  k: number,
  eta: number,
  c: Float64Array,
): void {
  const dot = dir[3 * p] * dir[3 * q] + dir[3 * p + 1] * dir[3 * q + 1] + dir[3 * p + 2] * dir[3 * q + 2];
  const s = eta / (4 * Math.PI);
  for (let part = 0; part < 2; part++) {
    const j00 = dot * J[part] + G[part];
    const j10 = dot * J[2 + part] + G[2 + part];
    const j01 = dot * J[4 + part] + G[4 + part];
    const j11 = dot * J[6 + part] + G[6 + part];
    c[part] = k * (j00 - j10 - j01 + j11);
    c[2 + part] = k * (j10 - j11);
    c[4 + part] = k * (j01 - j11);
    c[6 + part] = k * j11;
    c[8 + part] = -(J[part] + G[8 + part]) / k;
  }
  // Multiply by jη/4π: (x + jy)·j = −y + jx.
  for (let i = 0; i < 10; i += 2) {
    const x = c[i];
    c[i] = -s * c[i + 1];
    c[i + 1] = s * x;
  }
}

function scatter(
  w: FillScratch,
  sps: Int32Array,
  len: Float64Array,
  p: number,
  q: number,
  c: Float64Array,
  zr: Float64Array,
  zi: Float64Array,
  n: number,
  mirror: boolean,
): void {
  const pb = w.basis;
  const pe = w.atEnd;
  const sg = w.sign;
  const invLp = 1 / len[p];
  const invLq = 1 / len[q];
  const c8 = c[8];
  const c9 = c[9];
  const a1 = sps[p + 1];
  const b0 = sps[q];
  const b1 = sps[q + 1];
  for (let a = sps[p]; a < a1; a++) {
    const ea = pe[a];
    const ma = pb[a];
    const da = ea ? invLp : -invLp;
    const sa = sg[a];
    for (let b = b0; b < b1; b++) {
      const eb = pe[b];
      const mb = pb[b];
      const sc = da * (eb ? invLq : -invLq);
      const ss = sa * sg[b];
      const idx = 2 * (ea + 2 * eb);
      const vr = ss * (c[idx] + sc * c8);
      const vi = ss * (c[idx + 1] + sc * c9);
      zr[ma * n + mb] += vr;
      zi[ma * n + mb] += vi;
      if (mirror && p !== q) {
        zr[mb * n + ma] += vr;
        zi[mb * n + ma] += vi;
      }
    }
  }
}
