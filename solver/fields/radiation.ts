/**
 * The radiation vector on the whole direction grid, as its θ̂ and φ̂ components
 *   θ̂ = (sin e sin b, sin e cos b, −cos e),  φ̂ = (−cos b, sin b, 0)
 * (θ = 90° − e from the zenith; φ̂ is horizontal, θ̂ lies in the vertical plane of the ray).
 *
 * A straight run of n equal segments with node currents I_0..I_n carries Σ_k I_k Λ_k(l) (full triangles,
 * halved at the two ends). With κ = k r̂·t̂, x = κℓ/2 and z = e^{jκℓ} = e^{2jx}, its transform is
 *   ∫ I(l) e^{jκl} dl = ℓ (sin x/x)² Σ_k I_k z^k − I_0 H̄ − I_n H z^n,
 *   H = ∫_0^ℓ (1 − l/ℓ) e^{jκl} dl = ℓ [ (sin x/x)²/2 + j (x − sin x cos x)/(2x²) ],
 * (the full triangle's transform is ℓ sinc²; the H terms remove the halves hanging past the run's ends).
 * The polynomial is summed by Horner's rule: one complex multiply-add per node and direction, and only
 * two sine/cosine pairs per run and direction. Checked against the per-segment form in reference.ts.
 */

import type { DirectionGrid } from "./grid";
import type { Runs } from "./runs";
import { halfTriangleIm } from "./segment-transforms";

/** Radiation-vector components on the grid, row-major [elevation][bearing], ampere-metres. */
export interface RadiationGrid {
  thRe: Float64Array;
  thIm: Float64Array;
  phRe: Float64Array;
  phIm: Float64Array;
}

let scratch: RadiationGrid | undefined;
let bearingScratch = new Float64Array(0);

/** Fills (and returns) module-owned scratch arrays; valid until the next call. */
export function radiationGrid(grid: DirectionGrid, runs: Runs, k: number): RadiationGrid {
  const nE = grid.cosE.length;
  const nB = grid.sinB.length;
  const size = nE * nB;
  if (!scratch || scratch.thRe.length !== size) {
    scratch = {
      thRe: new Float64Array(size),
      thIm: new Float64Array(size),
      phRe: new Float64Array(size),
      phIm: new Float64Array(size),
    };
  }
  const { thRe, thIm, phRe, phIm } = scratch;
  thRe.fill(0);
  thIm.fill(0);
  phRe.fill(0);
  phIm.fill(0);
  if (bearingScratch.length < 3 * nB) bearingScratch = new Float64Array(3 * nB);
  const tb = bearingScratch.subarray(0, nB);
  const pb = bearingScratch.subarray(nB, 2 * nB);
  const fph = bearingScratch.subarray(2 * nB, 3 * nB);
  const { cosE, sinE, sinB, cosB } = grid;
  const { nodeRe, nodeIm } = runs;

  for (let r = 0; r < runs.count; r++) {
    const n = runs.segments[r];
    const off = runs.nodeOffset[r];
    const ell = runs.segmentLength[r];
    const tx = runs.direction[3 * r];
    const ty = runs.direction[3 * r + 1];
    const tz = runs.direction[3 * r + 2];
    const px = runs.origin[3 * r];
    const py = runs.origin[3 * r + 1];
    const pz = runs.origin[3 * r + 2];
    // Horizontal parts of r̂·t̂, r̂·p0 (over cos e) and φ̂·t̂ depend on the bearing only.
    for (let j = 0; j < nB; j++) {
      tb[j] = sinB[j] * tx + cosB[j] * ty;
      pb[j] = sinB[j] * px + cosB[j] * py;
      fph[j] = -cosB[j] * tx + sinB[j] * ty;
    }
    const halfKl = 0.5 * k * ell;
    const i0Re = nodeRe[off];
    const i0Im = nodeIm[off];
    const inRe = nodeRe[off + n];
    const inIm = nodeIm[off + n];
    for (let i = 0; i < nE; i++) {
      const ce = cosE[i];
      const se = sinE[i];
      const row = i * nB;
      for (let j = 0; j < nB; j++) {
        const x = halfKl * (ce * tb[j] + se * tz);
        const sx = Math.sin(x);
        const cx = Math.cos(x);
        let sinc: number;
        if (Math.abs(x) < 0.1) {
          const x2 = x * x;
          sinc = 1 - (x2 / 6) * (1 - (x2 / 20) * (1 - (x2 / 42) * (1 - x2 / 72)));
        } else sinc = sx / x;
        const alpha = ell * sinc * sinc;
        const hRe = 0.5 * alpha;
        const hIm = ell * halfTriangleIm(x, sx, cx);
        const zRe = cx * cx - sx * sx;
        const zIm = 2 * sx * cx;
        // Horner: P = Σ_k I_k z^k.
        let pRe = inRe;
        let pIm = inIm;
        for (let m = off + n - 1; m >= off; m--) {
          const t = pRe * zRe - pIm * zIm + nodeRe[m];
          pIm = pRe * zIm + pIm * zRe + nodeIm[m];
          pRe = t;
        }
        // w = z^n by repeated squaring.
        let wRe = 1;
        let wIm = 0;
        let bRe = zRe;
        let bIm = zIm;
        for (let e = n; e > 0; e >>= 1) {
          if (e & 1) {
            const t = wRe * bRe - wIm * bIm;
            wIm = wRe * bIm + wIm * bRe;
            wRe = t;
          }
          const t = bRe * bRe - bIm * bIm;
          bIm = 2 * bRe * bIm;
          bRe = t;
        }
        // I_n H w
        const ehRe = inRe * hRe - inIm * hIm;
        const ehIm = inRe * hIm + inIm * hRe;
        const endRe = ehRe * wRe - ehIm * wIm;
        const endIm = ehRe * wIm + ehIm * wRe;
        // sum = α P − I_0 H̄ − I_n H z^n
        const sRe = alpha * pRe - (i0Re * hRe + i0Im * hIm) - endRe;
        const sIm = alpha * pIm - (i0Im * hRe - i0Re * hIm) - endIm;
        const psi = k * (ce * pb[j] + se * pz);
        const c0 = Math.cos(psi);
        const s0 = Math.sin(psi);
        const qRe = sRe * c0 - sIm * s0;
        const qIm = sRe * s0 + sIm * c0;
        const fth = se * tb[j] - ce * tz;
        const f = fph[j];
        const idx = row + j;
        thRe[idx] += fth * qRe;
        thIm[idx] += fth * qIm;
        phRe[idx] += f * qRe;
        phIm[idx] += f * qIm;
      }
    }
  }
  return scratch;
}
