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
 * The polynomial is summed by Horner's rule: one complex multiply-add per node and direction, two
 * directions at a time so the two dependency chains overlap. Per run and direction there is one fast
 * sine/cosine pair for the phase of the run's first node, and a short polynomial for x.
 * A horizontal run has the same x at e and −e, so its sum is shared by the mirrored rows; only the
 * vertical phase e^{±jk z sin e} differs. Checked against the per-segment form in reference.ts.
 */

import type { DirectionGrid } from "./grid";
import type { Runs } from "./runs";

// Fast sin/cos: reduction by the nearest multiple of π/2 in two parts (Cody–Waite; q·PIO2_HI is exact for
// |q| < 2^20), then the minimax kernels of fdlibm's __kernel_sin/__kernel_cos (Sun Microsystems, freely
// distributable; the basis of most C libraries), ~1 ulp on |r| ≤ π/4 — about 3× Math.sin + Math.cos. Everything
// in the loop below is written out by hand: a call that V8 does not inline boxes its double arguments,
// which costs more than the arithmetic here.
const TWO_OVER_PI = 0.6366197723675814;
const PIO2_HI = 1.5707963267341256;
const PIO2_LO = 6.077100506506192e-11;
const S1 = -0.16666666666666632;
const S2 = 0.00833333333332249;
const S3 = -0.0001984126982985795;
const S4 = 0.0000027557313707070068;
const S5 = -2.5050760253406863e-8;
const S6 = 1.58969099521155e-10;
const C1 = 0.0416666666666666;
const C2 = -0.001388888888887411;
const C3 = 0.00002480158728947673;
const C4 = -2.7557314351390663e-7;
const C5 = 2.087572321298175e-9;
const C6 = -1.1359647557788195e-11;

/** Radiation-vector components on the grid, row-major [elevation][bearing], ampere-metres. */
export interface RadiationGrid {
  thRe: Float64Array;
  thIm: Float64Array;
  phRe: Float64Array;
  phIm: Float64Array;
}

let scratch: RadiationGrid | undefined;
let bearingScratch = new Float64Array(0);

