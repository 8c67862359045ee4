/**
 * The direction grid the far field is sampled on, and the quadrature weights for the power integral.
 *
 * Angles: elevation e in degrees above the horizon (z = sin e); bearing b in degrees from north (+y),
 * clockwise, so the unit vector is r̂ = (cos e · sin b, cos e · cos b, sin e).
 * The field is always sampled on the whole sphere (e = −90..90) because the ground image at elevation e is
 * the direct field at −e (see ground-combine.ts); over ground only e ≥ 0 is reported and integrated.
 */

import { ModelError } from "../model/errors";

export interface DirectionGrid {
  stepDeg: number;
  /** Elevations −90..90 inclusive (index i), bearings 0..360−step (index j). */
  elevationsDeg: Float64Array;
  bearingsDeg: Float64Array;
  cosE: Float64Array;
  sinE: Float64Array;
  sinB: Float64Array;
  cosB: Float64Array;
  /** Index of the horizon row (e = 0); row i mirrors to row 2·horizon − i. */
  horizon: number;
  /** ∫_{−1}^{1} f(sin e) d(sin e) ≈ Σ_i sphereWeights[i] f_i  (Clenshaw–Curtis, all rows). */
  sphereWeights: Float64Array;
  /** ∫_0^{π/2} f(e) cos e de ≈ Σ hemiWeights[i − horizon] f_i over rows i ≥ horizon (cos e folded in):
   *  Gregory's rule in e, for any smooth f. */
  hemiWeights: Float64Array;
  /** The same integral for f even about the horizon (perfect ground: U(−e) = U(e)), as half the
   *  Clenshaw–Curtis sphere rule: spectrally accurate because the horizon is then no end point. */
  evenHemiWeights: Float64Array;
}

const DEG = Math.PI / 180;
const cache = new Map<number, DirectionGrid>();

/** Exact sine/cosine at the multiples of 90° so poles and the horizon carry exact zeros. */
function sinDeg(d: number): number {
  const r = ((d % 360) + 360) % 360;
  if (r === 0 || r === 180) return 0;
  if (r === 90) return 1;
  if (r === 270) return -1;
  return Math.sin(d * DEG);
}
function cosDeg(d: number): number {
  return sinDeg(d + 90);
}

/**
 * Clenshaw–Curtis weights on x_j = cos(jπ/N), j = 0..N, for ∫_{−1}^{1} f dx. Uniform elevation steps are
 * exactly these nodes in x = sin e, so the sphere integral is spectrally accurate for a smooth pattern
 * (Trefethen, "Is Gauss quadrature better than Clenshaw–Curtis?", SIAM Review 50, 2008, eq. 2.4 form).
 */
export function clenshawCurtisWeights(n: number): Float64Array {
  const w = new Float64Array(n + 1);
  for (let j = 0; j <= n; j++) {
    let s = 1;
    for (let k = 1; k <= Math.floor(n / 2); k++) {
      const b = 2 * k === n ? 1 : 2;
      s -= (b / (4 * k * k - 1)) * Math.cos((2 * k * j * Math.PI) / n);
    }
    w[j] = ((j === 0 || j === n ? 1 : 2) / n) * s;
  }
  return w;
}

/** Gregory's end-correction coefficients (Hildebrand, Introduction to Numerical Analysis, §5.9). */
const GREGORY = [1 / 12, 1 / 24, 19 / 720, 3 / 160, 863 / 60480];

/**
 * Weights for ∫ f(e) de on uniform nodes including both ends: Gregory's formula, the trapezoid rule with
 * end corrections from forward differences at the start and backward differences at the end,
 *   ∫ = T − h Σ_m G_m (∇^m f_n + (−1)^m Δ^m f_0),
 * using as many differences (up to 5) as the node count allows; exact for polynomials of that degree.
 */
export function gregoryWeights(nodes: number, h: number): Float64Array {
  const w = new Float64Array(nodes).fill(h);
  w[0] = h / 2;
  w[nodes - 1] = h / 2;
  const orders = Math.min(GREGORY.length, Math.floor((nodes - 1) / 2));
  for (let m = 1; m <= orders; m++) {
    let binom = 1; // C(m, i)
    for (let i = 0; i <= m; i++) {
      // Δ^m f_0 = Σ_i (−1)^{m−i} C(m,i) f_i ; ∇^m f_n = Σ_i (−1)^i C(m,i) f_{n−i}
      w[i] -= h * GREGORY[m - 1] * (-1) ** m * (-1) ** (m - i) * binom;
      w[nodes - 1 - i] -= h * GREGORY[m - 1] * (-1) ** i * binom;
      binom = (binom * (m - i)) / (i + 1);
    }
  }
  return w;
}

/** Checks the step and returns the (cached, shared, read-only) grid for it. */
export function directionGrid(stepDeg: number): DirectionGrid {
  const hit = cache.get(stepDeg);
  if (hit) return hit;
  if (!Number.isFinite(stepDeg) || stepDeg < 0.25 || stepDeg > 15) {
    throw new ModelError("stepDeg", `pattern step must be between 0.25 and 15 degrees, got ${stepDeg}`);
  }
  const perQuarter = Math.round(90 / stepDeg);
  if (Math.abs(perQuarter * stepDeg - 90) > 1e-9) {
    throw new ModelError(
      "stepDeg",
      `pattern step must divide 90 degrees exactly (e.g. 1, 2, 5, 10), got ${stepDeg}`,
    );
  }
  const nE = 2 * perQuarter + 1;
  const nB = 4 * perQuarter;
  const elevationsDeg = new Float64Array(nE);
  const cosE = new Float64Array(nE);
  const sinE = new Float64Array(nE);
  for (let i = 0; i < nE; i++) {
    const e = -90 + i * stepDeg;
    elevationsDeg[i] = e;
    cosE[i] = cosDeg(e);
    sinE[i] = sinDeg(e);
  }
  const bearingsDeg = new Float64Array(nB);
  const sinB = new Float64Array(nB);
  const cosB = new Float64Array(nB);
  for (let j = 0; j < nB; j++) {
    const b = j * stepDeg;
    bearingsDeg[j] = b;
    sinB[j] = sinDeg(b);
    cosB[j] = cosDeg(b);
  }
  const sphereWeights = clenshawCurtisWeights(nE - 1);
  const grid: DirectionGrid = {
    stepDeg,
    elevationsDeg,
    bearingsDeg,
    cosE,
    sinE,
    sinB,
    cosB,
    horizon: perQuarter,
    sphereWeights,
    evenHemiWeights: sphereWeights.slice(perQuarter).map((w, k) => (k === 0 ? w / 2 : w)),
    hemiWeights: gregoryWeights(perQuarter + 1, stepDeg * DEG).map((w, k) => w * cosE[perQuarter + k]),
  };
  cache.set(stepDeg, grid);
  return grid;
}
