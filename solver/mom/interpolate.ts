/**
 * Band interpolation of the interaction matrix (Newman, "Matrix interpolation for efficient
 * computation of the frequency response", IEEE Trans. AP-36, 1988): with the dominant phase e^{−jkR_mn}
 * of each entry taken out, what remains varies slowly with frequency and a quadratic through three full
 * fills reproduces it across a band. We interpolate f·Z_mn·e^{jkR_mn}: the factor f turns the
 * mixed-potential form k·A − Φ/k into k²·A − Φ, so the 1/f of the scalar-potential part is exact.
 * R_mn is the distance between the two triangles' peak nodes; the ground's reflected part, filled
 * separately, uses the distance to the image of the source node (x, y, −z).
 * Only the interaction part is interpolated; loads, conductor loss and ground-node impedances are added
 * exactly at each frequency by the caller.
 */

import type { Mesh } from "../geometry/types";
import type { GroundKernel } from "../ground/kernel";
import { C0, ETA0 } from "../model/constants";
import { type FillScratch, fillMatrix } from "./fill";

/** Peak node of each basis, xyz flattened. */
export function basisCentres(mesh: Mesh): Float64Array {
  const c = new Float64Array(3 * mesh.nBasis);
  const seen = new Uint8Array(mesh.nBasis);
  const S = mesh.segs;
  for (let pc = 0; pc < mesh.pieceBasis.length; pc++) {
    const m = mesh.pieceBasis[pc];
    if (seen[m]) continue;
    seen[m] = 1;
    const s = mesh.pieceSeg[pc];
    const t = mesh.pieceAtEnd[pc] ? S.len[s] : 0;
    for (let d = 0; d < 3; d++) c[3 * m + d] = S.start[3 * s + d] + t * S.dir[3 * s + d];
  }
  return c;
}

interface Part {
  kind: "free" | "ground";
  /** Phase distance per upper-triangle entry (row-major packed, j ≥ i). */
  R: Float64Array;
  /**
   * Per packed entry, interleaved (stride 10) so one pass streams through memory:
   * [c0 re, c0 im, c1 re, c1 im, c2 re, c2 im, e^{−jkR} re, im, e^{−jΔkR} re, im]
   * with the quadratic c0 + c1 x + c2 x² in x = (f − f0)/h.
   */
  d: Float64Array;
}

const STRIDE = 10;

/**
 * Built once per prepared model (buffers and phase distances are frequency independent), then
 * `fit(fLo, fHi)` per band: three fills per part, no allocation. Z is symmetric, so only the upper
 * triangle is stored and interpolated.
 */
export class BandInterpolator {
  fLo = Number.NaN;
  fHi = Number.NaN;
  private readonly n: number;
  private readonly nUpper: number;
  private f0 = Number.NaN;
  private h = Number.NaN;
  private readonly parts: Part[] = [];
  /** Wavenumber of the last call and the step that led to it (NaN: none yet). */
  private lastK = Number.NaN;
  private lastDk = Number.NaN;

  constructor(
    private readonly mesh: Mesh,
    private readonly ground: GroundKernel,
  ) {
    const n = mesh.nBasis;
    this.n = n;
    this.nUpper = (n * (n + 1)) / 2;
    const centres = basisCentres(mesh);
    const kinds: ("free" | "ground")[] = ground.hasPairTerms ? ["free", "ground"] : ["free"];
    for (const kind of kinds) {
      const R = new Float64Array(this.nUpper);
      let t = 0;
      for (let a = 0; a < n; a++) {
        for (let b = a; b < n; b++, t++) {
          const dx = centres[3 * a] - centres[3 * b];
          const dy = centres[3 * a + 1] - centres[3 * b + 1];
          const dz =
            kind === "free"
              ? centres[3 * a + 2] - centres[3 * b + 2]
              : centres[3 * a + 2] + centres[3 * b + 2];
          R[t] = Math.sqrt(dx * dx + dy * dy + dz * dz);
        }
      }
      this.parts.push({ kind, R, d: new Float64Array(STRIDE * this.nUpper) });
    }
  }

