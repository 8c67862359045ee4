/**
 * Power into a lossy ground, from the plane-wave spectrum of the solved currents — independent of the
 * matrix fill and of the far field, so accepted = radiated + ground loss + wire/load loss is a real check.
 *
 * The currents J (all in z > 0) radiate downward a spectrum of plane waves, propagating (k_ρ < k0) and
 * evanescent (k_ρ > k0). At z = 0 each is split into TE (E ∥ ê = ẑ × k̂_ρ) and TM (H ∥ ê) parts, and the
 * part transmitted into the ground carries the power (Parseval over the plane z = 0):
 *   P = 1/(2π)² ∫∫ [ ½|E_t|² Im(u1)/(ωμ₀)  +  ½|H_t|² Re(u1/(jωε₀ε_c)) ] dk_x dk_y
 *   E_t = −jωμ₀ (ê·J̃)/(u0 + u1),           (TE: transmission 1 + R_H = 2u0/(u0 + u1))
 *   H_t = −j ê·(k⃗ × J̃) ε_c/(ε_c u0 + u1),  (TM: transmission of H, 1 + R_V = 2ε_c u0/(ε_c u0 + u1))
 *   J̃ = ∫ J(r′) e^{j(k_x x′ + k_y y′)} e^{−u0 z′} dV′,  k⃗ = (k_x, k_y, j u0),  u_i = √(k_ρ² − k_i²).
 * (e^{jωt}; the direct field's spectrum is −jωμ₀/(2u0)·(𝐈 − k⃗k⃗/k0²)·J̃ below the sources — Chew, Waves
 * and Fields in Inhomogeneous Media, §2.2 — and the downward Poynting flux of a TE/TM wave in the ground
 * follows from Faraday's and Ampère's laws for e^{u1 z}.) Segment currents are linear, so J̃ is a
 * closed form per segment. k_ρ runs over [0, k0] as k0 sin t and over [k0, ∞) as k0 cosh t (smooth at the
 * branch point), up to where e^{−u0 z_min} has killed the spectrum; the angle by the trapezoid rule.
 *
 * Valid for wires strictly above the ground. A wire end on z = 0 injects current into the soil that this
 * spectral sum does not see (it would need the source in the lower medium), so it refuses such meshes.
 */

import { EPS0 } from "../model/constants";
import type { MeshView, SegmentCurrents } from "../model/types";
import { csqrt } from "./fresnel";

const MU0 = 1.25663706212e-6;
const C0 = 299_792_458;

export interface GroundLossOptions {
  /** Angular points (minimum; more are used where the model is wide). Default 48. */
  angles?: number;
}

