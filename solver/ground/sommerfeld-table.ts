/**
 * The Sommerfeld remainder (sommerfeld-integrals.ts) tabulated once per frequency and interpolated, so
 * the matrix fill never evaluates a Sommerfeld integral itself.
 *
 * Coordinates: R′ = distance from the source's image (x′, y′, −z′) to the observer and θ′ = its angle
 * from the vertical (Z = R′cosθ′, ρ = R′sinθ′). What is stored is F = R′ e^{jk0R′} I — the remainder
 * behaves like 1/R′ at the image point and like a wave e^{−jk0R′}/R′ far away, so F is smooth in both
 * directions and bicubic (4 × 4 Lagrange) interpolation on a modest grid reproduces it. Below the first
 * node R′ is clamped (F tends to a function of θ′ alone there). R′ nodes: geometric near the image,
 * then uniform at λ/20; θ′ nodes clustered toward grazing, where the ground-wave part varies fastest.
 */
import {
  type HalfSpaceParams,
  type RemainderContext,
  remainderContext,
  remainderIntegrals,
} from "./sommerfeld-integrals";

export interface SommerfeldTable {
  ctx: RemainderContext;
  k0: number;
  rNodes: Float64Array;
  tNodes: Float64Array;
  /** F values, [iR][iθ][component re/im 10], flattened. */
  data: Float64Array;
  rMin: number;
  rMax: number;
  /**
   * 1 / ∏_{b≠a}(x_a − x_b) for the 4-node Lagrange stencil starting at each node s, [s·4 + a], for the
   * R′ and θ′ nodes: the fill looks the table up some 10⁴ times per frequency, and these divisions
   * were a good part of each lookup.
   */
  rDen: Float64Array;
  tDen: Float64Array;
}

export interface TableOptions {
  /** Largest R′ the model can need, metres. */
  rMax: number;
  /** Smallest R′ worth resolving, metres (default λ/5000). */
  rMin?: number;
  /** Uniform R′ spacing far out, in wavelengths (default 1/20). */
  stepWavelengths?: number;
  /** θ′ node count (default 15). */
  thetaNodes?: number;
}

export function buildSommerfeldTable(h: HalfSpaceParams, opt: TableOptions): SommerfeldTable {
  const ctx = remainderContext(h);
  const lambda = (2 * Math.PI) / h.k0;
  const rMin = opt.rMin ?? lambda / 5000;
  const step = (opt.stepWavelengths ?? 1 / 20) * lambda;
  const rs: number[] = [rMin];
  while (rs[rs.length - 1] < opt.rMax) {
    const last = rs[rs.length - 1];
    rs.push(last + Math.min(step, 0.5 * last));
  }
  // Enough nodes past rMax for the cubic stencil to stay centred.
  for (let i = 0; i < 2; i++) rs.push(rs[rs.length - 1] + Math.min(step, 0.5 * rs[rs.length - 1]));
  const nT = opt.thetaNodes ?? 15;
  const ts: number[] = [];
  for (let i = 0; i < nT; i++) ts.push((Math.PI / 2) * Math.sin((Math.PI / 2) * (i / (nT - 1))));
  const data = new Float64Array(rs.length * nT * 10);
  const I = new Float64Array(10);
  for (let i = 0; i < rs.length; i++) {
    const R = rs[i];
    const cr = Math.cos(h.k0 * R) * R;
    const ci = Math.sin(h.k0 * R) * R;
    for (let j = 0; j < nT; j++) {
      remainderIntegrals(ctx, R * Math.sin(ts[j]), R * Math.cos(ts[j]), I);
      const o = (i * nT + j) * 10;
      for (let c = 0; c < 5; c++) {
        const re = I[2 * c];
        const im = I[2 * c + 1];
        data[o + 2 * c] = re * cr - im * ci;
        data[o + 2 * c + 1] = re * ci + im * cr;
      }
    }
  }
  const rNodes = Float64Array.from(rs);
  const tNodes = Float64Array.from(ts);
  return {
    ctx,
    k0: h.k0,
    rNodes,
    tNodes,
    data,
    rMin,
    rMax: rs[rs.length - 1],
    rDen: stencilDenominators(rNodes),
    tDen: stencilDenominators(tNodes),
  };
}

