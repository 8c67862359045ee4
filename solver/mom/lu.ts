/**
 * Dense complex factorisations over split real/imaginary Float64Arrays (row-major n×n, element (i, j)
 * at i·n + j), for the moment-method impedance matrix:
 *
 *   luFactor / luSolve     LU with partial pivoting, P·A = L·U; the general, always-safe path.
 *   ldltFactor / ldltSolve complex-symmetric LDLᵀ without pivoting, half the work; only for matrices
 *                          whose pivots stay large.
 *   factorSymmetric        LDLᵀ when the matrix is symmetric and the factors show no growth, else LU;
 *                          solve with luSolve either way.
 *
 * After luFactor the strict lower triangle holds L (unit diagonal implied) and the upper triangle U;
 * piv[k] is the row swapped into row k at step k (LAPACK-style sequential interchanges).
 *
 * Speed (measured with tests/bench/run.ts, lu-400): the algorithm is recursive LU (Toledo 1997, "Locality
 * of reference in LU decomposition with partial pivoting", SIAM J. Matrix Anal. Appl. 18(4)): split the
 * columns in half, factor the left half, update the right half, recurse. Nearly all flops then land in one
 * rank-k update, A[i, j] −= Σ_k L[i, k]·U[k, j], done by a register-blocked kernel that updates four rows
 * from two pivot rows per sweep over contiguous row segments (i-k-j order), so each loaded U element feeds
 * four complex multiply-adds and each A element is loaded and stored once per two pivots. The pivot-row
 * chunk (KCHUNK rows of U) stays in L2 while all rows below stream past it. Where WebAssembly SIMD exists
 * (Node 20, current browsers) that kernel runs two columns per instruction in lu-simd.ts, on a copy of the
 * matrix in the module's memory; everything else stays in JS and works on views of that copy.
 */

import { type SimdKernel, simdKernel } from "./lu-simd";

/** Panels this narrow are factored column by column (the recursion's base case); 4 measured ~4 % faster
 *  than 8 on both the yard-200 matrix and a random 400×400, 12 and 16 slower. */
const BASE_COLUMNS = 4;
/** Pivot rows per pass of the rank-k update: KCHUNK·n·16 bytes of U should stay in L2 (~512 KiB here). */
const KCHUNK = 64;
/** Rows and pivots of the register-blocked update kernel (kernel4x2). */
const ROWS = 4;
const PIVOTS = 2;

/** Below this size the copy into WebAssembly memory is not worth it. */
const SIMD_MIN_N = 24;

/**
 * The WebAssembly kernel in use during the current factorisation (null: the JS kernel), and the byte
 * offset of the imaginary array in its memory (the real one starts at 0). Module state rather than
 * parameters so the hot JS functions keep small, monomorphic signatures; set and cleared by luFactor.
 */
let wasmKernel: SimdKernel["kernel4x2"] | null = null;
let wasmImOffset = 0;

/** Factor A in place. Throws an Error naming the column when A is singular (to working precision). */
export function luFactor(n: number, re: Float64Array, im: Float64Array, piv: Int32Array): void {
  checkSizes("luFactor", n, re, im, piv);
  const tiny = singularThreshold("luFactor", n, re, im, false);
  onFastestArrays(n, re, im, (r, i) => factorColumns(n, r, i, piv, 0, n, tiny));
}

/**
 * Run `work` on the matrix where the fastest kernel can reach it: in WebAssembly memory (copied in and
 * back out, also when work throws) when SIMD is available and n is big enough, else in place.
 */
function onFastestArrays(
  n: number,
  re: Float64Array,
  im: Float64Array,
  work: (re: Float64Array, im: Float64Array) => void,
): void {
  const simd = n >= SIMD_MIN_N ? simdKernel() : null;
  if (simd === null) {
    work(re, im);
    return;
  }
  // The JS parts of the algorithm see the copy through typed-array views.
  const nn = n * n;
  const need = Math.ceil((16 * nn) / 65536) - simd.memory.buffer.byteLength / 65536;
  if (need > 0) {
    try {
      simd.memory.grow(need);
    } catch {
      work(re, im); // no room for the copy (memory limit): the in-place JS kernel still works
      return;
    }
  }
  const wr = new Float64Array(simd.memory.buffer, 0, nn);
  const wi = new Float64Array(simd.memory.buffer, 8 * nn, nn);
  wr.set(re.subarray(0, nn));
  wi.set(im.subarray(0, nn));
  wasmKernel = simd.kernel4x2;
  wasmImOffset = 8 * nn;
  try {
    work(wr, wi);
  } finally {
    wasmKernel = null;
    re.set(wr);
    im.set(wi);
  }
}

