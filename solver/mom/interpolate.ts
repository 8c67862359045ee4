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

export class BandInterpolator {
  readonly fLo: number;
  readonly fHi: number;
  private readonly n: number;
  private readonly f0: number;
  private readonly h: number;
  private readonly parts: Part[] = [];
  /** Wavenumber of the last call and the step that led to it (NaN: none yet). */
  private lastK = Number.NaN;
  private lastDk = Number.NaN;

  constructor(
    mesh: Mesh,
    ground: GroundKernel,
    fLo: number,
    fHi: number,
    scratch: FillScratch,
    zr: Float64Array,
    zi: Float64Array,
  ) {
    const n = mesh.nBasis;
    this.n = n;
    this.fLo = fLo;
    this.fHi = fHi;
    this.f0 = 0.5 * (fLo + fHi);
    this.h = 0.5 * (fHi - fLo);
    const centres = basisCentres(mesh);
    const kinds: ("free" | "ground")[] = ground.hasPairTerms ? ["free", "ground"] : ["free"];
    for (const kind of kinds) {
      const R = new Float64Array(n * n);
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
      // Samples at x = −1, 0, 1 → c0 = s0, c1 = (s1 − s−1)/2, c2 = (s1 + s−1)/2 − s0.
      const samples: Float64Array[] = [];
      for (const x of [-1, 0, 1]) {
        const f = this.f0 + x * this.h;
        const omega = 2 * Math.PI * f;
        const k = omega / C0;
        ground.beginFrequency({ frequencyHz: f, omega, k, eta: ETA0 });
        fillMatrix(mesh, ground, { frequencyHz: f, omega, k, eta: ETA0 }, zr, zi, scratch, kind);
        const sr = new Float64Array(n * n);
        const si = new Float64Array(n * n);
        for (let i = 0; i < n * n; i++) {
          const ph = k * R[i];
          const c = Math.cos(ph) * f;
          const s = Math.sin(ph) * f;
          // f·Z·e^{+jkR}
          sr[i] = zr[i] * c - zi[i] * s;
          si[i] = zr[i] * s + zi[i] * c;
        }
        samples.push(sr, si);
      }
      const [mr, mi, zr0, zi0, pr, pi] = samples;
      const c1r = new Float64Array(n * n);
      const c1i = new Float64Array(n * n);
      const c2r = new Float64Array(n * n);
      const c2i = new Float64Array(n * n);
      for (let i = 0; i < n * n; i++) {
        c1r[i] = 0.5 * (pr[i] - mr[i]);
        c1i[i] = 0.5 * (pi[i] - mi[i]);
        c2r[i] = 0.5 * (pr[i] + mr[i]) - zr0[i];
        c2i[i] = 0.5 * (pi[i] + mi[i]) - zi0[i];
      }
      this.parts.push({
        c: [zr0, zi0, c1r, c1i, c2r, c2i],
        R,
        phR: new Float64Array(n * n),
        phI: new Float64Array(n * n),
        rotR: new Float64Array(n * n),
        rotI: new Float64Array(n * n),
      });
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
    zr.fill(0, 0, n2);
    zi.fill(0, 0, n2);
    for (const part of this.parts) {
      const [c0r, c0i, c1r, c1i, c2r, c2i] = part.c;
      const { R, phR, phI, rotR, rotI } = part;
      if (mode === 0) {
        for (let i = 0; i < n2; i++) {
          phR[i] = Math.cos(k * R[i]);
          phI[i] = -Math.sin(k * R[i]);
        }
      } else {
        if (mode === 1) {
          for (let i = 0; i < n2; i++) {
            rotR[i] = Math.cos(dk * R[i]);
            rotI[i] = -Math.sin(dk * R[i]);
          }
        }
        for (let i = 0; i < n2; i++) {
          const a = phR[i];
          const b = phI[i];
          phR[i] = a * rotR[i] - b * rotI[i];
          phI[i] = a * rotI[i] + b * rotR[i];
        }
      }
      for (let i = 0; i < n2; i++) {
        const ar = (c0r[i] + x * c1r[i] + x2 * c2r[i]) * invF;
        const ai = (c0i[i] + x * c1i[i] + x2 * c2i[i]) * invF;
        const pr = phR[i];
        const pi = phI[i];
        zr[i] += ar * pr - ai * pi;
        zi[i] += ar * pi + ai * pr;
      }
    }
    if (mode !== 2) this.lastDk = dk;
    this.lastK = k;
  }
}