/** Power (W) flowing into the ground z < 0 for the given currents; throws if any segment touches z ≤ 0. */
export function groundLossWatts(
  mesh: MeshView,
  currents: SegmentCurrents,
  frequencyHz: number,
  ground: { permittivity: number; conductivity: number },
  options: GroundLossOptions = {},
): number {
  const omega = 2 * Math.PI * frequencyHz;
  const k0 = omega / C0;
  const er = ground.permittivity;
  const ei = -ground.conductivity / (omega * EPS0);
  const n = mesh.segments;
  let zmin = Number.POSITIVE_INFINITY;
  let xmin = Number.POSITIVE_INFINITY;
  let xmax = Number.NEGATIVE_INFINITY;
  let ymin = xmin;
  let ymax = xmax;
  for (let s = 0; s < n; s++) {
    for (const arr of [mesh.starts, mesh.ends]) {
      zmin = Math.min(zmin, arr[3 * s + 2]);
      xmin = Math.min(xmin, arr[3 * s]);
      xmax = Math.max(xmax, arr[3 * s]);
      ymin = Math.min(ymin, arr[3 * s + 1]);
      ymax = Math.max(ymax, arr[3 * s + 1]);
    }
  }
  if (!(zmin > 0)) {
    throw new Error("groundLossWatts: the spectral ground-loss sum needs every wire strictly above z = 0");
  }
  const width = Math.hypot(xmax - xmin, ymax - ymin);
  const cx = (xmin + xmax) / 2;
  const cy = (ymin + ymax) / 2;
  const kMax = k0 + 36 / zmin;
  const k1sqRe = k0 * k0 * er;
  const k1sqIm = k0 * k0 * ei;

  // Spectral power density (per dk_x dk_y, before the 1/(2π)²) at one (k_ρ, α).
  const jt = [0, 0, 0, 0, 0, 0]; // J̃ xyz re/im
  const density = (kr: number, u0r: number, u0i: number, ca: number, sa: number): number => {
    const kx = kr * ca;
    const ky = kr * sa;
    spectrum(mesh, currents, kx, ky, u0r, u0i, cx, cy, jt);
    const [u1r, u1i] = csqrt(kr * kr - k1sqRe, -k1sqIm);
    // TE: ê = (−sinα, cosα, 0).
    const jeR = -sa * jt[0] + ca * jt[2];
    const jeI = -sa * jt[1] + ca * jt[3];
    // |E_t|² = (ωμ)² |J_e|² / |u0 + u1|²
    const dTe = (u0r + u1r) ** 2 + (u0i + u1i) ** 2;
    const et2 = ((omega * MU0) ** 2 * (jeR * jeR + jeI * jeI)) / dTe;
    const pTe = (0.5 * et2 * u1i) / (omega * MU0);
    // TM: ê·(k⃗ × J̃) = J̃·(ê × k⃗). ê × k⃗ with k⃗ = (kx, ky, j u0): ê = (−sa, ca, 0):
    //   (ca·ju0 − 0, 0 − (−sa)·ju0, −sa·ky − ca·kx) = (j u0 ca, j u0 sa, −k_ρ)
    // j u0 = (−u0i, u0r)
    const ax = [-u0i * ca, u0r * ca];
    const ay = [-u0i * sa, u0r * sa];
    const tr = ax[0] * jt[0] - ax[1] * jt[1] + ay[0] * jt[2] - ay[1] * jt[3] - kr * jt[4];
    const ti = ax[0] * jt[1] + ax[1] * jt[0] + ay[0] * jt[3] + ay[1] * jt[2] - kr * jt[5];
    // H_t = −j (tr + j ti) ε/(ε u0 + u1): |H_t|² = |t|² |ε|² / |ε u0 + u1|²
    const dvr = er * u0r - ei * u0i + u1r;
    const dvi = er * u0i + ei * u0r + u1i;
    const ht2 = ((tr * tr + ti * ti) * (er * er + ei * ei)) / (dvr * dvr + dvi * dvi);
    // Re(u1/(jωε₀ε_c)): jωε₀ε_c = ωε₀(−ei + j er)
    const yr = -omega * EPS0 * ei;
    const yi = omega * EPS0 * er;
    const ydd = yr * yr + yi * yi;
    const reZ = (u1r * yr + u1i * yi) / ydd;
    const pTm = 0.5 * ht2 * reZ;
    return pTe + pTm;
  };

  const ringPower = (kr: number, u0r: number, u0i: number): number => {
    const na = Math.max(options.angles ?? 48, Math.ceil(kr * width * 1.2) + 24);
    let s = 0;
    for (let i = 0; i < na; i++) {
      const a = (2 * Math.PI * i) / na;
      s += density(kr, u0r, u0i, Math.cos(a), Math.sin(a));
    }
    return (s * 2 * Math.PI) / na;
  };

  // 16-point Gauss–Legendre panels.
  const g = gauss16();
  let total = 0;
  // Propagating: k_ρ = k0 sin t, u0 = j k0 cos t, k_ρ dk_ρ = k0² sin t cos t dt.
  const nA = 6;
  for (let p = 0; p < nA; p++) {
    const a = ((Math.PI / 2) * p) / nA;
    const b = ((Math.PI / 2) * (p + 1)) / nA;
    for (let i = 0; i < 16; i++) {
      const t = a + (b - a) * g.x[i];
      const w = (b - a) * g.w[i];
      const kr = k0 * Math.sin(t);
      total += w * k0 * k0 * Math.sin(t) * Math.cos(t) * ringPower(kr, 0, k0 * Math.cos(t));
    }
  }
  // Evanescent: k_ρ = k0 cosh t, u0 = k0 sinh t, k_ρ dk_ρ = k0² cosh t sinh t dt; panels of 1 in k_ρ z_min.
  const tMax = Math.acosh(kMax / k0);
  const nB = Math.max(8, Math.ceil((kMax - k0) * zmin * 0.7) + Math.ceil(tMax * 4));
  for (let p = 0; p < nB; p++) {
    const a = (tMax * p) / nB;
    const b = (tMax * (p + 1)) / nB;
    for (let i = 0; i < 16; i++) {
      const t = a + (b - a) * g.x[i];
      const w = (b - a) * g.w[i];
      const kr = k0 * Math.cosh(t);
      total += w * k0 * k0 * Math.cosh(t) * Math.sinh(t) * ringPower(kr, k0 * Math.sinh(t), 0);
    }
  }
  return total / (4 * Math.PI * Math.PI);
}