/** Recursive LU of the column panel [c0, c1) over rows c0..n−1; row swaps span the whole matrix. */
function factorColumns(
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array,
  c0: number,
  c1: number,
  tiny: number,
): void {
  const w = c1 - c0;
  if (w <= BASE_COLUMNS) {
    factorNarrow(n, re, im, piv, c0, c1, tiny);
    return;
  }
  // Split at a multiple of the kernel's pivot count so the update runs without remainders where it can.
  const h = c0 + ((w >> 1) & ~3 || 4);
  factorColumns(n, re, im, piv, c0, h, tiny);
  // U12 = L11⁻¹·A12 (rows [c0, h), columns [h, c1)), ROWS rows at a time: the part of each row block
  // that depends on finished rows goes through the fast kernel, the small triangle inside it row by row.
  for (let ib = c0; ib < h; ib += ROWS) {
    const ie = Math.min(h, ib + ROWS);
    rankUpdate(re, im, n, ib, ie, c0, ib, h, c1);
    for (let i = ib + 1; i < ie; i++) rankUpdate(re, im, n, i, i + 1, ib, i, h, c1);
  }
  // Schur complement: A22 −= L21·U12 (rows [h, n), columns [h, c1)).
  rankUpdate(re, im, n, h, n, c0, h, h, c1);
  factorColumns(n, re, im, piv, h, c1, tiny);
}

/** Column-by-column right-looking LU of a narrow panel [c0, c1) over rows c0..n−1. */
function factorNarrow(
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array,
  c0: number,
  c1: number,
  tiny: number,
): void {
  const nn = n * n;
  // Pivot of the coming column: searched once at the panel's start, then found during the previous
  // column's update pass, which visits the same rows anyway (saves a strided pass per column).
  let p = c0;
  let best = -1;
  for (let i = c0, ik = c0 * n + c0; i < n; i++, ik += n) {
    const mag = re[ik] * re[ik] + im[ik] * im[ik];
    if (mag > best) {
      best = mag;
      p = i;
    }
  }
  for (let k = c0; k < c1; k++) {
    piv[k] = p;
    if (!(best > tiny) || !Number.isFinite(best)) throw singularError(k, n, best, tiny);
    if (p !== k) swapRows(n, re, im, k, p);
    const rk = k * n;
    const dr = re[rk + k];
    const di = im[rk + k];
    // 1 / pivot
    const inv = 1 / (dr * dr + di * di);
    const ir = dr * inv;
    const ii = -di * inv;
    const next = k + 1;
    const track = next < c1;
    best = -1;
    p = next;
    for (let ri = rk + n, i = next; ri < nn; ri += n, i++) {
      const ar = re[ri + k];
      const ai = im[ri + k];
      const lr = ar * ir - ai * ii;
      const li = ar * ii + ai * ir;
      re[ri + k] = lr;
      im[ri + k] = li;
      for (let j = next; j < c1; j++) {
        const ur = re[rk + j];
        const ui = im[rk + j];
        re[ri + j] -= lr * ur - li * ui;
        im[ri + j] -= lr * ui + li * ur;
      }
      if (track) {
        const cr = re[ri + next];
        const ci = im[ri + next];
        const mag = cr * cr + ci * ci;
        if (mag > best) {
          best = mag;
          p = i;
        }
      }
    }
  }
}