/** The Lagrange denominators of every 4-node stencil (SommerfeldTable.rDen). */
function stencilDenominators(nodes: Float64Array): Float64Array {
  const den = new Float64Array(4 * Math.max(0, nodes.length - 3));
  for (let s = 0; s + 3 < nodes.length; s++) {
    for (let a = 0; a < 4; a++) {
      let v = 1;
      for (let b = 0; b < 4; b++) if (b !== a) v *= nodes[s + a] - nodes[s + b];
      den[4 * s + a] = 1 / v;
    }
  }
  return den;
}

/** Index i with nodes[i] ≤ x < nodes[i+1], clamped so i−1 … i+2 exist where possible. */
function stencilStart(nodes: Float64Array, x: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (nodes[mid] <= x) lo = mid;
    else hi = mid;
  }
  return Math.max(0, Math.min(nodes.length - 4, lo - 1));
}

/**
 * Lagrange weights of the 4 nodes starting at s for abscissa x, with the stencil's precomputed
 * denominators (den[4s + a]): w_a = ∏_{b≠a}(x − x_b) · den_a.
 */
function lagrange4(nodes: Float64Array, den: Float64Array, s: number, x: number, w: Float64Array): void {
  const d0 = x - nodes[s];
  const d1 = x - nodes[s + 1];
  const d2 = x - nodes[s + 2];
  const d3 = x - nodes[s + 3];
  const o = 4 * s;
  w[0] = d1 * d2 * d3 * den[o];
  w[1] = d0 * d2 * d3 * den[o + 1];
  w[2] = d0 * d1 * d3 * den[o + 2];
  w[3] = d0 * d1 * d2 * den[o + 3];
}

const wr = new Float64Array(4);
const wt = new Float64Array(4);

/**
 * Interpolated remainder integrals [I1, I2, I3, I5, I6] (re, im) at horizontal distance ρ and image
 * height Z, into out[0..9]. Throws if (ρ, Z) lies beyond the table (a bug: the table is sized from the model).
 */
export function lookupRemainder(t: SommerfeldTable, rho: number, Z: number, out: Float64Array): void {
  const Rtrue = Math.sqrt(rho * rho + Z * Z); // not Math.hypot: per lookup, and much slower in V8
  if (Rtrue > t.rMax) throw new Error(`Sommerfeld table too small: R′ = ${Rtrue} m > ${t.rMax} m`);
  const R = Math.max(Rtrue, t.rMin);
  const theta = Math.atan2(rho, Z);
  const nT = t.tNodes.length;
  const sr = stencilStart(t.rNodes, R);
  const st = stencilStart(t.tNodes, theta);
  lagrange4(t.rNodes, t.rDen, sr, R, wr);
  lagrange4(t.tNodes, t.tDen, st, theta, wt);
  // The 4 × 4 stencil, accumulated in locals (the θ′ nodes of one R′ node are contiguous in data).
  const data = t.data;
  let o0 = 0;
  let o1 = 0;
  let o2 = 0;
  let o3 = 0;
  let o4 = 0;
  let o5 = 0;
  let o6 = 0;
  let o7 = 0;
  let o8 = 0;
  let o9 = 0;
  for (let a = 0; a < 4; a++) {
    const ra = wr[a];
    let o = ((sr + a) * nT + st) * 10;
    for (let b = 0; b < 4; b++, o += 10) {
      const w = ra * wt[b];
      o0 += w * data[o];
      o1 += w * data[o + 1];
      o2 += w * data[o + 2];
      o3 += w * data[o + 3];
      o4 += w * data[o + 4];
      o5 += w * data[o + 5];
      o6 += w * data[o + 6];
      o7 += w * data[o + 7];
      o8 += w * data[o + 8];
      o9 += w * data[o + 9];
    }
  }
  out[0] = o0;
  out[1] = o1;
  out[2] = o2;
  out[3] = o3;
  out[4] = o4;
  out[5] = o5;
  out[6] = o6;
  out[7] = o7;
  out[8] = o8;
  out[9] = o9;
  // Undo F = R′ e^{jk0R′} I with the true R′ (1/R′ behaviour below the first node).
  const pr = Math.cos(t.k0 * Rtrue) / Rtrue;
  const pi = -Math.sin(t.k0 * Rtrue) / Rtrue;
  for (let c = 0; c < 5; c++) {
    const re = out[2 * c];
    const im = out[2 * c + 1];
    out[2 * c] = re * pr - im * pi;
    out[2 * c + 1] = re * pi + im * pr;
  }
}

