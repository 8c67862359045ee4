/**
 * The four segment-pair integrals of the thin-wire (reduced) kernel, e^{jωt} convention:
 *
 *   J_ab = ∫_p ∫_q u^a v^b e^{−jkR}/R dl′ dl,   R = sqrt(|r − r′|² + a²),   (a, b) ∈ {0, 1}²
 *
 * with u, v ∈ [0, 1] the normalised positions on the observation segment p and the source segment q
 * (Harrington 1968 ch. 4; Gibson, The Method of Moments in Electromagnetics, ch. on thin wires).
 * Every Galerkin triangle interaction is a combination of these four numbers.
 *
 * Near pairs (self, touching, close): G = (e^{−jkR} − 1)/R + 1/R. The 1/R inner integral over a straight
 * source is closed form for any observation point r: with w = (r − r_q)·t̂_q and ρ² = |r − r_q|² − w² + a²,
 *   ∫₀^ℓ dl′/R = asinh((ℓ − w)/ρ) + asinh(w/ρ),
 *   ∫₀^ℓ l′ dl′/R = sqrt((ℓ − w)² + ρ²) − sqrt(w² + ρ²) + w·∫₀^ℓ dl′/R.
 * The smooth remainder is bounded (→ −jk as R → 0) and takes plain Gauss–Legendre; the outer integral
 * uses an end-clustered Gauss rule. Far pairs: direct Gauss–Legendre, order chosen by distance/length.
 *
 * out layout (re, im interleaved): [J00, J10, J01, J11] → out[0..7].
 */
import { endClusteredRule, gaussRule, type Rule } from "./quadrature";
import type { SegmentSet } from "./segments";

const OUTER_NEAR: Rule = endClusteredRule(10);
const INNER_SMOOTH: Rule = gaussRule(4);
const G5: Rule = gaussRule(5);
const G3: Rule = gaussRule(3);
const G2: Rule = gaussRule(2);

/** Distance over (longer) segment length below which the singular-extraction path runs. */
export const NEAR_RATIO = 1.6;

/** Beyond this distance/length ratio the separable far-pair form (farPair) is enough: its error is
 *  O((ℓ/d)²) relative, smooth in position, so the charge cancellations of neighbouring pieces stay
 *  consistent. */
export const FAR_RATIO = 20.5;

export function pairIntegrals(
  P: SegmentSet,
  p: number,
  Q: SegmentSet,
  q: number,
  k: number,
  out: Float64Array,
): void {
  const p3 = 3 * p;
  const q3 = 3 * q;
  const dxm = P.mid[p3] - Q.mid[q3];
  const dym = P.mid[p3 + 1] - Q.mid[q3 + 1];
  const dzm = P.mid[p3 + 2] - Q.mid[q3 + 2];
  const d = Math.sqrt(dxm * dxm + dym * dym + dzm * dzm);
  const lp = P.len[p];
  const lq = Q.len[q];
  const h = Math.max(lp, lq);
  const ap = P.radius[p];
  const aq = Q.radius[q];
  const a2 = 0.5 * (ap * ap + aq * aq);
  if (d < NEAR_RATIO * h) {
    nearPair(P, p, Q, q, k, a2, out);
  } else {
    if (d > FAR_RATIO * h) {
      farPair(P, p, Q, q, k, a2, out);
      return;
    }
    const r = d < 4.3 * h ? G5 : d < 10.3 * h ? G3 : G2;
    directPair(P, p, Q, q, k, a2, r, out);
  }
}