  /** Fit the band [fLo, fHi] (Hz) from full fills at its ends and middle; zr/zi/scratch are work space. */
  fit(fLo: number, fHi: number, scratch: FillScratch, zr: Float64Array, zi: Float64Array): void {
    const n = this.n;
    this.fLo = fLo;
    this.fHi = fHi;
    this.f0 = 0.5 * (fLo + fHi);
    this.h = 0.5 * (fHi - fLo);
    this.lastK = Number.NaN;
    this.lastDk = Number.NaN;
    for (const part of this.parts) {
      const { R, d } = part;
      // Samples s(x) of f·Z·e^{+jkR} at x = −1, 0, 1: c0 = s0, c1 = (s1 − s−1)/2, c2 = (s1 + s−1)/2 − s0.
      // s−1 is parked in c2 and s0 in c0 until s1 arrives.
      for (const x of [-1, 0, 1]) {
        const f = this.f0 + x * this.h;
        const omega = 2 * Math.PI * f;
        const k = omega / C0;
        const fr = { frequencyHz: f, omega, k, eta: ETA0 };
        this.ground.beginFrequency(fr);
        fillMatrix(this.mesh, this.ground, fr, zr, zi, scratch, part.kind);
        let t = 0;
        for (let a = 0; a < n; a++) {
          for (let b = a; b < n; b++, t++) {
            const i = a * n + b;
            const ph = k * R[t];
            const c = Math.cos(ph) * f;
            const sn = Math.sin(ph) * f;
            const sr = zr[i] * c - zi[i] * sn;
            const si = zr[i] * sn + zi[i] * c;
            const o = STRIDE * t;
            if (x === -1) {
              d[o + 4] = sr;
              d[o + 5] = si;
            } else if (x === 0) {
              d[o] = sr;
              d[o + 1] = si;
            } else {
              d[o + 2] = 0.5 * (sr - d[o + 4]);
              d[o + 3] = 0.5 * (si - d[o + 5]);
              d[o + 4] = 0.5 * (sr + d[o + 4]) - d[o];
              d[o + 5] = 0.5 * (si + d[o + 5]) - d[o + 1];
            }
          }
        }
      }
    }
  }

  /**
   * Overwrite Z with the interpolated interaction matrix at f (Hz).
   * WHY the phasor bookkeeping: the n² phases e^{−jkR} cost more than the interpolation itself. On a
   * uniform sweep (the usual case) each step is one complex rotation per entry by a stored e^{−jΔkR};
   * trigonometry runs only for the first point and when the step changes.
   */
  matrixAt(f: number, zr: Float64Array, zi: Float64Array): void {
    const n = this.n;
    const x = (f - this.f0) / this.h;
    const x2 = x * x;
    const k = (2 * Math.PI * f) / C0;
    const invF = 1 / f;
    const dk = k - this.lastK;
    const mode = Number.isNaN(dk) ? 0 : Math.abs(dk - this.lastDk) <= 1e-9 * Math.abs(dk) ? 2 : 1;
    for (let pi = 0; pi < this.parts.length; pi++) {
      const { R, d } = this.parts[pi];
      const first = pi === 0;
      let t = 0;
      for (let a = 0; a < n; a++) {
        const row = a * n;
        for (let b = a; b < n; b++, t++) {
          const o = STRIDE * t;
          let pr: number;
          let pim: number;
          if (mode === 2) {
            const er = d[o + 6];
            const ei = d[o + 7];
            const rr = d[o + 8];
            const ri = d[o + 9];
            pr = er * rr - ei * ri;
            pim = er * ri + ei * rr;
          } else if (mode === 1) {
            const rr = Math.cos(dk * R[t]);
            const ri = -Math.sin(dk * R[t]);
            d[o + 8] = rr;
            d[o + 9] = ri;
            const er = d[o + 6];
            const ei = d[o + 7];
            pr = er * rr - ei * ri;
            pim = er * ri + ei * rr;
          } else {
            pr = Math.cos(k * R[t]);
            pim = -Math.sin(k * R[t]);
          }
          d[o + 6] = pr;
          d[o + 7] = pim;
          const ar = (d[o] + x * d[o + 2] + x2 * d[o + 4]) * invF;
          const ai = (d[o + 1] + x * d[o + 3] + x2 * d[o + 5]) * invF;
          const vr = ar * pr - ai * pim;
          const vi = ar * pim + ai * pr;
          if (first) {
            zr[row + b] = vr;
            zi[row + b] = vi;
          } else {
            zr[row + b] += vr;
            zi[row + b] += vi;
          }
        }
      }
    }
    for (let r = 1; r < n; r++) {
      for (let c = 0; c < r; c++) {
        zr[r * n + c] = zr[c * n + r];
        zi[r * n + c] = zi[c * n + r];
      }
    }
    if (mode !== 2) this.lastDk = dk;
    this.lastK = k;
  }
}
