/**
 * Dense complex LU factorisation with partial pivoting, over split real/imaginary Float64Arrays.
 *
 * Storage: row-major n×n, element (i, j) at i·n + j. After luFactor the strict lower triangle holds
 * L (unit diagonal implied) and the upper triangle holds U, with P·A = L·U; piv[k] is the row that was
 * swapped into row k at step k (LAPACK-style sequential interchanges).
 */

/** Factor A in place. Throws an Error naming the column when A is singular (to working precision). */
export function luFactor(n: number, re: Float64Array, im: Float64Array, piv: Int32Array): void {
  checkSizes("luFactor", n, re, im, piv);
  const tiny = singularThreshold(n, re, im);
  for (let k = 0; k < n; k++) {
    // Pivot: largest |a_ik|² in column k at or below the diagonal.
    let p = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const r = re[i * n + k];
      const m = im[i * n + k];
      const mag = r * r + m * m;
      if (mag > best) {
        best = mag;
        p = i;
      }
    }
    piv[k] = p;
    if (!(best > tiny) || !Number.isFinite(best)) throw singularError(k, n, best, tiny);
    if (p !== k) swapRows(n, re, im, k, p);
    const kk = k * n + k;
    const dr = re[kk];
    const di = im[kk];
    // 1 / pivot
    const inv = 1 / (dr * dr + di * di);
    const ir = dr * inv;
    const ii = -di * inv;
    for (let i = k + 1; i < n; i++) {
      const ik = i * n + k;
      const ar = re[ik];
      const ai = im[ik];
      const lr = ar * ir - ai * ii;
      const li = ar * ii + ai * ir;
      re[ik] = lr;
      im[ik] = li;
      const ri = i * n;
      const rk = k * n;
      for (let j = k + 1; j < n; j++) {
        const ur = re[rk + j];
        const ui = im[rk + j];
        re[ri + j] -= lr * ur - li * ui;
        im[ri + j] -= lr * ui + li * ur;
      }
    }
  }
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
  // Forward: L y = P b (unit diagonal).
  for (let i = 1; i < n; i++) {
    const ri = i * n;
    let sr = bRe[i];
    let si = bIm[i];
    for (let j = 0; j < i; j++) {
      const lr = re[ri + j];
      const li = im[ri + j];
      const yr = bRe[j];
      const yi = bIm[j];
      sr -= lr * yr - li * yi;
      si -= lr * yi + li * yr;
    }
    bRe[i] = sr;
    bIm[i] = si;
  }
  // Backward: U x = y.
  for (let i = n - 1; i >= 0; i--) {
    const ri = i * n;
    let sr = bRe[i];
    let si = bIm[i];
    for (let j = i + 1; j < n; j++) {
      const ur = re[ri + j];
      const ui = im[ri + j];
      const xr = bRe[j];
      const xi = bIm[j];
      sr -= ur * xr - ui * xi;
      si -= ur * xi + ui * xr;
    }
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
function singularThreshold(n: number, re: Float64Array, im: Float64Array): number {
  let maxSq = 0;
  const nn = n * n;
  for (let i = 0; i < nn; i++) {
    const m = re[i] * re[i] + im[i] * im[i];
    if (m > maxSq) maxSq = m;
    else if (!(m <= maxSq)) {
      // NaN fails both comparisons; report where it is rather than pivoting on garbage.
      throw new Error(
        `luFactor: matrix entry (${Math.floor(i / n)}, ${i % n}) is not finite (${re[i]} + ${im[i]}j)`,
      );
    }
  }
  if (!Number.isFinite(maxSq)) throw new Error("luFactor: matrix has an infinite or overflowing entry");
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

function checkSizes(who: string, n: number, re: Float64Array, im: Float64Array, piv: Int32Array): void {
  if (!Number.isInteger(n) || n < 0)
    throw new Error(`${who}: size n must be a non-negative integer, got ${n}`);
  const nn = n * n;
  if (re.length < nn || im.length < nn) {
    throw new Error(`${who}: matrix arrays hold ${Math.min(re.length, im.length)} values, need n·n = ${nn}`);
  }
  if (piv.length < n) throw new Error(`${who}: pivot array holds ${piv.length} entries, need ${n}`);
}
