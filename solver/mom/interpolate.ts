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
import { C0, ETA0 } from "./constants";
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
  /** Quadratic coefficients in x = (f − f0)/h, split re/im: c0 + c1 x + c2 x². */
  c: Float64Array[];
  /** Phase distance per entry. */
  R: Float64Array;
  /** e^{−jkR} at the last frequency served, and the rotation e^{−jΔkR} of the last step. */
  phR: Float64Array;
  phI: Float64Array;
  rotR: Float64Array;
  rotI: Float64Array;
}

/**
 * Built once per prepared model (buffers and phase distances are frequency independent), then
 * `fit(fLo, fHi)` per band: three fills per part, no allocation.
 */
export class BandInterpolator {
  fLo = Number.NaN;
  fHi = Number.NaN;
  private readonly n: number;
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
    const centres = basisCentres(mesh);
    const kinds: ("free" | "ground")[] = ground.hasPairTerms ? ["free", "ground"] : ["free"];
    const n2 = n * n;
    for (const kind of kinds) {
      const R = new Float64Array(n2);
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) {
          const dx = centres[3 * a] - centres[3 * b];
          const dy = centres[3 * a + 1] - centres[3 * b + 1];
          const dz =
            kind === "free"
              ? centres[3 * a + 2] - centres[3 * b + 2]
              : centres[3 * a + 2] + centres[3 * b + 2];
          R[a * n + b] = Math.sqrt(dx * dx + dy * dy + dz * dz);
        }
      }
      const c = Array.from({ length: 6 }, () => new Float64Array(n2));
      this.parts.push({
        kind,
        c,
        R,
        phR: new Float64Array(n2),
        phI: new Float64Array(n2),
        rotR: new Float64Array(n2),
        rotI: new Float64Array(n2),
      });
    }
  }

  /** Fit the band [fLo, fHi] (Hz) from full fills at its ends and middle; zr/zi/scratch are work space. */
  fit(fLo: number, fHi: number, scratch: FillScratch, zr: Float64Array, zi: Float64Array): void {
    const n2 = this.n * this.n;
    this.fLo = fLo;
    this.fHi = fHi;
    this.f0 = 0.5 * (fLo + fHi);
    this.h = 0.5 * (fHi - fLo);
    this.lastK = Number.NaN;
    this.lastDk = Number.NaN;
    for (const part of this.parts) {
      const [c0r, c0i, c1r, c1i, c2r, c2i] = part.c;
      const R = part.R;
      // Samples s(x) of f·Z·e^{+jkR} at x = −1, 0, 1: c0 = s0, c1 = (s1 − s−1)/2, c2 = (s1 + s−1)/2 − s0.
      // s−1 is parked in c2 and s0 in c0 until s1 arrives.
      for (const x of [-1, 0, 1]) {
        const f = this.f0 + x * this.h;
        const omega = 2 * Math.PI * f;
        const k = omega / C0;
        const fr = { frequencyHz: f, omega, k, eta: ETA0 };
        this.ground.beginFrequency(fr);
        fillMatrix(this.mesh, this.ground, fr, zr, zi, scratch, part.kind);
        for (let i = 0; i < n2; i++) {
          const ph = k * R[i];
          const c = Math.cos(ph) * f;
          const s = Math.sin(ph) * f;
          const sr = zr[i] * c - zi[i] * s;
          const si = zr[i] * s + zi[i] * c;
          if (x === -1) {
            c2r[i] = sr;
            c2i[i] = si;
          } else if (x === 0) {
            c0r[i] = sr;
            c0i[i] = si;
          } else {
            c1r[i] = 0.5 * (sr - c2r[i]);
            c1i[i] = 0.5 * (si - c2i[i]);
            c2r[i] = 0.5 * (sr + c2r[i]) - c0r[i];
            c2i[i] = 0.5 * (si + c2i[i]) - c0i[i];
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
    const n2 = this.n * this.n;
    const x = (f - this.f0) / this.h;
    const x2 = x * x;
    const k = (2 * Math.PI * f) / C0;
    const invF = 1 / f;
    const dk = k - this.lastK;
    const mode = Number.isNaN(dk) ? 0 : Math.abs(dk - this.lastDk) <= 1e-9 * Math.abs(dk) ? 2 : 1;
    const n = this.n;
    zr.fill(0, 0, n2);
    zi.fill(0, 0, n2);
    // Z is symmetric: work on the upper triangle (j ≥ i) only, mirror at the end.
    for (const part of this.parts) {
      const [c0r, c0i, c1r, c1i, c2r, c2i] = part.c;
      const { R, phR, phI, rotR, rotI } = part;
      for (let r = 0; r < n; r++) {
        const i0 = r * n + r;
        const i1 = r * n + n;
        if (mode === 0) {
          for (let i = i0; i < i1; i++) {
            phR[i] = Math.cos(k * R[i]);
            phI[i] = -Math.sin(k * R[i]);
          }
        } else {
          if (mode === 1) {
            for (let i = i0; i < i1; i++) {
              rotR[i] = Math.cos(dk * R[i]);
              rotI[i] = -Math.sin(dk * R[i]);
            }
          }
          for (let i = i0; i < i1; i++) {
            const a = phR[i];
            const b = phI[i];
            phR[i] = a * rotR[i] - b * rotI[i];
            phI[i] = a * rotI[i] + b * rotR[i];
          }
        }
        for (let i = i0; i < i1; i++) {
          const ar = (c0r[i] + x * c1r[i] + x2 * c2r[i]) * invF;
          const ai = (c0i[i] + x * c1i[i] + x2 * c2i[i]) * invF;
          const pr = phR[i];
          const pi = phI[i];
          zr[i] += ar * pr - ai * pi;
          zi[i] += ar * pi + ai * pr;
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