function directPair(
  P: SegmentSet,
  p: number,
  Q: SegmentSet,
  q: number,
  k: number,
  a2: number,
  r: Rule,
  out: Float64Array,
): void {
  const p3 = 3 * p;
  const q3 = 3 * q;
  const lp = P.len[p];
  const lq = Q.len[q];
  const px = P.start[p3];
  const py = P.start[p3 + 1];
  const pz = P.start[p3 + 2];
  const tpx = P.dir[p3] * lp;
  const tpy = P.dir[p3 + 1] * lp;
  const tpz = P.dir[p3 + 2] * lp;
  const qx = Q.start[q3];
  const qy = Q.start[q3 + 1];
  const qz = Q.start[q3 + 2];
  const tqx = Q.dir[q3] * lq;
  const tqy = Q.dir[q3 + 1] * lq;
  const tqz = Q.dir[q3 + 2] * lq;
  const n = r.n;
  const U = r.u;
  const W = r.w;
  let j00r = 0;
  let j00i = 0;
  let j10r = 0;
  let j10i = 0;
  let j01r = 0;
  let j01i = 0;
  let j11r = 0;
  let j11i = 0;
  for (let i = 0; i < n; i++) {
    const u = U[i];
    const ox = px + u * tpx;
    const oy = py + u * tpy;
    const oz = pz + u * tpz;
    let s0r = 0;
    let s0i = 0;
    let s1r = 0;
    let s1i = 0;
    for (let j = 0; j < n; j++) {
      const v = U[j];
      const ex = ox - qx - v * tqx;
      const ey = oy - qy - v * tqy;
      const ez = oz - qz - v * tqz;
      const R = Math.sqrt(ex * ex + ey * ey + ez * ez + a2);
      const kr = k * R;
      const wr = W[j] / R;
      const gr = Math.cos(kr) * wr;
      const gi = -Math.sin(kr) * wr;
      s0r += gr;
      s0i += gi;
      s1r += v * gr;
      s1i += v * gi;
    }
    const wu = W[i];
    j00r += wu * s0r;
    j00i += wu * s0i;
    j01r += wu * s1r;
    j01i += wu * s1i;
    j10r += wu * u * s0r;
    j10i += wu * u * s0i;
    j11r += wu * u * s1r;
    j11i += wu * u * s1i;
  }
  const s = lp * lq;
  out[0] = j00r * s;
  out[1] = j00i * s;
  out[2] = j10r * s;
  out[3] = j10i * s;
  out[4] = j01r * s;
  out[5] = j01i * s;
  out[6] = j11r * s;
  out[7] = j11i * s;
}

function nearPair(
  P: SegmentSet,
  p: number,
  Q: SegmentSet,
  q: number,
  k: number,
  a2: number,
  out: Float64Array,
): void {
  const p3 = 3 * p;
  const q3 = 3 * q;
  const lp = P.len[p];
  const lq = Q.len[q];
  const px = P.start[p3];
  const py = P.start[p3 + 1];
  const pz = P.start[p3 + 2];
  const dpx = P.dir[p3];
  const dpy = P.dir[p3 + 1];
  const dpz = P.dir[p3 + 2];
  const qx = Q.start[q3];
  const qy = Q.start[q3 + 1];
  const qz = Q.start[q3 + 2];
  const dqx = Q.dir[q3];
  const dqy = Q.dir[q3 + 1];
  const dqz = Q.dir[q3 + 2];
  const no = OUTER_NEAR.n;
  const UO = OUTER_NEAR.u;
  const WO = OUTER_NEAR.w;
  const ni = INNER_SMOOTH.n;
  const UI = INNER_SMOOTH.u;
  const WI = INNER_SMOOTH.w;
  let j00r = 0;
  let j00i = 0;
  let j10r = 0;
  let j10i = 0;
  let j01r = 0;
  let j01i = 0;
  let j11r = 0;
  let j11i = 0;
  for (let i = 0; i < no; i++) {
    const u = UO[i];
    const s = u * lp;
    const rx = px + s * dpx - qx;
    const ry = py + s * dpy - qy;
    const rz = pz + s * dpz - qz;
    // Closed-form static part.
    const w = rx * dqx + ry * dqy + rz * dqz;
    let rho2 = rx * rx + ry * ry + rz * rz - w * w;
    if (rho2 < 0) rho2 = 0;
    rho2 += a2;
    const rho = Math.sqrt(rho2);
    const lw = lq - w;
    const a0 = Math.asinh(lw / rho) + Math.asinh(w / rho);
    const a1 = Math.sqrt(lw * lw + rho2) - Math.sqrt(w * w + rho2) + w * a0;
    // Static part contributes only to the real part: K0 = ∫G dl′, K1 = ∫ v G dl′.
    let k0r = a0;
    let k0i = 0;
    let k1r = a1 / lq;
    let k1i = 0;
    // Smooth remainder (e^{−jkR} − 1)/R by Gauss on the source.
    for (let j = 0; j < ni; j++) {
      const v = UI[j];
      const t = v * lq;
      const ex = rx - t * dqx;
      const ey = ry - t * dqy;
      const ez = rz - t * dqz;
      const R = Math.sqrt(ex * ex + ey * ey + ez * ez + a2);
      const half = 0.5 * k * R;
      const sh = Math.sin(half);
      const wr = (WI[j] * lq) / R;
      const gr = -2 * sh * sh * wr; // cos kR − 1 = −2 sin²(kR/2), no cancellation
      const gi = -Math.sin(k * R) * wr;
      k0r += gr;
      k0i += gi;
      k1r += v * gr;
      k1i += v * gi;
    }
    const wu = WO[i] * lp;
    j00r += wu * k0r;
    j00i += wu * k0i;
    j01r += wu * k1r;
    j01i += wu * k1i;
    j10r += wu * u * k0r;
    j10i += wu * u * k0i;
    j11r += wu * u * k1r;
    j11i += wu * u * k1i;
  }
  out[0] = j00r;
  out[1] = j00i;
  out[2] = j10r;
  out[3] = j10i;
  out[4] = j01r;
  out[5] = j01i;
  out[6] = j11r;
  out[7] = j11i;
}