/** A[i0:i1, j0:j1] −= A[i0:i1, k0:k1]·A[k0:k1, j0:j1] (the blocks must not overlap). */
function rankUpdate(
  re: Float64Array,
  im: Float64Array,
  n: number,
  i0: number,
  i1: number,
  k0: number,
  k1: number,
  j0: number,
  j1: number,
): void {
  if (j0 >= j1) return;
  for (let kc = k0; kc < k1; kc += KCHUNK) {
    const kcEnd = Math.min(k1, kc + KCHUNK);
    let i = i0;
    const wk = wasmKernel;
    // The SIMD kernel takes an even number of columns; a last odd column goes through the JS kernel.
    const jEven = j0 + ((j1 - j0) & ~1);
    for (; i + ROWS <= i1; i += ROWS) {
      let k = kc;
      if (wk !== null) {
        const kPairs = kc + ((kcEnd - kc) & ~1);
        if (kPairs > kc) {
          wk(0, wasmImOffset, n, i, kc, kPairs, j0, jEven);
          if (jEven < j1) for (; k < kPairs; k += PIVOTS) kernel4x2(re, im, n, i, k, jEven, j1);
          k = kPairs;
        }
      } else {
        for (; k + PIVOTS <= kcEnd; k += PIVOTS) kernel4x2(re, im, n, i, k, j0, j1);
      }
      for (; k < kcEnd; k++) kernel4x1(re, im, n, i, k, j0, j1);
    }
    for (; i < i1; i++) {
      let k = kc;
      for (; k + PIVOTS <= kcEnd; k += PIVOTS) kernel1x2(re, im, n, i, k, j0, j1);
      for (; k < kcEnd; k++) kernel1x1(re, im, n, i, k, j0, j1);
    }
  }
}

/** Rows i..i+3, pivots k..k+1: A[i+r, j] -= Σ_p A[i+r, k+p]·A[k+p, j] for j in [j0, j1). */
function kernel4x2(
  re: Float64Array,
  im: Float64Array,
  n: number,
  i: number,
  k: number,
  j0: number,
  j1: number,
): void {
  const u0 = k * n;
  const u1 = (k + 1) * n;
  const a0 = i * n;
  const l00r = re[a0 + k];
  const l00i = im[a0 + k];
  const l01r = re[a0 + k + 1];
  const l01i = im[a0 + k + 1];
  const a1 = (i + 1) * n;
  const l10r = re[a1 + k];
  const l10i = im[a1 + k];
  const l11r = re[a1 + k + 1];
  const l11i = im[a1 + k + 1];
  const a2 = (i + 2) * n;
  const l20r = re[a2 + k];
  const l20i = im[a2 + k];
  const l21r = re[a2 + k + 1];
  const l21i = im[a2 + k + 1];
  const a3 = (i + 3) * n;
  const l30r = re[a3 + k];
  const l30i = im[a3 + k];
  const l31r = re[a3 + k + 1];
  const l31i = im[a3 + k + 1];
  for (let j = j0; j < j1; j++) {
    const u0r = re[u0 + j];
    const u0i = im[u0 + j];
    const u1r = re[u1 + j];
    const u1i = im[u1 + j];
    re[a0 + j] -= l00r * u0r - l00i * u0i + (l01r * u1r - l01i * u1i);
    im[a0 + j] -= l00r * u0i + l00i * u0r + (l01r * u1i + l01i * u1r);
    re[a1 + j] -= l10r * u0r - l10i * u0i + (l11r * u1r - l11i * u1i);
    im[a1 + j] -= l10r * u0i + l10i * u0r + (l11r * u1i + l11i * u1r);
    re[a2 + j] -= l20r * u0r - l20i * u0i + (l21r * u1r - l21i * u1i);
    im[a2 + j] -= l20r * u0i + l20i * u0r + (l21r * u1i + l21i * u1r);
    re[a3 + j] -= l30r * u0r - l30i * u0i + (l31r * u1r - l31i * u1i);
    im[a3 + j] -= l30r * u0i + l30i * u0r + (l31r * u1i + l31i * u1r);
  }
}

/** One row i, pivots k, k+1: A[i+r, j] -= Σ_p A[i+r, k+p]·A[k+p, j] for j in [j0, j1). */
function kernel1x2(
  re: Float64Array,
  im: Float64Array,
  n: number,
  i: number,
  k: number,
  j0: number,
  j1: number,
): void {
  const u0 = k * n;
  const u1 = (k + 1) * n;
  const a0 = i * n;
  const l00r = re[a0 + k];
  const l00i = im[a0 + k];
  const l01r = re[a0 + k + 1];
  const l01i = im[a0 + k + 1];
  for (let j = j0; j < j1; j++) {
    const u0r = re[u0 + j];
    const u0i = im[u0 + j];
    const u1r = re[u1 + j];
    const u1i = im[u1 + j];
    re[a0 + j] -= l00r * u0r - l00i * u0i + (l01r * u1r - l01i * u1i);
    im[a0 + j] -= l00r * u0i + l00i * u0r + (l01r * u1i + l01i * u1r);
  }
}