/** Fills (and returns) module-owned scratch arrays; valid until the next call. Phases must stay below
 *  ~1e6 rad (k·|r| for any node), far beyond any backyard. */
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
  const { cosE, sinE, sinB, cosB, horizon } = grid;
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
    const i0Re = nodeRe[off];
    const i0Im = nodeIm[off];
    const inRe = nodeRe[off + n];
    const inIm = nodeIm[off + n];
    // Horizontal parts of r̂·t̂, r̂·p0 (over cos e) and φ̂·t̂ depend on the bearing only.
    for (let j = 0; j < nB; j++) {
      tb[j] = sinB[j] * tx + cosB[j] * ty;
      pb[j] = sinB[j] * px + cosB[j] * py;
      fph[j] = -cosB[j] * tx + sinB[j] * ty;
    }
    const halfKl = 0.5 * k * ell;
    const level = tz === 0;
    for (let i = level ? horizon : 0; i < nE; i++) {
      const ce = cosE[i];
      const se = sinE[i];
      const row = i * nB;
      const mirror = (2 * horizon - i) * nB;
      const both = level && i !== horizon;
      // Vertical part of the first node's phase, e^{jk z0 sin e}.
      const vs = Math.sin(k * se * pz);
      const vc = Math.cos(k * se * pz);
      for (let j = 0; j < nB; j += 2) {
        const xa = halfKl * (ce * tb[j] + se * tz);
        const xb = halfKl * (ce * tb[j + 1] + se * tz);
        let sa: number;
        let ca: number;
        if (Math.abs(xa) <= 0.785) {
          const z = xa * xa;
          sa = xa + xa * z * (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))));
          ca = 1 - 0.5 * z + z * z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        } else {
          sa = Math.sin(xa);
          ca = Math.cos(xa);
        }
        let sb: number;
        let cb: number;
        if (Math.abs(xb) <= 0.785) {
          const z = xb * xb;
          sb = xb + xb * z * (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))));
          cb = 1 - 0.5 * z + z * z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        } else {
          sb = Math.sin(xb);
          cb = Math.cos(xb);
        }
        const zaRe = ca * ca - sa * sa;
        const zaIm = 2 * sa * ca;
        const zbRe = cb * cb - sb * sb;
        const zbIm = 2 * sb * cb;
        // Horner, two directions at once.
        let paRe = inRe;
        let paIm = inIm;
        let pbRe = inRe;
        let pbIm = inIm;
        for (let m = off + n - 1; m >= off; m--) {
          const re = nodeRe[m];
          const im = nodeIm[m];
          const ta = paRe * zaRe - paIm * zaIm + re;
          paIm = paRe * zaIm + paIm * zaRe + im;
          paRe = ta;
          const tb2 = pbRe * zbRe - pbIm * zbIm + re;
          pbIm = pbRe * zbIm + pbIm * zbRe + im;
          pbRe = tb2;
        }
        // z^n by repeated squaring.
        let waRe = 1;
        let waIm = 0;
        let wbRe = 1;
        let wbIm = 0;
        let baRe = zaRe;
        let baIm = zaIm;
        let bbRe = zbRe;
        let bbIm = zbIm;
        for (let e = n; e > 0; e >>= 1) {
          if (e & 1) {
            const ta = waRe * baRe - waIm * baIm;
            waIm = waRe * baIm + waIm * baRe;
            waRe = ta;
            const tb2 = wbRe * bbRe - wbIm * bbIm;
            wbIm = wbRe * bbIm + wbIm * bbRe;
            wbRe = tb2;
          }
          const ta = baRe * baRe - baIm * baIm;
          baIm = 2 * baRe * baIm;
          baRe = ta;
          const tb2 = bbRe * bbRe - bbIm * bbIm;
          bbIm = 2 * bbRe * bbIm;
          bbRe = tb2;
        }
        let sa_Re: number;
        let sa_Im: number;
        {
          let sinc: number;
          let hIm: number;
          const x2 = xa * xa;
          if (Math.abs(xa) < 0.1) {
            sinc = 1 - (x2 / 6) * (1 - (x2 / 20) * (1 - (x2 / 42) * (1 - x2 / 72)));
            hIm = ell * xa * (1 / 3 - x2 * (1 / 15 - x2 * (2 / 315 - x2 / 2835)));
          } else {
            sinc = sa / xa;
            hIm = (ell * (xa - sa * ca)) / (2 * x2);
          }
          const alpha = ell * sinc * sinc;
          const hRe = 0.5 * alpha;
          const ehRe = inRe * hRe - inIm * hIm;
          const ehIm = inRe * hIm + inIm * hRe;
          sa_Re = alpha * paRe - (i0Re * hRe + i0Im * hIm) - (ehRe * waRe - ehIm * waIm);
          sa_Im = alpha * paIm - (i0Im * hRe - i0Re * hIm) - (ehRe * waIm + ehIm * waRe);
        }
        let sb_Re: number;
        let sb_Im: number;
        {
          let sinc: number;
          let hIm: number;
          const x2 = xb * xb;
          if (Math.abs(xb) < 0.1) {
            sinc = 1 - (x2 / 6) * (1 - (x2 / 20) * (1 - (x2 / 42) * (1 - x2 / 72)));
            hIm = ell * xb * (1 / 3 - x2 * (1 / 15 - x2 * (2 / 315 - x2 / 2835)));
          } else {
            sinc = sb / xb;
            hIm = (ell * (xb - sb * cb)) / (2 * x2);
          }
          const alpha = ell * sinc * sinc;
          const hRe = 0.5 * alpha;
          const ehRe = inRe * hRe - inIm * hIm;
          const ehIm = inRe * hIm + inIm * hRe;
          sb_Re = alpha * pbRe - (i0Re * hRe + i0Im * hIm) - (ehRe * wbRe - ehIm * wbIm);
          sb_Im = alpha * pbIm - (i0Im * hRe - i0Re * hIm) - (ehRe * wbIm + ehIm * wbRe);
        }
        let hs: number;
        let hc: number;
        {
          const a = k * ce * pb[j];
          const q = Math.round(a * TWO_OVER_PI);
          const r = a - q * PIO2_HI - q * PIO2_LO;
          const z = r * r;
          const sr = r + r * z * (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))));
          const cr = 1 - 0.5 * z + z * z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
          const m = q & 3;
          hs = m === 0 ? sr : m === 1 ? cr : m === 2 ? -sr : -cr;
          hc = m === 0 ? cr : m === 1 ? -sr : m === 2 ? -cr : sr;
        }
        {
          // Q = S e^{jk cos e (ĥ·p0)} e^{jk sin e z0}
          const aRe = sa_Re * hc - sa_Im * hs;
          const aIm = sa_Re * hs + sa_Im * hc;
          const qRe = aRe * vc - aIm * vs;
          const qIm = aRe * vs + aIm * vc;
          const fth = se * tb[j] - ce * tz;
          const f = fph[j];
          thRe[row + j] += fth * qRe;
          thIm[row + j] += fth * qIm;
          phRe[row + j] += f * qRe;
          phIm[row + j] += f * qIm;
          if (both) {
            // Mirrored row −e of a level run: same S, conjugate vertical phase, θ̂·t̂ = −sin e (ĥ·t̂).
            const mRe = aRe * vc + aIm * vs;
            const mIm = aIm * vc - aRe * vs;
            thRe[mirror + j] -= fth * mRe;
            thIm[mirror + j] -= fth * mIm;
            phRe[mirror + j] += f * mRe;
            phIm[mirror + j] += f * mIm;
          }
        }
        let hs2: number;
        let hc2: number;
        {
          const a = k * ce * pb[j + 1];
          const q = Math.round(a * TWO_OVER_PI);
          const r = a - q * PIO2_HI - q * PIO2_LO;
          const z = r * r;
          const sr = r + r * z * (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))));
          const cr = 1 - 0.5 * z + z * z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
          const m = q & 3;
          hs2 = m === 0 ? sr : m === 1 ? cr : m === 2 ? -sr : -cr;
          hc2 = m === 0 ? cr : m === 1 ? -sr : m === 2 ? -cr : sr;
        }
        {
          // Q = S e^{jk cos e (ĥ·p0)} e^{jk sin e z0}
          const aRe = sb_Re * hc2 - sb_Im * hs2;
          const aIm = sb_Re * hs2 + sb_Im * hc2;
          const qRe = aRe * vc - aIm * vs;
          const qIm = aRe * vs + aIm * vc;
          const fth = se * tb[j + 1] - ce * tz;
          const f = fph[j + 1];
          thRe[row + j + 1] += fth * qRe;
          thIm[row + j + 1] += fth * qIm;
          phRe[row + j + 1] += f * qRe;
          phIm[row + j + 1] += f * qIm;
          if (both) {
            // Mirrored row −e of a level run: same S, conjugate vertical phase, θ̂·t̂ = −sin e (ĥ·t̂).
            const mRe = aRe * vc + aIm * vs;
            const mIm = aIm * vc - aRe * vs;
            thRe[mirror + j + 1] -= fth * mRe;
            thIm[mirror + j + 1] -= fth * mIm;
            phRe[mirror + j + 1] += f * mRe;
            phIm[mirror + j + 1] += f * mIm;
          }
        }
      }
    }
  }
  return scratch;
}
