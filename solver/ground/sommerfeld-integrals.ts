/**
 * The reflected field of an electric current element above a lossy half-space, as Sommerfeld integrals,
 * minus its quasi-static image. e^{jωt}; air (k0) above z = 0, ground ε_c = ε_r − jσ/(ωε₀) (k1² = ε_c k0²)
 * below, μ₀ everywhere.
 *
 * Derivation (Sommerfeld's Hertz-vector formulation; A. Sommerfeld, Partial Differential Equations in
 * Physics, 1949, §§31–33; Michalski & Mosig, IEEE Trans. AP 45(3), 1997, for the same coefficients in
 * transmission-line form). With u_i = √(λ² − k_i²) (Re ≥ 0), e = e^{−u0 Z}, Z = z + z′ (height of the
 * observer above the image of the source) and ρ the horizontal distance:
 *   vertical element:    Π_z = ∫ R_V J0(λρ) e λ/u0 dλ,            R_V = (ε_c u0 − u1)/(ε_c u0 + u1)
 *   horizontal (x̂):      Π_x = ∫ R_H J0 e λ/u0 dλ,                 R_H = (u0 − u1)/(u0 + u1)
 *                        Π_z = ∂x ∫ P J0 e λ dλ,   P = (R_V + R_H)/λ² = 2(ε_c − 1)/((ε_c u0 + u1)(u0 + u1))
 * (P from the boundary conditions ε Π_x, ε ∂zΠ_x, ε Π_z and ∇·Π continuous at z = 0), and E = k0²Π + ∇∇·Π,
 * in units where the element's Il/(4πjωε₀) = 1. Carrying out the derivatives:
 *   I1 = ∫ R_H (λ/u0) J0 e,  I2 = ∫ D λ³ J0 e,  I3 = ∫ D λ³ J2 e,  I5 = ∫ R_V (λ³/u0) J0 e,  I6 = ∫ R_V λ² J1 e,
 *   D = R_H/u0 − u0 P,
 * and the reflected dyadic (observation components × source components, ρ̂ from source to observer):
 *   horizontal ← horizontal:  (k0² I1 − ½I2 − ½I3) 𝐈_h + I3 ρ̂ρ̂
 *   z ← horizontal: −I6 ρ̂ᵀ     horizontal ← z: +I6 ρ̂     z ← z: I5
 * (the z←h entry is −∫(λ²P − R_H)λ²J1 e, equal to −I6 because λ²P − R_H = R_V: reciprocity holds exactly).
 * Divided by k0², this is the dyadic normalised like G = e^{−jkR}/R that kernel.ts asks for.
 *
 * Over a perfect conductor (R_V = 1, R_H = −1) these integrals are the image exactly. The quasi-static
 * image of either element is κ × the perfect image, κ = (ε_c − 1)/(ε_c + 1) (image charge of a point
 * charge over a dielectric), which holds all the 1/R³ singularity. We subtract it spectrally —
 * R_V → R_V − κ, R_H → R_H + κ — so what is left (the "remainder") is at most ~1/R′ at the image point.
 * The remaining integrands tend to constants c·Jn(λρ)e^{−λZ} for λ → ∞; those parts are integrated in
 * closed form, ∫₀^∞ Jn(λρ) e^{−λZ} dλ = ρⁿ/((R′ + Z)ⁿ R′), and the rest (decaying like λ⁻²) numerically.
 *
 * Numerical path: the real axis, split at k0 (branch point; λ = k0 sin t below, λ = k0 cosh t above,
 * which removes the 1/u0 singularity), graded toward k0 (where the pole of R_V lies close to the axis for
 * good ground) and toward Re k1 (branch point of u1, close to the axis for low-loss ground), then panels of
 * at most 1.5/ρ per Gauss rule, geometric growth where ρ is small, to a cut-off well past Re k1 and 1/R′.
 */
import { besselJ0, besselJ1, besselJ2 } from "./bessel";
import { csqrt } from "./fresnel";

/** The five remainder integrals at one (ρ, Z), complex, interleaved: [I1, I2, I3, I5, I6] → 10 numbers. */
export const REMAINDER_COMPONENTS = 5;

export interface HalfSpaceParams {
  k0: number;
  /** ε_c = ε_r − jσ/(ωε₀). */
  epsRe: number;
  epsIm: number;
}

// ---- small complex helpers on [re, im] tuples (clarity first; the table is built once per frequency) ----
type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const scale = (a: C, s: number): C => [a[0] * s, a[1] * s];

export function kappa(h: HalfSpaceParams): C {
  return div([h.epsRe - 1, h.epsIm], [h.epsRe + 1, h.epsIm]);
}

