/**
 * Test helpers for the dense complex solvers: a seeded random generator, random systems, the residual,
 * and a naive Gaussian-elimination reference written independently of solver/mom/lu.ts
 * (column-major loop order, complex numbers as [re, im] pairs, full-row pivoting search by |·|).
 */

/** Mulberry32: small seeded PRNG so failures reproduce. Returns values in [0, 1). */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface System {
  aRe: Float64Array;
  aIm: Float64Array;
  bRe: Float64Array;
  bIm: Float64Array;
}

/**
 * Random complex system with entries uniform in [−1, 1] + j[−1, 1]. `diagonalShift` (default n) is added
 * to the real diagonal to keep it well conditioned; `symmetric` makes A = Aᵀ (not Hermitian), like a
 * Galerkin moment-method matrix.
 */
export function randomSystem(
  n: number,
  seed: number,
  opts: { symmetric?: boolean; diagonalShift?: number } = {},
): System {
  const r = rng(seed);
  const aRe = new Float64Array(n * n);
  const aIm = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      aRe[i * n + j] = 2 * r() - 1;
      aIm[i * n + j] = 2 * r() - 1;
    }
  }
  if (opts.symmetric) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        aRe[j * n + i] = aRe[i * n + j];
        aIm[j * n + i] = aIm[i * n + j];
      }
    }
  }
  const shift = opts.diagonalShift ?? n;
  for (let i = 0; i < n; i++) aRe[i * n + i] += shift;
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    bRe[i] = 2 * r() - 1;
    bIm[i] = 2 * r() - 1;
  }
  return { aRe, aIm, bRe, bIm };
}

/** ‖A·x − b‖₂ / ‖b‖₂ computed directly from the original matrix. */
export function relResidual(
  n: number,
  aRe: Float64Array,
  aIm: Float64Array,
  xRe: Float64Array,
  xIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
): number {
  let num = 0;
  let den = 0;
  for (let i = 0; i < n; i++) {
    let sr = -bRe[i];
    let si = -bIm[i];
    for (let j = 0; j < n; j++) {
      const ar = aRe[i * n + j];
      const ai = aIm[i * n + j];
      sr += ar * xRe[j] - ai * xIm[j];
      si += ar * xIm[j] + ai * xRe[j];
    }
    num += sr * sr + si * si;
    den += bRe[i] ** 2 + bIm[i] ** 2;
  }
  return den === 0 ? Math.sqrt(num) : Math.sqrt(num / den);
}

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

/** Textbook Gaussian elimination on the augmented matrix [A | b] with partial pivoting by modulus. */
export function naiveSolve(
  n: number,
  aRe: Float64Array,
  aIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
) {
  const m: C[][] = [];
  for (let i = 0; i < n; i++) {
    const row: C[] = [];
    for (let j = 0; j < n; j++) row.push([aRe[i * n + j], aIm[i * n + j]]);
    row.push([bRe[i], bIm[i]]);
    m.push(row);
  }
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.hypot(...m[r][c]) > Math.hypot(...m[p][c])) p = r;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = c + 1; r < n; r++) {
      const f = div(m[r][c], m[c][c]);
      for (let j = c; j <= n; j++) {
        const t = mul(f, m[c][j]);
        m[r][j] = [m[r][j][0] - t[0], m[r][j][1] - t[1]];
      }
    }
  }
  const xRe = new Float64Array(n);
  const xIm = new Float64Array(n);
  for (let i = n - 1; i >= 0; i--) {
    let s: C = m[i][n];
    for (let j = i + 1; j < n; j++) {
      const t = mul(m[i][j], [xRe[j], xIm[j]]);
      s = [s[0] - t[0], s[1] - t[1]];
    }
    const x = div(s, m[i][i]);
    xRe[i] = x[0];
    xIm[i] = x[1];
  }
  return { xRe, xIm };
}