/** Rows i..i+3, one pivot k: A[i+r, j] -= Σ_p A[i+r, k+p]·A[k+p, j] for j in [j0, j1). */
function kernel4x1(
  re: Float64Array,
  im: Float64Array,
  n: number,
  i: number,
  k: number,
  j0: number,
  j1: number,
): void {
  const u0 = k * n;
  const a0 = i * n;
  const l00r = re[a0 + k];
  const l00i = im[a0 + k];
  const a1 = (i + 1) * n;
  const l10r = re[a1 + k];
  const l10i = im[a1 + k];
  const a2 = (i + 2) * n;
  const l20r = re[a2 + k];
  const l20i = im[a2 + k];
  const a3 = (i + 3) * n;
  const l30r = re[a3 + k];
  const l30i = im[a3 + k];
  for (let j = j0; j < j1; j++) {
    const u0r = re[u0 + j];
    const u0i = im[u0 + j];
    re[a0 + j] -= l00r * u0r - l00i * u0i;
    im[a0 + j] -= l00r * u0i + l00i * u0r;
    re[a1 + j] -= l10r * u0r - l10i * u0i;
    im[a1 + j] -= l10r * u0i + l10i * u0r;
    re[a2 + j] -= l20r * u0r - l20i * u0i;
    im[a2 + j] -= l20r * u0i + l20i * u0r;
    re[a3 + j] -= l30r * u0r - l30i * u0i;
    im[a3 + j] -= l30r * u0i + l30i * u0r;
  }
}

/** One row i, one pivot k. */
function kernel1x1(
  re: Float64Array,
  im: Float64Array,
  n: number,
  i: number,
  k: number,
  j0: number,
  j1: number,
): void {
  const u0 = k * n;
  const a0 = i * n;
  const lr = re[a0 + k];
  const li = im[a0 + k];
  for (let j = j0; j < j1; j++) {
    const ur = re[u0 + j];
    const ui = im[u0 + j];
    re[a0 + j] -= lr * ur - li * ui;
    im[a0 + j] -= lr * ui + li * ur;
  }
}

/** Largest |entry| of the LDLᵀ factors over the largest |a_ij| that still counts as harmless growth:
 *  the backward error grows like growth·ε, so 1e4 keeps it near 1e-12 (Higham, Accuracy and Stability
 *  of Numerical Algorithms, 2nd ed., §9.3 on growth factors). */
const LDLT_GROWTH_LIMIT = 1e4;
/** Relative asymmetry (of max|a_ij|) up to which a matrix counts as symmetric: a Galerkin fill is
 *  symmetric only to quadrature accuracy (about 1e-10 here). */
const SYMMETRY_TOLERANCE = 1e-8;

let saveRe = new Float64Array(0);
let saveIm = new Float64Array(0);

/**
 * Factor a matrix that is complex symmetric in theory (a moment-method Z), as cheaply as is safe:
 * LDLᵀ (half the work) when A is symmetric to SYMMETRY_TOLERANCE and the factors show no growth beyond
 * LDLT_GROWTH_LIMIT; otherwise pivoted LU on the original, which is kept for that case. Either way the
 * result is solved with luSolve(n, re, im, piv, b) (piv is the identity after LDLᵀ).
 * Returns which factorisation was used. Throws like luFactor when A is singular.
 */
