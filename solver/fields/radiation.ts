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
 * The sum depends on the direction only through c = r̂·t̂ and is band-limited in c (|frequency| ≤
 * k(L/2 + ℓ) once its phase origin is the run's middle), so it is tabulated once per run on a grid in c
 * and interpolated (cubic Lagrange; error ≈ 2e-10 of Σ|I|ℓ): the per-direction cost does not grow with
 * the run's length. The middle's phase e^{jk r̂·m} = e^{jk cos e (ĥ·m)} e^{jk sin e m_z} costs one fast
 * sine/cosine pair per run for four directions, (±e, b) and (±e, b + 180°); level runs also share the
 * interpolation between ±e. Runs whose table would outgrow the grid (very long runs on coarse grids)
 * are summed per direction by Horner's rule instead, two directions at a time so the two dependency
 * chains overlap. Checked against the per-segment form in reference.ts.
 */

import type { DirectionGrid } from "./grid";
import type { Runs } from "./runs";

// Fast sin/cos: reduction by the nearest multiple of π/2 in two parts (Cody–Waite; q·PIO2_HI is exact for
// |q| < 2^20), then the minimax kernels of fdlibm's __kernel_sin/__kernel_cos (Sun Microsystems, freely
// distributable; the basis of most C libraries), ~1 ulp on |r| ≤ π/4 — about 3× Math.sin + Math.cos. Everything
// in the loops below is written out by hand: a call that V8 does not inline boxes its double arguments,
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

/** Runs of at least this many segments are tabulated rather than summed per direction. */
const TABLE_MIN_SEGMENTS = 1;
/** Table step times the sum's bandwidth in c: cubic interpolation error ≤ 0.0234·(BΔc)⁴ ≈ 2e-10 of Σ|I|ℓ. */
const TABLE_RESOLUTION = 0.01;
let tableScratch = new Float64Array(0);

/** Table nodes for a run of n segments of length ℓ: c from −1 − Δc to 1 + Δc in M + 1 steps of 2/M. */
function tableSize(k: number, n: number, ell: number): number {
  const bandwidth = k * (0.5 * n * ell + ell);
  return Math.max(8, Math.ceil((2 * bandwidth) / TABLE_RESOLUTION)) + 3;
}

/**
 * S̃(c) = S(c) e^{−jkLc/2} at c_m = −1 + (m − 1)·2/M, interleaved re/im: the run sum of the header with its
 * phase origin moved to the run's middle, which centres its spectrum so that it varies as slowly as
 * possible in c (band limit k(L/2 + ℓ)).
 */
function buildRunTable(runs: Runs, r: number, k: number, count: number): Float64Array {
  if (tableScratch.length < 2 * count) tableScratch = new Float64Array(2 * count);
  const table = tableScratch;
  const n = runs.segments[r];
  const off = runs.nodeOffset[r];
  const ell = runs.segmentLength[r];
  const { nodeRe, nodeIm } = runs;
  const i0Re = nodeRe[off];
  const i0Im = nodeIm[off];
  const inRe = nodeRe[off + n];
  const inIm = nodeIm[off + n];
  const step = 2 / (count - 3);
  for (let m = 0; m < count; m++) {
    const c = -1 + (m - 1) * step;
    const x = 0.5 * k * ell * c;
    const sx = Math.sin(x);
    const cx = Math.cos(x);
    const zRe = cx * cx - sx * sx;
    const zIm = 2 * sx * cx;
    let pRe = inRe;
    let pIm = inIm;
    for (let q = off + n - 1; q >= off; q--) {
      const t = pRe * zRe - pIm * zIm + nodeRe[q];
      pIm = pRe * zIm + pIm * zRe + nodeIm[q];
      pRe = t;
    }
    const kl = k * n * ell * c;
    const wRe = Math.cos(kl);
    const wIm = Math.sin(kl);
    const x2 = x * x;
    let sinc: number;
    let hIm: number;
    if (Math.abs(x) < 0.1) {
      sinc = 1 - (x2 / 6) * (1 - (x2 / 20) * (1 - (x2 / 42) * (1 - x2 / 72)));
      hIm = ell * x * (1 / 3 - x2 * (1 / 15 - x2 * (2 / 315 - x2 / 2835)));
    } else {
      sinc = sx / x;
      hIm = (ell * (x - sx * cx)) / (2 * x2);
    }
    const alpha = ell * sinc * sinc;
    const hRe = 0.5 * alpha;
    const ehRe = inRe * hRe - inIm * hIm;
    const ehIm = inRe * hIm + inIm * hRe;
    const sRe = alpha * pRe - (i0Re * hRe + i0Im * hIm) - (ehRe * wRe - ehIm * wIm);
    const sIm = alpha * pIm - (i0Im * hRe - i0Re * hIm) - (ehRe * wIm + ehIm * wRe);
    // × e^{−jkLc/2}
    const hc = Math.cos(0.5 * kl);
    const hs = Math.sin(0.5 * kl);
    table[2 * m] = sRe * hc + sIm * hs;
    table[2 * m + 1] = sIm * hc - sRe * hs;
  }
  return table;
}

/**
 * One tabulated run on the whole grid. S̃ is interpolated (cubic Lagrange) at c = r̂·t̂ and multiplied by
 * the phase of the run's middle m, e^{jk r̂·m} = e^{jk cos e (ĥ·m)} e^{jk sin e m_z}. The horizontal factor
 * is the same at e and −e and conjugate at the opposite bearing (ĥ → −ĥ), so one sine/cosine pair
 * serves the four directions (±e, b) and (±e, b + 180°); level runs also share S̃ between ±e.
 */
function tabulatedRun(
  grid: DirectionGrid,
  runs: Runs,
  r: number,
  k: number,
  table: Float64Array,
  count: number,
  out: RadiationGrid,
): void {
  const { cosE, sinE, sinB, cosB, horizon } = grid;
  const nE = cosE.length;
  const nB = sinB.length;
  const halfB = nB / 2;
  const { thRe, thIm, phRe, phIm } = out;
  const n = runs.segments[r];
  const ell = runs.segmentLength[r];
  const tx = runs.direction[3 * r];
  const ty = runs.direction[3 * r + 1];
  const tz = runs.direction[3 * r + 2];
  const half = 0.5 * n * ell;
  const mx = runs.origin[3 * r] + half * tx;
  const my = runs.origin[3 * r + 1] + half * ty;
  const mz = runs.origin[3 * r + 2] + half * tz;
  const invStep = (count - 3) / 2;
  const last = count - 3;
  const level = tz === 0;
  for (let i = horizon; i < nE; i++) {
    const ce = cosE[i];
    const se = sinE[i];
    const up = i * nB;
    const dn = (2 * horizon - i) * nB;
    const both = i !== horizon;
    const vs = Math.sin(k * se * mz);
    const vc = Math.cos(k * se * mz);
    for (let j = 0; j < halfB; j++) {
      const sb = sinB[j];
      const cb = cosB[j];
      const hb = sb * tx + cb * ty;
      const f = -cb * tx + sb * ty;
      let hs: number;
      let hc: number;
      {
        const a = k * ce * (sb * mx + cb * my);
        const q = Math.round(a * TWO_OVER_PI);
        const x = a - q * PIO2_HI - q * PIO2_LO;
        const z = x * x;
        const sr = x + x * z * (S1 + z * (S2 + z * (S3 + z * (S4 + z * (S5 + z * S6)))));
        const cr = 1 - 0.5 * z + z * z * (C1 + z * (C2 + z * (C3 + z * (C4 + z * (C5 + z * C6)))));
        const oct = q & 3;
        hs = oct === 0 ? sr : oct === 1 ? cr : oct === 2 ? -sr : -cr;
        hc = oct === 0 ? cr : oct === 1 ? -sr : oct === 2 ? -cr : sr;
      }
      // Phases: (e, b) h·v, (−e, b) h·v̄, (e, b+180) h̄·v, (−e, b+180) h̄·v̄.
      const p1Re = hc * vc - hs * vs;
      const p1Im = hc * vs + hs * vc;
      const p2Re = hc * vc + hs * vs;
      const p2Im = hs * vc - hc * vs;
      const p3Re = p2Re;
      const p3Im = -p2Im;
      const p4Re = p1Re;
      const p4Im = -p1Im;
      const ja = j;
      const jb = j + halfB;
      // (e, b): c = ce hb + se tz, θ̂·t̂ = se hb − ce tz, φ̂·t̂ = f
      // (−e, b): c = ce hb − se tz, θ̂·t̂ = −se hb − ce tz, φ̂·t̂ = f
      // (e, b+180): c = −ce hb + se tz, θ̂·t̂ = −se hb − ce tz, φ̂·t̂ = −f
      // (−e, b+180): c = −ce hb − se tz, θ̂·t̂ = se hb − ce tz, φ̂·t̂ = −f
      const gA = se * hb - ce * tz;
      const gB = -se * hb - ce * tz;
      // (e, b) and (e, b+180)
      {
        let s1Re: number;
        let s1Im: number;
        {
          const u = (ce * hb + se * tz + 1) * invStep + 1;
          const m = Math.min(Math.max(Math.floor(u), 1), last);
          const t = u - m;
          const w0 = (-t * (t - 1) * (t - 2)) / 6;
          const w1 = ((t + 1) * (t - 1) * (t - 2)) / 2;
          const w2 = (-(t + 1) * t * (t - 2)) / 2;
          const w3 = ((t + 1) * t * (t - 1)) / 6;
          const q = 2 * (m - 1);
          s1Re = w0 * table[q] + w1 * table[q + 2] + w2 * table[q + 4] + w3 * table[q + 6];
          s1Im = w0 * table[q + 1] + w1 * table[q + 3] + w2 * table[q + 5] + w3 * table[q + 7];
        }
        let s3Re: number;
        let s3Im: number;
        {
          const u = (-ce * hb + se * tz + 1) * invStep + 1;
          const m = Math.min(Math.max(Math.floor(u), 1), last);
          const t = u - m;
          const w0 = (-t * (t - 1) * (t - 2)) / 6;
          const w1 = ((t + 1) * (t - 1) * (t - 2)) / 2;
          const w2 = (-(t + 1) * t * (t - 2)) / 2;
          const w3 = ((t + 1) * t * (t - 1)) / 6;
          const q = 2 * (m - 1);
          s3Re = w0 * table[q] + w1 * table[q + 2] + w2 * table[q + 4] + w3 * table[q + 6];
          s3Im = w0 * table[q + 1] + w1 * table[q + 3] + w2 * table[q + 5] + w3 * table[q + 7];
        }
        {
          const qRe = s1Re * p1Re - s1Im * p1Im;
          const qIm = s1Re * p1Im + s1Im * p1Re;
          thRe[up + ja] += gA * qRe;
          thIm[up + ja] += gA * qIm;
          phRe[up + ja] += f * qRe;
          phIm[up + ja] += f * qIm;
        }
        {
          const qRe = s3Re * p3Re - s3Im * p3Im;
          const qIm = s3Re * p3Im + s3Im * p3Re;
          thRe[up + jb] += gB * qRe;
          thIm[up + jb] += gB * qIm;
          phRe[up + jb] += -f * qRe;
          phIm[up + jb] += -f * qIm;
        }
        if (both) {
          // (−e, b) and (−e, b+180): a level run has the same c there.
          let s2Re = s1Re;
          let s2Im = s1Im;
          let s4Re = s3Re;
          let s4Im = s3Im;
          if (!level) {
            let t2Re: number;
            let t2Im: number;
            {
              const u = (ce * hb - se * tz + 1) * invStep + 1;
              const m = Math.min(Math.max(Math.floor(u), 1), last);
              const t = u - m;
              const w0 = (-t * (t - 1) * (t - 2)) / 6;
              const w1 = ((t + 1) * (t - 1) * (t - 2)) / 2;
              const w2 = (-(t + 1) * t * (t - 2)) / 2;
              const w3 = ((t + 1) * t * (t - 1)) / 6;
              const q = 2 * (m - 1);
              t2Re = w0 * table[q] + w1 * table[q + 2] + w2 * table[q + 4] + w3 * table[q + 6];
              t2Im = w0 * table[q + 1] + w1 * table[q + 3] + w2 * table[q + 5] + w3 * table[q + 7];
            }
            let t4Re: number;
            let t4Im: number;
            {
              const u = (-ce * hb - se * tz + 1) * invStep + 1;
              const m = Math.min(Math.max(Math.floor(u), 1), last);
              const t = u - m;
              const w0 = (-t * (t - 1) * (t - 2)) / 6;
              const w1 = ((t + 1) * (t - 1) * (t - 2)) / 2;
              const w2 = (-(t + 1) * t * (t - 2)) / 2;
              const w3 = ((t + 1) * t * (t - 1)) / 6;
              const q = 2 * (m - 1);
              t4Re = w0 * table[q] + w1 * table[q + 2] + w2 * table[q + 4] + w3 * table[q + 6];
              t4Im = w0 * table[q + 1] + w1 * table[q + 3] + w2 * table[q + 5] + w3 * table[q + 7];
            }
            s2Re = t2Re;
            s2Im = t2Im;
            s4Re = t4Re;
            s4Im = t4Im;
          }
          {
            const qRe = s2Re * p2Re - s2Im * p2Im;
            const qIm = s2Re * p2Im + s2Im * p2Re;
            thRe[dn + ja] += gB * qRe;
            thIm[dn + ja] += gB * qIm;
            phRe[dn + ja] += f * qRe;
            phIm[dn + ja] += f * qIm;
          }
          {
            const qRe = s4Re * p4Re - s4Im * p4Im;
            const qIm = s4Re * p4Im + s4Im * p4Re;
            thRe[dn + jb] += gA * qRe;
            thIm[dn + jb] += gA * qIm;
            phRe[dn + jb] += -f * qRe;
            phIm[dn + jb] += -f * qIm;
          }
        }
      }
    }
  }
}

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
    // Long runs: tabulate the run sum in c = r̂·t̂ (phase origin at the run's middle) and interpolate.
    const tableCount = n >= TABLE_MIN_SEGMENTS ? tableSize(k, n, ell) : 0;
    const table = tableCount > 0 && tableCount < size / 4 ? buildRunTable(runs, r, k, tableCount) : undefined;
    if (table !== undefined) {
      tabulatedRun(grid, runs, r, k, table, tableCount, scratch);
      continue;
    }
    const invStep = (tableCount - 3) / 2;
    const tableLast = tableCount - 3;
    const shift = table === undefined ? 0 : 0.5 * n * ell;
    const px = runs.origin[3 * r] + shift * tx;
    const py = runs.origin[3 * r + 1] + shift * ty;
    const pz = runs.origin[3 * r + 2] + shift * tz;
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
      // Vertical part of the phase origin's phase, e^{jk z0 sin e}.
      const vs = Math.sin(k * se * pz);
      const vc = Math.cos(k * se * pz);
      for (let j = 0; j < nB; j += 2) {
        let sa_Re: number;
        let sa_Im: number;
        let sb_Re: number;
        let sb_Im: number;
        if (table === undefined) {
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
        } else {
          // Cubic Lagrange interpolation of the run's tabulated sum in c = r̂·t̂ (see buildRunTable).
          const ua = (ce * tb[j] + se * tz + 1) * invStep + 1;
          const ub = (ce * tb[j + 1] + se * tz + 1) * invStep + 1;
          const ma = Math.min(Math.max(Math.floor(ua), 1), tableLast);
          const mb = Math.min(Math.max(Math.floor(ub), 1), tableLast);
          const ta = ua - ma;
          const tb3 = ub - mb;
          const a0 = (-ta * (ta - 1) * (ta - 2)) / 6;
          const a1 = ((ta + 1) * (ta - 1) * (ta - 2)) / 2;
          const a2 = (-(ta + 1) * ta * (ta - 2)) / 2;
          const a3 = ((ta + 1) * ta * (ta - 1)) / 6;
          const b0 = (-tb3 * (tb3 - 1) * (tb3 - 2)) / 6;
          const b1 = ((tb3 + 1) * (tb3 - 1) * (tb3 - 2)) / 2;
          const b2 = (-(tb3 + 1) * tb3 * (tb3 - 2)) / 2;
          const b3 = ((tb3 + 1) * tb3 * (tb3 - 1)) / 6;
          const qa = 2 * (ma - 1);
          const qb = 2 * (mb - 1);
          sa_Re = a0 * table[qa] + a1 * table[qa + 2] + a2 * table[qa + 4] + a3 * table[qa + 6];
          sa_Im = a0 * table[qa + 1] + a1 * table[qa + 3] + a2 * table[qa + 5] + a3 * table[qa + 7];
          sb_Re = b0 * table[qb] + b1 * table[qb + 2] + b2 * table[qb + 4] + b3 * table[qb + 6];
          sb_Im = b0 * table[qb + 1] + b1 * table[qb + 3] + b2 * table[qb + 5] + b3 * table[qb + 7];
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
          // Q = S e^{jk cos e (ĥ·o)} e^{jk sin e o_z}, o the phase origin (first node, or middle)
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
          // Q = S e^{jk cos e (ĥ·o)} e^{jk sin e o_z}, o the phase origin (first node, or middle)
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