/**
 * Spectral amplitudes at real λ, given u0 and the Jacobian dλ/dt and (dλ/dt)/u0 of the substitution in
 * use (so 1/u0 never appears alone near the branch point). Returns, already times dλ/dt:
 *   a1 = R̂_H λ/u0,  a2 = D̂ λ³ (= a3),  a5 = R̂_V λ³/u0,  a6 = R̂_V λ²      (R̂: κ-image removed)
 */
function amplitudes(h: HalfSpaceParams, kap: C, lam: number, u0: C, dl: number, dlOverU0: C, out: C[]): void {
  const eps: C = [h.epsRe, h.epsIm];
  const k1sq: C = [h.k0 * h.k0 * h.epsRe, h.k0 * h.k0 * h.epsIm];
  const u1 = csqrt(lam * lam - k1sq[0], -k1sq[1]);
  const eu0 = mul(eps, u0);
  const dv = add(eu0, u1);
  const dh = add(u0, u1);
  const rv = div(sub(eu0, u1), dv);
  const rh = div(sub(u0, u1), dh);
  const rvHat = sub(rv, kap);
  const rhHat = add(rh, kap);
  // P = 2(ε − 1)/((ε u0 + u1)(u0 + u1)), no cancellation at small λ.
  const P = div([2 * (h.epsRe - 1), 2 * h.epsIm], mul(dv, dh));
  // D̂·dλ = R̂_H (dλ/u0) − u0 P dλ   (P has no κ part: R̂_V + R̂_H = R_V + R_H)
  const dHat = sub(mul(rhHat, dlOverU0), scale(mul(u0, P), dl));
  const l2 = lam * lam;
  out[0] = scale(mul(rhHat, dlOverU0), lam);
  out[1] = scale(dHat, l2 * lam);
  out[2] = scale(mul(rvHat, dlOverU0), l2 * lam);
  out[3] = scale(rvHat, l2 * dl);
}

/** λ → ∞ limits c1, c2, c5, c6 of the amplitudes (per unit dλ), taken numerically far out. */
export function asymptoticConstants(h: HalfSpaceParams): C[] {
  const kap = kappa(h);
  const k1 = Math.sqrt(Math.hypot(h.epsRe, h.epsIm)) * h.k0;
  const lam = 1e3 * (k1 + h.k0);
  const u0 = Math.sqrt(lam * lam - h.k0 * h.k0);
  const out: C[] = [
    [0, 0],
    [0, 0],
    [0, 0],
    [0, 0],
  ];
  amplitudes(h, kap, lam, [u0, 0], 1, [1 / u0, 0], out);
  return out;
}

/** Precomputed, per frequency, what every (ρ, Z) evaluation shares. */
export interface RemainderContext {
  h: HalfSpaceParams;
  kap: C;
  c: C[];
  /** |k1|, Re k1 and Im k1 (rad/m). */
  k1Abs: number;
  k1Re: number;
  k1Im: number;
}

export function remainderContext(h: HalfSpaceParams): RemainderContext {
  const [k1r, k1i] = csqrt(h.k0 * h.k0 * h.epsRe, h.k0 * h.k0 * h.epsIm);
  const k1Abs = h.k0 * Math.sqrt(Math.hypot(h.epsRe, h.epsIm));
  return { h, kap: kappa(h), c: asymptoticConstants(h), k1Abs, k1Re: Math.abs(k1r), k1Im: k1i };
}

// 8-point Gauss–Legendre on [−1, 1] (A&S Table 25.4).
const GX = [
  -0.9602898564975363, -0.7966664774136267, -0.525532409916329, -0.1834346424956498, 0.1834346424956498,
  0.525532409916329, 0.7966664774136267, 0.9602898564975363,
];
const GW = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.362683783378362, 0.362683783378362,
  0.3137066458778873, 0.2223810344533745, 0.1012285362903763,
];

/** Geometric grading of breakpoints toward `at` from distance `span`: at ± span·4^{−i}, down to `floor`. */
function graded(at: number, span: number, floor: number, sign: 1 | -1, into: number[]): void {
  for (let d = span; d > floor; d /= 4) into.push(at + sign * d);
}

/**
 * The remainder integrals at horizontal distance ρ ≥ 0 and image height Z ≥ 0 (not both 0), into
 * out[0..9] as [I1, I2, I3, I5, I6] (re, im), in units of Il/(4πjωε₀); see the header.
 */