/** J̃ of the linear segment currents at (k_x, k_y) with u0 complex, origin shifted to (cx, cy) (a phase only). */
function spectrum(
  mesh: MeshView,
  c: SegmentCurrents,
  kx: number,
  ky: number,
  u0r: number,
  u0i: number,
  cx: number,
  cy: number,
  out: number[],
): void {
  for (let i = 0; i < 6; i++) out[i] = 0;
  const n = mesh.segments;
  for (let s = 0; s < n; s++) {
    const ax = mesh.starts[3 * s] - cx;
    const ay = mesh.starts[3 * s + 1] - cy;
    const az = mesh.starts[3 * s + 2];
    const dx = mesh.ends[3 * s] - mesh.starts[3 * s];
    const dy = mesh.ends[3 * s + 1] - mesh.starts[3 * s + 1];
    const dz = mesh.ends[3 * s + 2] - az;
    const len = Math.hypot(dx, dy, dz);
    if (len === 0) continue;
    // Exponent φ(u) = φa + x u, u ∈ [0, 1]: φa = j(kx ax + ky ay) − u0 az, x = j(kx dx + ky dy) − u0 dz.
    const par = -u0r * az;
    const pai = kx * ax + ky * ay - u0i * az;
    const xr = -u0r * dz;
    const xi = kx * dx + ky * dy - u0i * dz;
    // e^{φa}
    const ea = Math.exp(par);
    const eaR = ea * Math.cos(pai);
    const eaI = ea * Math.sin(pai);
    // E0 = ∫ e^{xu} du, E1 = ∫ u e^{xu} du
    let e0r: number;
    let e0i: number;
    let e1r: number;
    let e1i: number;
    const xm = Math.hypot(xr, xi);
    if (xm < 1e-3) {
      // Series: E0 = 1 + x/2 + x²/6, E1 = 1/2 + x/3 + x²/8
      const x2r = xr * xr - xi * xi;
      const x2i = 2 * xr * xi;
      e0r = 1 + xr / 2 + x2r / 6;
      e0i = xi / 2 + x2i / 6;
      e1r = 0.5 + xr / 3 + x2r / 8;
      e1i = xi / 3 + x2i / 8;
    } else {
      const ex = Math.exp(xr);
      const exr = ex * Math.cos(xi);
      const exi = ex * Math.sin(xi);
      // E0 = (e^x − 1)/x
      const d = xr * xr + xi * xi;
      const nr = exr - 1;
      const ni = exi;
      e0r = (nr * xr + ni * xi) / d;
      e0i = (ni * xr - nr * xi) / d;
      // E1 = (e^x (x − 1) + 1)/x²
      const mr = exr * (xr - 1) - exi * xi + 1;
      const mi = exr * xi + exi * (xr - 1);
      const x2r = xr * xr - xi * xi;
      const x2i = 2 * xr * xi;
      const d2 = x2r * x2r + x2i * x2i;
      e1r = (mr * x2r + mi * x2i) / d2;
      e1i = (mi * x2r - mr * x2i) / d2;
    }
    // ∫ (Ia(1 − u) + Ib u) e^{xu} du = Ia (E0 − E1) + Ib E1
    const iar = c.startRe[s];
    const iai = c.startIm[s];
    const ibr = c.endRe[s];
    const ibi = c.endIm[s];
    const ar = e0r - e1r;
    const ai = e0i - e1i;
    let vr = iar * ar - iai * ai + ibr * e1r - ibi * e1i;
    let vi = iar * ai + iai * ar + ibr * e1i + ibi * e1r;
    // × ℓ e^{φa}; direction t̂ = d/ℓ, so × d overall
    const tr = vr * eaR - vi * eaI;
    const ti = vr * eaI + vi * eaR;
    vr = tr;
    vi = ti;
    out[0] += vr * dx;
    out[1] += vi * dx;
    out[2] += vr * dy;
    out[3] += vi * dy;
    out[4] += vr * dz;
    out[5] += vi * dz;
  }
}

let g16: { x: number[]; w: number[] } | undefined;
/** 16-point Gauss–Legendre on [0, 1] by Newton on P16 (A&S §25.4.29). */
function gauss16(): { x: number[]; w: number[] } {
  if (g16) return g16;
  const n = 16;
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 1;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    x.push((1 - z) / 2);
    w.push(1 / ((1 - z * z) * dp * dp));
  }
  g16 = { x, w };
  return g16;
}
