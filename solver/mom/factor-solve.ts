/**
 * Solve Z x = b for the symmetric moment-method matrix, fast path first.
 *
 * Z is complex symmetric (reciprocity), so the LDLᵀ factorisation of solver/mom/lu.ts does half the
 * work of LU. It does not pivot and is not backward stable in general, so we check the answer: the
 * residual of the original system must be at the rounding level, ‖Zx − b‖∞ ≤ 1e-10·max|Z_ij|·‖x‖₁
 * (a normwise backward error; partial-pivoting LU reaches ~1e-15). If the factorisation throws or the
 * residual is larger, the system is solved again by LU with partial pivoting.
 */
import { ldltFactor, ldltSolve, luFactor, luSolve } from "./lu";

export interface SolveWork {
  n: number;
  /** Copy of Z (the factorisations overwrite it). */
  cr: Float64Array;
  ci: Float64Array;
  /** Copy of b. */
  br0: Float64Array;
  bi0: Float64Array;
  piv: Int32Array;
  /** How the last solve went: "ldlt" or "lu". */
  last: "ldlt" | "lu";
}

export function makeSolveWork(n: number): SolveWork {
  return {
    n,
    cr: new Float64Array(n * n),
    ci: new Float64Array(n * n),
    br0: new Float64Array(n),
    bi0: new Float64Array(n),
    piv: new Int32Array(n),
    last: "ldlt",
  };
}

/** Overwrites zr/zi with factors and b with x. Throws (from LU) when Z is singular. */
export function solveSymmetric(
  w: SolveWork,
  zr: Float64Array,
  zi: Float64Array,
  br: Float64Array,
  bi: Float64Array,
): void {
  const n = w.n;
  w.cr.set(zr.subarray(0, n * n));
  w.ci.set(zi.subarray(0, n * n));
  w.br0.set(br.subarray(0, n));
  w.bi0.set(bi.subarray(0, n));
  try {
    ldltFactor(n, zr, zi);
    ldltSolve(n, zr, zi, br, bi);
    if (residualOk(w, br, bi)) {
      w.last = "ldlt";
      return;
    }
  } catch {
    // fall through to LU
  }
  zr.set(w.cr);
  zi.set(w.ci);
  br.set(w.br0);
  bi.set(w.bi0);
  luFactor(n, zr, zi, w.piv);
  luSolve(n, zr, zi, w.piv, br, bi);
  w.last = "lu";
}

function residualOk(w: SolveWork, xr: Float64Array, xi: Float64Array): boolean {
  const n = w.n;
  const A = w.cr;
  const B = w.ci;
  let amax = 0;
  let xsum = 0;
  let rmax = 0;
  for (let i = 0; i < n; i++) xsum += Math.abs(xr[i]) + Math.abs(xi[i]);
  for (let i = 0; i < n; i++) {
    let sr = -w.br0[i];
    let si = -w.bi0[i];
    const row = i * n;
    for (let j = 0; j < n; j++) {
      const ar = A[row + j];
      const ai = B[row + j];
      sr += ar * xr[j] - ai * xi[j];
      si += ar * xi[j] + ai * xr[j];
      const m = Math.abs(ar) + Math.abs(ai);
      if (m > amax) amax = m;
    }
    const r = Math.abs(sr) + Math.abs(si);
    if (r > rmax) rmax = r;
  }
  return Number.isFinite(rmax) && rmax <= 1e-10 * amax * xsum;
}