/**
 * Far pairs: G(u, v) ≈ G_mid·E_p(u)·E_q(v) with, on each segment, the phase taken linear and the
 * amplitude 1/R to first order: E(u) = e^{−jα(u − ½)}·(1 − β(u − ½)), where α = kℓ(t̂·R̂) and
 * β = ℓ(t̂·R̂)/R (signs flipped on the source side, since R shrinks as r′ moves along R̂).
 * Its moments are closed form in S(α) = sin(α/2)/(α/2):
 *   M0 = ∫E = S − jβS′,    M1 = ∫uE = M0/2 + jS′ + βS″,
 * and J_ab = ℓpℓq G_mid M_a(p) M_b(q). WHY: the phase across a λ/25 segment is a quarter radian; a
 * plain midpoint rule errs by (kℓ)²/24 ≈ 0.3 % there, this form by O((ℓ/d)²) only.
 */
function farPair(
  P: SegmentSet,
  p: number,
  Q: SegmentSet,
  q: number,
  k: number,
  a2: number,
  out: Float64Array,
): void {
  const p3 = 3 * p;
  const q3 = 3 * q;
  const ex = P.mid[p3] - Q.mid[q3];
  const ey = P.mid[p3 + 1] - Q.mid[q3 + 1];
  const ez = P.mid[p3 + 2] - Q.mid[q3 + 2];
  const R = Math.sqrt(ex * ex + ey * ey + ez * ez + a2);
  const lp = P.len[p];
  const lq = Q.len[q];
  const w = (lp * lq) / R;
  const gr = Math.cos(k * R) * w;
  const gi = -Math.sin(k * R) * w;
  const iR = 1 / R;
  const cp = (P.dir[p3] * ex + P.dir[p3 + 1] * ey + P.dir[p3 + 2] * ez) * iR;
  const cq = -(Q.dir[q3] * ex + Q.dir[q3 + 1] * ey + Q.dir[q3 + 2] * ez) * iR;
  moments(k * lp * cp, lp * cp * iR, M);
  const m0pr = M[0];
  const m0pi = M[1];
  const m1pr = M[2];
  const m1pi = M[3];
  moments(k * lq * cq, lq * cq * iR, M);
  const m0qr = M[0];
  const m0qi = M[1];
  const m1qr = M[2];
  const m1qi = M[3];
  // out = G·Ma(p)·Mb(q)
  let xr = m0pr * m0qr - m0pi * m0qi;
  let xi = m0pr * m0qi + m0pi * m0qr;
  out[0] = gr * xr - gi * xi;
  out[1] = gr * xi + gi * xr;
  xr = m1pr * m0qr - m1pi * m0qi;
  xi = m1pr * m0qi + m1pi * m0qr;
  out[2] = gr * xr - gi * xi;
  out[3] = gr * xi + gi * xr;
  xr = m0pr * m1qr - m0pi * m1qi;
  xi = m0pr * m1qi + m0pi * m1qr;
  out[4] = gr * xr - gi * xi;
  out[5] = gr * xi + gi * xr;
  xr = m1pr * m1qr - m1pi * m1qi;
  xi = m1pr * m1qi + m1pi * m1qr;
  out[6] = gr * xr - gi * xi;
  out[7] = gr * xi + gi * xr;
}

const M = new Float64Array(4);

/** [M0 re, M0 im, M1 re, M1 im] of E(u) = e^{−jα(u−½)}(1 − β(u−½)) on [0, 1]. */
function moments(alpha: number, beta: number, m: Float64Array): void {
  let S: number;
  let S1: number;
  let S2: number;
  const a2 = alpha * alpha;
  if (Math.abs(alpha) < 0.5) {
    // Taylor series of sin(α/2)/(α/2) and its derivatives; truncation below 1e-8 for |α| < 0.5.
    S = 1 - a2 / 24 + (a2 * a2) / 1920 - (a2 * a2 * a2) / 322560;
    S1 = alpha * (-1 / 12 + a2 / 480 - (a2 * a2) / 53760);
    S2 = -1 / 12 + a2 / 160 - (a2 * a2) / 10752;
  } else {
    const s = Math.sin(alpha / 2);
    const c = Math.cos(alpha / 2);
    S = s / (alpha / 2);
    S1 = (c - S) / alpha;
    S2 = (-0.5 * s - 2 * S1) / alpha;
  }
  // M0 = S − jβS′;  M1 = M0/2 + jS′ + βS″
  m[0] = S;
  m[1] = -beta * S1;
  m[2] = 0.5 * S + beta * S2;
  m[3] = -0.5 * beta * S1 + S1;
}
