/**
 * Plane-wave reflection from a homogeneous lossy half-space (z < 0), e^{jωt} convention.
 *
 * With ψ the elevation (grazing) angle of the ray and ε_c = ε_r − jσ/(ωε₀):
 *   R_v = (ε_c sinψ − √(ε_c − cos²ψ)) / (ε_c sinψ + √(ε_c − cos²ψ))     (E in the plane of incidence)
 *   R_h = (sinψ − √(ε_c − cos²ψ)) / (sinψ + √(ε_c − cos²ψ))             (E parallel to the ground)
 * (Balanis, Advanced Engineering Electromagnetics, 2nd ed., §5.3; Collin, Antennas and Radiowave Propagation.)
 * Limits: σ → ∞ gives R_v → +1, R_h → −1; ψ → 0 gives both → −1.
 *
 * How the far field uses them: take the perfect-ground image (mirrored geometry, horizontal current
 * reversed, vertical current kept) and weight its θ-part by R_v and its φ-part by −R_h. Over a perfect
 * conductor both weights are 1 and the plain image comes back.
 */

import { EPS0 } from "../model/constants";

export interface Reflection {
  rvRe: number;
  rvIm: number;
  rhRe: number;
  rhIm: number;
}

/** Relative complex permittivity ε_r − jσ/(ωε₀) as [re, im]. */
export function complexPermittivity(
  permittivity: number,
  conductivity: number,
  omega: number,
): [number, number] {
  return [permittivity, -conductivity / (omega * EPS0)];
}

/** Principal complex square root with non-negative real part. */
export function csqrt(re: number, im: number): [number, number] {
  const m = Math.hypot(re, im);
  const r = Math.sqrt((m + re) / 2);
  const i = Math.sqrt(Math.max(0, (m - re) / 2));
  return [r, im < 0 ? -i : i];
}

function cdiv(ar: number, ai: number, br: number, bi: number): [number, number] {
  const d = br * br + bi * bi;
  return [(ar * br + ai * bi) / d, (ai * br - ar * bi) / d];
}

/** Fresnel coefficients at elevation ψ (radians, 0..π/2) for ground (ε_r, σ) at angular frequency ω. */
export function fresnel(permittivity: number, conductivity: number, omega: number, psi: number): Reflection {
  const [er, ei] = complexPermittivity(permittivity, conductivity, omega);
  const s = Math.sin(psi);
  const c = Math.cos(psi);
  const [qr, qi] = csqrt(er - c * c, ei);
  // Vertical: (ε s − q) / (ε s + q)
  const [rv0, rv1] = cdiv(er * s - qr, ei * s - qi, er * s + qr, ei * s + qi);
  // Horizontal: (s − q) / (s + q)
  const [rh0, rh1] = cdiv(s - qr, -qi, s + qr, qi);
  return { rvRe: rv0, rvIm: rv1, rhRe: rh0, rhIm: rh1 };
}