export function factorSymmetric(
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array,
): "ldlt" | "lu" {
  checkSizes("factorSymmetric", n, re, im, piv);
  const nn = n * n;
  let maxSq = 0;
  let asymSq = 0;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    maxSq = Math.max(maxSq, re[ri + i] * re[ri + i] + im[ri + i] * im[ri + i]);
    for (let j = i + 1, ji = (i + 1) * n + i; j < n; j++, ji += n) {
      const ar = re[ri + j];
      const ai = im[ri + j];
      const br = re[ji];
      const bi = im[ji];
      maxSq = Math.max(maxSq, ar * ar + ai * ai, br * br + bi * bi);
      asymSq = Math.max(asymSq, (ar - br) * (ar - br) + (ai - bi) * (ai - bi));
    }
  }
  if (Number.isNaN(maxSq) || !(asymSq <= SYMMETRY_TOLERANCE * SYMMETRY_TOLERANCE * maxSq)) {
    luFactor(n, re, im, piv); // NaN or asymmetric: the general path (it also names a NaN entry)
    return "lu";
  }
  if (saveRe.length < nn) {
    saveRe = new Float64Array(nn);
    saveIm = new Float64Array(nn);
  }
  saveRe.set(re.subarray(0, nn));
  saveIm.set(im.subarray(0, nn));
  let ok = true;
  try {
    ldltFactor(n, re, im);
  } catch {
    ok = false; // a tiny pivot: LU with interchanges may still succeed
  }
  if (ok) {
    let growthSq = 0;
    for (let i = 0; i < nn; i++) growthSq = Math.max(growthSq, re[i] * re[i] + im[i] * im[i]);
    ok = growthSq <= LDLT_GROWTH_LIMIT * LDLT_GROWTH_LIMIT * maxSq;
  }
  if (ok) {
    for (let i = 0; i < n; i++) piv[i] = i;
    return "ldlt";
  }
  re.set(saveRe.subarray(0, nn));
  im.set(saveIm.subarray(0, nn));
  luFactor(n, re, im, piv);
  return "lu";
}

/** Pivot block of the LDLᵀ: its U rows (LDLT_BLOCK·n·16 bytes) stay in L1/L2 during the Schur update,
 *  and the unblocked diagonal-block step (JS) stays small. 8–24 measured alike on the yard-200 matrix;
 *  32 and up slower. */
const LDLT_BLOCK = 16;

/**
 * Complex-symmetric LDLᵀ (A = Aᵀ, not Hermitian — a Galerkin moment-method matrix is like this by
 * reciprocity), without pivoting, in place. Reads only the upper triangle (j ≥ i), so a caller may fill
 * just that. Leaves the same factors as LU without pivoting would: unit L in the strict lower triangle,
 * U = D·Lᵀ in the upper, but with half the work (n³/6 complex multiply-adds), because only the upper
 * triangle of each Schur complement is updated (Golub & Van Loan, Matrix Computations, 4th ed., §4.1).
 *
 * Without pivoting this is only safe for matrices whose pivots stay large, e.g. diagonally dominant
 * ones; a pivot below the singularity threshold throws (use luFactor then). It is NOT backward stable
 * for general symmetric matrices: callers must be able to check the answer or fall back.
 */
export function ldltFactor(n: number, re: Float64Array, im: Float64Array): void {
  checkSizes("ldltFactor", n, re, im, null);
  const tiny = singularThreshold("ldltFactor", n, re, im, true);
  onFastestArrays(n, re, im, (r, i) => factorLdlt(n, r, i, tiny));
}

/** Solve A·x = b with the factors from ldltFactor; b (split re/im) is overwritten by x. */
export function ldltSolve(
  n: number,
  re: Float64Array,
  im: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
): void {
  // The factors are exactly unpivoted LU factors, so the LU substitutions apply with no interchanges.
  if (identityPivots.length < n) {
    identityPivots = new Int32Array(n);
    for (let i = 0; i < n; i++) identityPivots[i] = i;
  }
  luSolve(n, re, im, identityPivots, bRe, bIm);
}

let identityPivots = new Int32Array(0);

/**
 * Right-looking blocked LDLᵀ on the upper triangle. Per pivot block [k0, k1):
 *   1. factor the diagonal block (upper part; multipliers l_ik = a_ki/d_k go to the lower triangle),
 *   2. finish rows k0..k1 to the right of the block (triangular solve with the unit L of the block),
 *   3. write L21 = U12ᵀ·D⁻¹ into the lower triangle (the multipliers the kernel reads),
 *   4. update the upper triangle of the trailing matrix, four rows at a time from their own diagonal.
 * Step 4 also writes the few lower-triangle entries inside each 4-row block (columns i..i+3); those
 * cells are overwritten with multipliers in step 3 of a later block before anything reads them.
 */
