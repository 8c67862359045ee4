/**
 * Space-wave power over real ground on coarse grids. Over real ground the hemisphere integrand
 * |D + R·M|² (direct field D, image field M, Fresnel weights R) has no symmetry about the horizon and
 * oscillates with the height (phase 2kh sin e), so a rule on the coarse grid alone loses accuracy fast
 * (several per cent at 5° for a wire 2 λ up). The field itself is smooth and periodic along each great
 * circle through the zenith, so it is upsampled there exactly (trigonometric interpolation, exact for a
 * band limit below 180°/step in θ: k·|r| < ~30 at 5°, i.e. sources within ~5 λ of the origin), the
 * Fresnel weights are applied at the fine elevations, and the result is integrated by Gregory's rule.
 */

import { fresnel } from "../ground/fresnel";
import type { DirectionGrid } from "./grid";
import { gregoryWeights } from "./grid";
import type { RadiationGrid } from "./radiation";

/** Trigonometric interpolation kernel for L (even) equispaced samples: sin(Lx/2) / (L tan(x/2)). */
function dirichlet(x: number, L: number): number {
  const t = Math.tan(x / 2);
  if (Math.abs(t) < 1e-14) return 1;
  return Math.sin((L * x) / 2) / (L * t);
}

interface Plan {
  L: number;
  P: number;
  /** kernels[(s − 1)·L + q] = D_L(qΔ + sΔ/P), s = 1..P−1 */
  kernels: Float64Array;
  weights: Float64Array;
  /** sin and elevation (rad) of each fine row f = 0..KP/2 (θ_f = f Δ/P from the zenith). */
  elevation: Float64Array;
}

const plans = new Map<string, Plan>();

function plan(grid: DirectionGrid, P: number): Plan {
  const key = `${grid.stepDeg}/${P}`;
  const hit = plans.get(key);
  if (hit) return hit;
  const K = grid.elevationsDeg.length - 1;
  const L = 2 * K;
  const delta = (grid.stepDeg * Math.PI) / 180;
  const kernels = new Float64Array((P - 1) * L);
  for (let s = 1; s < P; s++) {
    for (let q = 0; q < L; q++) kernels[(s - 1) * L + q] = dirichlet(q * delta + (s * delta) / P, L);
  }
  const rows = (K * P) / 2 + 1;
  const elevation = new Float64Array(rows);
  for (let f = 0; f < rows; f++) elevation[f] = Math.PI / 2 - (f * delta) / P;
  const weights = gregoryWeights(rows, delta / P).map((w, f) => w * Math.cos(elevation[f]));
  weights[0] = 0; // zenith: cos e = 0 exactly
  const p: Plan = { L, P, kernels, weights, elevation };
  plans.set(key, p);
  return p;
}

let circle = new Float64Array(0);
let fine = new Float64Array(0);

/**
 * ∫ U dΩ over the upper hemisphere for real ground, with U = scale·(|D_θ + R_v M_θ|² + |D_φ + R_h M_φ|²),
 * D the field at (e, b) and M the field at (−e, b), as in farfield.ts. P is the upsampling factor.
 */
export function realGroundPower(
  grid: DirectionGrid,
  n: RadiationGrid,
  scale: number,
  permittivity: number,
  conductivity: number,
  omega: number,
  P: number,
): number {
  const pl = plan(grid, P);
  const { L, kernels, weights, elevation } = pl;
  const K = L / 2;
  const nE = grid.elevationsDeg.length;
  const nB = grid.bearingsDeg.length;
  const halfB = nB / 2;
  const LF = L * P;
  // Each component's circle is stored twice in a row so the circular convolution needs no wrap test.
  if (circle.length < 8 * L) circle = new Float64Array(8 * L);
  if (fine.length < 4 * LF) fine = new Float64Array(4 * LF);
  const rows = elevation.length;
  const rv = new Float64Array(2 * rows);
  const rh = new Float64Array(2 * rows);
  for (let f = 0; f < rows; f++) {
    const r = fresnel(permittivity, conductivity, omega, elevation[f]);
    rv[2 * f] = r.rvRe;
    rv[2 * f + 1] = r.rvIm;
    rh[2 * f] = r.rhRe;
    rh[2 * f + 1] = r.rhIm;
  }
  const sums = new Float64Array(rows);
  const comps = [n.thRe, n.thIm, n.phRe, n.phIm];
  for (let j = 0; j < halfB; j++) {
    // Circle through the zenith: θ = mΔ, bearing j for m ≤ K (row nE − 1 − m), then over the nadir
    // onto the opposite bearing (row m − K), where θ̂ and φ̂ both reverse.
    for (let c = 0; c < 4; c++) {
      const a = comps[c];
      const base = 2 * c * L;
      for (let m = 0; m < L; m++) {
        const v = m <= K ? a[(nE - 1 - m) * nB + j] : -a[(m - K) * nB + j + halfB];
        circle[base + m] = v;
        circle[base + L + m] = v;
      }
      for (let m = 0; m < L; m++) {
        fine[c * LF + m * P] = circle[base + m];
        // value at θ_m + sΔ/P = Σ_q f_{m−q} D(qΔ + sΔ/P)
        const top = base + L + m;
        for (let s = 1; s < P; s++) {
          const ker = (s - 1) * L;
          let v0 = 0;
          let v1 = 0;
          for (let q = 0; q < L; q += 2) {
            v0 += circle[top - q] * kernels[ker + q];
            v1 += circle[top - q - 1] * kernels[ker + q + 1];
          }
          fine[c * LF + m * P + s] = v0 + v1;
        }
      }
    }
    // Bearing j: D at fine index f, M at KP − f; bearing j + 180: D at 2KP − f, M at KP + f.
    const KP = K * P;
    for (let f = 0; f < rows; f++) {
      const vRe = rv[2 * f];
      const vIm = rv[2 * f + 1];
      const hRe = rh[2 * f];
      const hIm = rh[2 * f + 1];
      for (let side = 0; side < 2; side++) {
        const d = side === 0 ? f : 2 * KP - f;
        const mm = side === 0 ? KP - f : KP + f;
        const dd = d % LF;
        const dtRe = fine[dd];
        const dtIm = fine[LF + dd];
        const dpRe = fine[2 * LF + dd];
        const dpIm = fine[3 * LF + dd];
        const mtRe = fine[mm];
        const mtIm = fine[LF + mm];
        const mpRe = fine[2 * LF + mm];
        const mpIm = fine[3 * LF + mm];
        const aRe = dtRe + vRe * mtRe - vIm * mtIm;
        const aIm = dtIm + vRe * mtIm + vIm * mtRe;
        const bRe = dpRe + hRe * mpRe - hIm * mpIm;
        const bIm = dpIm + hRe * mpIm + hIm * mpRe;
        sums[f] += aRe * aRe + aIm * aIm + bRe * bRe + bIm * bIm;
      }
    }
  }
  let total = 0;
  for (let f = 0; f < rows; f++) total += weights[f] * (sums[f] / nB);
  return 2 * Math.PI * scale * total;
}
