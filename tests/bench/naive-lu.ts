/**
 * The plain triple-loop complex LU (right-looking, k-i-j over contiguous rows, partial pivoting, row
 * offsets hoisted: a fair unblocked version, not a strawman), kept only as the yardstick the optimised
 * solver/mom/lu.ts is measured against in the benchmark.
 */
export function naiveLuFactor(n: number, re: Float64Array, im: Float64Array, piv: Int32Array): void {
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const m = re[i * n + k] ** 2 + im[i * n + k] ** 2;
      if (m > best) {
        best = m;
        p = i;
      }
    }
    if (!(best > 0)) throw new Error(`naiveLuFactor: singular at column ${k}`);
    piv[k] = p;
    const rk = k * n;
    if (p !== k) {
      const rp = p * n;
      for (let j = 0; j < n; j++) {
        let t = re[rk + j];
        re[rk + j] = re[rp + j];
        re[rp + j] = t;
        t = im[rk + j];
        im[rk + j] = im[rp + j];
        im[rp + j] = t;
      }
    }
    const dr = re[rk + k];
    const di = im[rk + k];
    const d = dr * dr + di * di;
    for (let i = k + 1; i < n; i++) {
      const ri = i * n;
      const ar = re[ri + k];
      const ai = im[ri + k];
      const lr = (ar * dr + ai * di) / d;
      const li = (ai * dr - ar * di) / d;
      re[ri + k] = lr;
      im[ri + k] = li;
      for (let j = k + 1; j < n; j++) {
        const ur = re[rk + j];
        const ui = im[rk + j];
        re[ri + j] -= lr * ur - li * ui;
        im[ri + j] -= lr * ui + li * ur;
      }
    }
  }
}