function factorLdlt(n: number, re: Float64Array, im: Float64Array, tiny: number): void {
  for (let k0 = 0; k0 < n; k0 += LDLT_BLOCK) {
    const k1 = Math.min(n, k0 + LDLT_BLOCK);
    for (let k = k0; k < k1; k++) {
      const rk = k * n;
      const dr = re[rk + k];
      const di = im[rk + k];
      const mag = dr * dr + di * di;
      if (!(mag > tiny) || !Number.isFinite(mag)) throw ldltPivotError(k, n, mag, tiny);
      const inv = 1 / mag;
      const ir = dr * inv;
      const ii = -di * inv;
      for (let i = k + 1; i < k1; i++) {
        const ar = re[rk + i];
        const ai = im[rk + i];
        const lr = ar * ir - ai * ii;
        const li = ar * ii + ai * ir;
        const ri = i * n;
        re[ri + k] = lr;
        im[ri + k] = li;
        for (let j = i; j < k1; j++) {
          const ur = re[rk + j];
          const ui = im[rk + j];
          re[ri + j] -= lr * ur - li * ui;
          im[ri + j] -= lr * ui + li * ur;
        }
      }
    }
    if (k1 === n) break;
    for (let ib = k0; ib < k1; ib += ROWS) {
      const ie = Math.min(k1, ib + ROWS);
      rankUpdate(re, im, n, ib, ie, k0, ib, k1, n);
      for (let i = ib + 1; i < ie; i++) rankUpdate(re, im, n, i, i + 1, ib, i, k1, n);
    }
    for (let k = k0; k < k1; k++) {
      const rk = k * n;
      const dr = re[rk + k];
      const di = im[rk + k];
      const inv = 1 / (dr * dr + di * di);
      const ir = dr * inv;
      const ii = -di * inv;
      for (let i = k1, ik = k1 * n + k; i < n; i++, ik += n) {
        const ar = re[rk + i];
        const ai = im[rk + i];
        re[ik] = ar * ir - ai * ii;
        im[ik] = ar * ii + ai * ir;
      }
    }
    for (let i = k1; i < n; i += ROWS) rankUpdate(re, im, n, i, Math.min(n, i + ROWS), k0, k1, i, n);
  }
}

function ldltPivotError(k: number, n: number, mag: number, tiny: number): Error {
  return new Error(
    `ldltFactor: pivot ${k} of ${n} has modulus ${Math.sqrt(mag).toExponential(3)}, below the threshold ` +
      `${Math.sqrt(tiny).toExponential(3)}: the matrix is singular or needs pivoting (use luFactor)`,
  );
}

/** Solve A·x = b with the factors from luFactor; b (split re/im) is overwritten by x. */
export function luSolve(
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array,
  bRe: Float64Array,
  bIm: Float64Array,
): void {
  checkSizes("luSolve", n, re, im, piv);
  if (bRe.length < n || bIm.length < n) {
    throw new Error(`luSolve: right-hand side has length ${Math.min(bRe.length, bIm.length)}, need ${n}`);
  }
  for (let k = 0; k < n; k++) {
    const p = piv[k];
    if (p !== k) {
      let t = bRe[k];
      bRe[k] = bRe[p];
      bRe[p] = t;
      t = bIm[k];
      bIm[k] = bIm[p];
      bIm[p] = t;
    }
  }
  // Row-times-vector sums below use two accumulator pairs (even and odd j), so the additions form two
  // independent dependency chains instead of one.
  // Forward: L y = P b (unit diagonal).
  for (let i = 1; i < n; i++) {
    const ri = i * n;
    let sr = bRe[i];
    let si = bIm[i];
    let tr = 0;
    let ti = 0;
    let j = 0;
    for (; j + 1 < i; j += 2) {
      const lr = re[ri + j];
      const li = im[ri + j];
      const yr = bRe[j];
      const yi = bIm[j];
      sr -= lr * yr - li * yi;
      si -= lr * yi + li * yr;
      const mr = re[ri + j + 1];
      const mi = im[ri + j + 1];
      const zr = bRe[j + 1];
      const zi = bIm[j + 1];
      tr += mr * zr - mi * zi;
      ti += mr * zi + mi * zr;
    }
    if (j < i) {
      const lr = re[ri + j];
      const li = im[ri + j];
      sr -= lr * bRe[j] - li * bIm[j];
      si -= lr * bIm[j] + li * bRe[j];
    }
    bRe[i] = sr - tr;
    bIm[i] = si - ti;
  }
  // Backward: U x = y.
  for (let i = n - 1; i >= 0; i--) {
    const ri = i * n;
    let sr = bRe[i];
    let si = bIm[i];
    let tr = 0;
    let ti = 0;
    let j = i + 1;
    for (; j + 1 < n; j += 2) {
      const ur = re[ri + j];
      const ui = im[ri + j];
      const xr = bRe[j];
      const xi = bIm[j];
      sr -= ur * xr - ui * xi;
      si -= ur * xi + ui * xr;
      const vr = re[ri + j + 1];
      const vi = im[ri + j + 1];
      const wr = bRe[j + 1];
      const wi = bIm[j + 1];
      tr += vr * wr - vi * wi;
      ti += vr * wi + vi * wr;
    }
    if (j < n) {
      const ur = re[ri + j];
      const ui = im[ri + j];
      sr -= ur * bRe[j] - ui * bIm[j];
      si -= ur * bIm[j] + ui * bRe[j];
    }
    sr -= tr;
    si -= ti;
    const dr = re[ri + i];
    const di = im[ri + i];
    const inv = 1 / (dr * dr + di * di);
    bRe[i] = (sr * dr + si * di) * inv;
    bIm[i] = (si * dr - sr * di) * inv;
  }
}