/**
 * The remainder dyadic, normalised like G = e^{−jkR}/R (kernel.ts), contracted with observation tangent
 * tp and source tangent tq: tp·𝐆_rem·tq into out[0..1]. (dx, dy) = horizontal offset observer − source,
 * Z = z + z′. From the integrals (sommerfeld-integrals.ts header), divided by k0²:
 *   hh: (k0²I1 − ½I2 − ½I3) 𝐈 + I3 ρ̂ρ̂,  z←h: −I6 ρ̂,  h←z: +I6 ρ̂,  zz: I5.
 */
export function contractRemainder(
  I: Float64Array,
  k0: number,
  dx: number,
  dy: number,
  tp: ArrayLike<number>,
  po: number,
  tq: ArrayLike<number>,
  qo: number,
  out: Float64Array,
): void {
  const rho = Math.sqrt(dx * dx + dy * dy); // not Math.hypot (hot path; see lookupRemainder)
  let rx = 0;
  let ry = 0;
  if (rho > 0) {
    rx = dx / rho;
    ry = dy / rho;
  }
  const px = tp[po];
  const py = tp[po + 1];
  const pz = tp[po + 2];
  const qx = tq[qo];
  const qy = tq[qo + 1];
  const qz = tq[qo + 2];
  const hh = px * qx + py * qy;
  const pr = px * rx + py * ry;
  const qr = qx * rx + qy * ry;
  const k2 = k0 * k0;
  // Coefficients of I1, I2, I3, I5, I6 in tp·𝐆·tq (times k0²).
  const c1 = k2 * hh;
  const c2 = -0.5 * hh;
  const c3 = -0.5 * hh + pr * qr;
  const c5 = pz * qz;
  const c6 = -pz * qr + pr * qz;
  out[0] = (c1 * I[0] + c2 * I[2] + c3 * I[4] + c5 * I[6] + c6 * I[8]) / k2;
  out[1] = (c1 * I[1] + c2 * I[3] + c3 * I[5] + c5 * I[7] + c6 * I[9]) / k2;
}

// Tables by (frequency, ground), shared by every kernel in this process: a table depends on the model
// only through the largest distance it must cover, so re-solving a band while a wire is dragged, or the
// same model twice, reuses it. Built with 25 % slack in R′ so small edits still fit.
const shared = new Map<string, SommerfeldTable>();
// How many: one plan analysis visits several frequencies per band (a quick pass five, a full pass its
// three fit frequencies and the centre, the ideal reference dipole its own), so a two-band plan already
// needs ~20 and a cap of 8 made every live pass rebuild them all (~2 s instead of ~30 ms, measured on the
// demo with 160 m and 20 m). A yard-sized table is 20–100 R′ × 15 θ′ × 10 doubles, 0.03–0.1 MB.
const SHARED_MAX = 64;

/** A table covering at least opt.rMax, from the shared cache when one fits. */
export function sharedSommerfeldTable(h: HalfSpaceParams, opt: TableOptions): SommerfeldTable {
  const key = `${h.k0}|${h.epsRe}|${h.epsIm}|${opt.rMin ?? ""}|${opt.stepWavelengths ?? ""}|${opt.thetaNodes ?? ""}`;
  const hit = shared.get(key);
  if (hit && hit.rMax >= opt.rMax) {
    shared.delete(key);
    shared.set(key, hit); // most recently used last
    return hit;
  }
  const t = buildSommerfeldTable(h, { ...opt, rMax: opt.rMax * 1.25 });
  shared.set(key, t);
  if (shared.size > SHARED_MAX) shared.delete(shared.keys().next().value as string);
  return t;
}
