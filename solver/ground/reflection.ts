/**
 * Real ground, fast method: the perfect-ground image of each source segment, weighted per segment pair by
 * the Fresnel reflection coefficients at the specular angle between the two segments (midpoint to
 * mirrored midpoint). Good for wires well above the ground (≳ 0.1–0.25 λ); below that the near field of
 * the image is not a plane wave and the rigorous (Sommerfeld) method should run.
 *
 * Weighting, per pair (observation p, source q): let ρ̂ be the horizontal unit vector from the image of
 * q's midpoint toward p's midpoint, φ̂ = ẑ × ρ̂, and ψ the elevation of that ray. The part of the source's
 * image current in the plane of incidence (ρ̂, ẑ) radiates vertically polarised waves toward p and is
 * weighted by R_v(ψ); the part along φ̂ radiates horizontally polarised waves and is weighted by −R_h(ψ)
 * (so that both weights are +1 over a perfect conductor). With t̂_q̃ = (−t_x, −t_y, t_z) the perfect image
 * current direction:
 *   vector term:  t̂_p · W · t̂_q̃,   W = R_v (ρ̂ρ̂ + ẑẑ) − R_h φ̂φ̂
 * which is the same split the far field uses (θ-part by R_v, φ-part by −R_h), so near and far agree in
 * the plane-wave limit. The image charge is weighted by the image current's component along the image
 * segment, w(t) = t̂_q̃·W·t̂_q̃; we take the mean of w over the two segments so the pair terms stay
 * reciprocal (Z symmetric). For a vertical segment w = R_v; for a horizontal one broadside to the ray
 * w = −R_h; at normal incidence (ρ = 0) R_v = −R_h and all choices coincide.
 * σ → ∞ gives R_v = 1, R_h = −1, W = 𝐈, w = 1: exactly the perfect image.
 */
import { pairIntegrals } from "../mom/pair-integrals";
import type { SegmentSet } from "../mom/segments";
import { fresnel } from "./fresnel";

export interface ReflectionWeights {
  /** Complex weight of the vector-potential image term: t̂_p·W·t̂_q̃ (re, im). */
  vecRe: number;
  vecIm: number;
  /** Complex weight of the image charge (scalar potential), relative to the perfect image. */
  chargeRe: number;
  chargeIm: number;
}

/**
 * Specular-angle weights for observation segment p of P and source segment q, with `M` the mirrored set
 * (M.dir = (t_x, t_y, −t_z)). Pure function of geometry, ground and ω.
 */
export function reflectionWeights(
  P: SegmentSet,
  p: number,
  M: SegmentSet,
  q: number,
  permittivity: number,
  conductivity: number,
  omega: number,
  out: ReflectionWeights,
): ReflectionWeights {
  const p3 = 3 * p;
  const q3 = 3 * q;
  // Ray from the image midpoint to the observation midpoint.
  const dx = P.mid[p3] - M.mid[q3];
  const dy = P.mid[p3 + 1] - M.mid[q3 + 1];
  const dz = P.mid[p3 + 2] - M.mid[q3 + 2];
  const rho = Math.hypot(dx, dy);
  const psi = Math.atan2(Math.abs(dz), rho);
  const r = fresnel(permittivity, conductivity, omega, psi);
  // Horizontal unit vector along the ray; at ρ = 0 any direction will do (R_v = −R_h there).
  let rx = 1;
  let ry = 0;
  if (rho > 1e-12 * (Math.abs(dz) + 1e-300)) {
    rx = dx / rho;
    ry = dy / rho;
  }
  // Observation tangent t̂_p, and the perfect image current direction of q: t̂_q̃ = −M.dir = (−t_x, −t_y, t_z)
  // (the perfect kernel adds −(t̂_p·M.dir) J, i.e. +(t̂_p·t̂_q̃) J), both
  const tpx = P.dir[p3];
  const tpy = P.dir[p3 + 1];
  const tpz = P.dir[p3 + 2];
  const iqx = -M.dir[q3];
  const iqy = -M.dir[q3 + 1];
  const iqz = -M.dir[q3 + 2];
  // expressed in the (ρ̂, φ̂, ẑ) frame, φ̂ = ẑ × ρ̂ = (−ry, rx, 0).
  const pr = tpx * rx + tpy * ry;
  const pf = -tpx * ry + tpy * rx;
  const qr = iqx * rx + iqy * ry;
  const qf = -iqx * ry + iqy * rx;
  // t̂_p·W·t̂_q̃ = R_v (pr qr + tpz iqz) − R_h pf qf
  const inPlane = pr * qr + tpz * iqz;
  const across = pf * qf;
  out.vecRe = r.rvRe * inPlane - r.rhRe * across;
  out.vecIm = r.rvIm * inPlane - r.rhIm * across;
  // Charge weight: mean over the two segments of w(t) = R_v (t_ρ² + t_z²) − R_h t_φ², using the image
  // direction of each (its components have the same squares as the real tangent's).
  const inP = 0.5 * (pr * pr + tpz * tpz + qr * qr + iqz * iqz);
  const acP = 0.5 * (pf * pf + qf * qf);
  out.chargeRe = r.rvRe * inP - r.rhRe * acP;
  out.chargeIm = r.rvIm * inP - r.rhIm * acP;
  return out;
}

/** Complex multiply-subtract helper: out[i..i+1] −= (wr + j wi)(ar + j ai). */
function subMul(out: Float64Array, i: number, wr: number, wi: number, ar: number, ai: number): void {
  out[i] -= wr * ar - wi * ai;
  out[i + 1] -= wr * ai + wi * ar;
}

/**
 * ADD the reflection-method terms of pair (p, q) into out[0..9] (kernel.ts layout). `j` is scratch of
 * length 8 for the image integrals; `w` scratch for the weights.
 */
export function reflectionPairTerms(
  P: SegmentSet,
  p: number,
  M: SegmentSet,
  q: number,
  k: number,
  permittivity: number,
  conductivity: number,
  omega: number,
  j: Float64Array,
  w: ReflectionWeights,
  out: Float64Array,
): void {
  pairIntegrals(P, p, M, q, k, j);
  reflectionWeights(P, p, M, q, permittivity, conductivity, omega, w);
  // Perfect ground adds +(t̂_p·t̂_q̃) J_ab to the vector terms and −J_00 to the scalar one; here
  // t̂_p·W·t̂_q̃ replaces the plain dot product and the charge weight multiplies the scalar image.
  for (let i = 0; i < 8; i += 2) subMul(out, i, -w.vecRe, -w.vecIm, j[i], j[i + 1]);
  subMul(out, 8, w.chargeRe, w.chargeIm, j[0], j[1]);
}