/**
 * |pivot|² below which the matrix counts as singular: (n·ε·max|a_ij|)². A pivot that small means the
 * condition number is beyond 1/(n·ε) and the solution would be noise, so we refuse rather than return it.
 */
function singularThreshold(
  who: string,
  n: number,
  re: Float64Array,
  im: Float64Array,
  upperOnly: boolean,
): number {
  // Math.max propagates NaN, so one branch-free pass finds the maximum and any NaN; only then is the
  // offending entry looked up for the message.
  let m0 = 0;
  let m1 = 0;
  for (let row = 0; row < n; row++) {
    const end = (row + 1) * n;
    let i = upperOnly ? row * n + row : row * n;
    for (; i + 1 < end; i += 2) {
      m0 = Math.max(m0, re[i] * re[i] + im[i] * im[i]);
      m1 = Math.max(m1, re[i + 1] * re[i + 1] + im[i + 1] * im[i + 1]);
    }
    if (i < end) m0 = Math.max(m0, re[i] * re[i] + im[i] * im[i]);
  }
  const maxSq = Math.max(m0, m1);
  if (Number.isNaN(maxSq)) {
    for (let row = 0; row < n; row++) {
      for (let j = upperOnly ? row : 0; j < n; j++) {
        const i = row * n + j;
        if (Number.isNaN(re[i]) || Number.isNaN(im[i])) {
          throw new Error(`${who}: matrix entry (${row}, ${j}) is not finite (${re[i]} + ${im[i]}j)`);
        }
      }
    }
  }
  if (!Number.isFinite(maxSq)) throw new Error(`${who}: matrix has an infinite or overflowing entry`);
  const eps = n * Number.EPSILON;
  return maxSq * eps * eps;
}

function singularError(k: number, n: number, best: number, tiny: number): Error {
  if (!Number.isFinite(best)) {
    return new Error(`luFactor: matrix has a non-finite entry (NaN or infinity) in column ${k} of ${n}`);
  }
  return new Error(
    `luFactor: matrix is singular to working precision: largest pivot candidate in column ${k} of ${n} ` +
      `has modulus ${Math.sqrt(best).toExponential(3)}, below the threshold ${Math.sqrt(tiny).toExponential(3)} ` +
      "(n·ε·max|a|)",
  );
}

function swapRows(n: number, re: Float64Array, im: Float64Array, a: number, b: number): void {
  const ra = a * n;
  const rb = b * n;
  for (let j = 0; j < n; j++) {
    let t = re[ra + j];
    re[ra + j] = re[rb + j];
    re[rb + j] = t;
    t = im[ra + j];
    im[ra + j] = im[rb + j];
    im[rb + j] = t;
  }
}

function checkSizes(
  who: string,
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array | null,
): void {
  if (!Number.isInteger(n) || n < 0)
    throw new Error(`${who}: size n must be a non-negative integer, got ${n}`);
  const nn = n * n;
  if (re.length < nn || im.length < nn) {
    throw new Error(`${who}: matrix arrays hold ${Math.min(re.length, im.length)} values, need n·n = ${nn}`);
  }
  if (piv && piv.length < n) throw new Error(`${who}: pivot array holds ${piv.length} entries, need ${n}`);
}