export function remainderIntegrals(ctx: RemainderContext, rho: number, Z: number, out: Float64Array): void {
  const { h, kap, c } = ctx;
  const k0 = h.k0;
  const R = Math.hypot(rho, Z);
  // Hot loop: scalar complex arithmetic, no allocation (the table calls this ~10³ times per frequency,
  // each with a few thousand λ points).
  const er = h.epsRe;
  const ei = h.epsIm;
  const k1r2 = k0 * k0 * er;
  const k1i2 = k0 * k0 * ei;
  const kr = kap[0];
  const ki = kap[1];
  const pr0 = 2 * (er - 1);
  const pi0 = 2 * ei;
  const c1r = c[0][0];
  const c1i = c[0][1];
  const c2r = c[1][0];
  const c2i = c[1][1];
  const c5r = c[2][0];
  const c5i = c[2][1];
  const c6r = c[3][0];
  const c6i = c[3][1];
  let a1r = 0;
  let a1i = 0;
  let a2r = 0;
  let a2i = 0;
  let a3r = 0;
  let a3i = 0;
  let a5r = 0;
  let a5i = 0;
  let a6r = 0;
  let a6i = 0;
  // One quadrature point; see amplitudes() for the formulas (kept there in readable form).
  const point = (lam: number, u0r: number, u0i: number, dl: number, qr: number, qi: number, w: number) => {
    // u1 = √(λ² − k1²), Re ≥ 0
    const sr = lam * lam - k1r2;
    const si = -k1i2;
    const m = Math.hypot(sr, si);
    const u1r = Math.sqrt((m + sr) / 2);
    let u1i = Math.sqrt(Math.max(0, (m - sr) / 2));
    if (si < 0) u1i = -u1i;
    // ε u0
    const eur = er * u0r - ei * u0i;
    const eui = er * u0i + ei * u0r;
    // R_V = (εu0 − u1)/(εu0 + u1)
    const dvr = eur + u1r;
    const dvi = eui + u1i;
    const dv2 = dvr * dvr + dvi * dvi;
    const nvr = eur - u1r;
    const nvi = eui - u1i;
    const rvr = (nvr * dvr + nvi * dvi) / dv2 - kr;
    const rvi = (nvi * dvr - nvr * dvi) / dv2 - ki;
    // R_H = (u0 − u1)/(u0 + u1)
    const dhr = u0r + u1r;
    const dhi = u0i + u1i;
    const dh2 = dhr * dhr + dhi * dhi;
    const nhr = u0r - u1r;
    const nhi = u0i - u1i;
    const rhr = (nhr * dhr + nhi * dhi) / dh2 + kr;
    const rhi = (nhi * dhr - nhr * dhi) / dh2 + ki;
    // P = 2(ε − 1)/(dv·dh)
    const ddr = dvr * dhr - dvi * dhi;
    const ddi = dvr * dhi + dvi * dhr;
    const dd2 = ddr * ddr + ddi * ddi;
    const Pr = (pr0 * ddr + pi0 * ddi) / dd2;
    const Pi = (pi0 * ddr - pr0 * ddi) / dd2;
    // R̂_H·q and R̂_V·q, q = (dλ/dt)/u0
    const hqr = rhr * qr - rhi * qi;
    const hqi = rhr * qi + rhi * qr;
    const vqr = rvr * qr - rvi * qi;
    const vqi = rvr * qi + rvi * qr;
    // D̂ dλ = R̂_H q − u0 P dλ
    const dr = hqr - (u0r * Pr - u0i * Pi) * dl;
    const di = hqi - (u0r * Pi + u0i * Pr) * dl;
    const l2 = lam * lam;
    const l3 = l2 * lam;
    // e^{−u0 Z}
    const ex = Math.exp(-u0r * Z);
    const er0 = ex * Math.cos(u0i * Z);
    const ei0 = -ex * Math.sin(u0i * Z);
    const es = Math.exp(-lam * Z) * dl;
    const x = lam * rho;
    const j0 = besselJ0(x) * w;
    const j1 = besselJ1(x) * w;
    const j2 = besselJ2(x) * w;
    // amplitude × e, minus asymptote × e^{−λZ}
    let vr = lam * (hqr * er0 - hqi * ei0);
    let vi = lam * (hqr * ei0 + hqi * er0);
    a1r += j0 * (vr - c1r * es);
    a1i += j0 * (vi - c1i * es);
    vr = l3 * (dr * er0 - di * ei0) - c2r * es;
    vi = l3 * (dr * ei0 + di * er0) - c2i * es;
    a2r += j0 * vr;
    a2i += j0 * vi;
    a3r += j2 * vr;
    a3i += j2 * vi;
    vr = l3 * (vqr * er0 - vqi * ei0);
    vi = l3 * (vqr * ei0 + vqi * er0);
    a5r += j0 * (vr - c5r * es);
    a5i += j0 * (vi - c5i * es);
    vr = l2 * dl * (rvr * er0 - rvi * ei0);
    vi = l2 * dl * (rvr * ei0 + rvi * er0);
    a6r += j1 * (vr - c6r * es);
    a6i += j1 * (vi - c6i * es);
  };
  const scaleLen = Math.max(rho, Z, 1e-9 / k0);
  // Grading toward k0 stops well inside the distance of R_V's pole from it, ≈ k0/(2|ε_c|).
  const floorRel = Math.min(1e-4, 0.01 / Math.hypot(h.epsRe, h.epsIm));

  // Segment A: λ = k0 sin t, t ∈ [0, π/2]; u0 = j k0 cos t, dλ = k0 cos t dt, dλ/u0 = −j dt.
  {
    const nA = Math.ceil((k0 * (rho + Z)) / 1.5) + 1;
    const bp: number[] = [];
    for (let i = 0; i <= nA; i++) bp.push(((Math.PI / 2) * i) / nA);
    graded(Math.PI / 2, Math.PI / 2 / nA / 2, Math.sqrt(2 * floorRel), -1, bp);
    bp.sort((a, b) => a - b);
    for (let p = 0; p + 1 < bp.length; p++) {
      const a = bp[p];
      const b = bp[p + 1];
      if (b - a <= 0) continue;
      const hw = (b - a) / 2;
      for (let g = 0; g < 8; g++) {
        const t = a + hw * (1 + GX[g]);
        const ct = Math.cos(t);
        point(k0 * Math.sin(t), 0, k0 * ct, k0 * ct, 0, -1, GW[g] * hw);
      }
    }
  }
  // Upper limit: where e^{−λZ} has killed the integrand, or well past Re k1 and 1/R′ where what is left
  // after the asymptote decays like λ⁻².
  const cut = Math.max(3 * k0, Math.min(Z > 0 ? 30 / Z : Number.POSITIVE_INFINITY, 20 * ctx.k1Abs + 60 / R));
  // Segment B: λ = k0 cosh t from k0 to λ_B; u0 = k0 sinh t, dλ = k0 sinh t dt, dλ/u0 = dt.
  const lamB = Math.min(1.5 * ctx.k1Abs + 2 * k0, cut);
  {
    const lbp: number[] = [k0, lamB];
    graded(k0, 0.5 * k0, floorRel * k0, 1, lbp);
    if (ctx.k1Re > k0 && ctx.k1Re < lamB) {
      const kr = ctx.k1Re;
      lbp.push(kr);
      const floorK1 = Math.max(1e-7 * k0, 0.05 * Math.abs(ctx.k1Im));
      graded(kr, 0.5 * Math.min(kr - k0, lamB - kr), floorK1, 1, lbp);
      graded(kr, 0.5 * Math.min(kr - k0, lamB - kr), floorK1, -1, lbp);
    }
    // Oscillation of Jn(λρ) and e^{−u0 Z}: at most 1.5 rad per panel; geometric growth where ρ is small.
    for (let l = 1.5 * k0; l < lamB; ) {
      lbp.push(l);
      l += Math.min(1.5 / scaleLen, 0.3 * l);
    }
    lbp.sort((a, b) => a - b);
    for (let p = 0; p + 1 < lbp.length; p++) {
      const a = Math.acosh(Math.max(1, lbp[p] / k0));
      const b = Math.acosh(lbp[p + 1] / k0);
      if (b - a <= 0) continue;
      const hw = (b - a) / 2;
      for (let g = 0; g < 8; g++) {
        const t = a + hw * (1 + GX[g]);
        const st = k0 * Math.sinh(t);
        point(k0 * Math.cosh(t), st, 0, st, 1, 0, GW[g] * hw);
      }
    }
  }
  // Segment C: λ from λ_B on, plain variable; same panel rule.
  {
    let a = lamB;
    while (a < cut) {
      const width = Math.min(1.5 / scaleLen, 0.3 * a, cut - a);
      const hw = width / 2;
      for (let g = 0; g < 8; g++) {
        const lam = a + hw * (1 + GX[g]);
        const u0 = Math.sqrt(lam * lam - k0 * k0);
        point(lam, u0, 0, 1, 1 / u0, 0, GW[g] * hw);
      }
      a += width;
    }
  }
  // Closed-form asymptotic parts: ∫₀^∞ Jn(λρ) e^{−λZ} dλ.
  const L0 = 1 / R;
  const L1 = rho / ((R + Z) * R);
  const L2 = (rho * rho) / ((R + Z) * (R + Z) * R);
  out[0] = a1r + c1r * L0;
  out[1] = a1i + c1i * L0;
  out[2] = a2r + c2r * L0;
  out[3] = a2i + c2i * L0;
  out[4] = a3r + c2r * L2;
  out[5] = a3i + c2i * L2;
  out[6] = a5r + c5r * L0;
  out[7] = a5i + c5i * L0;
  out[8] = a6r + c6r * L1;
  out[9] = a6i + c6i * L1;
}
