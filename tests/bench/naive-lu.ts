/**
 * The plain triple-loop complex LU (right-looking, k-i-j over contiguous rows, partial pivoting), kept only
 * as the yardstick the optimised solver/mom/lu.ts is measured against in the benchmark.
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
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        let t = re[k * n + j];
        re[k * n + j] = re[p * n + j];
        re[p * n + j] = t;
        t = im[k * n + j];
        im[k * n + j] = im[p * n + j];
        im[p * n + j] = t;
      }
    }
    const dr = re[k * n + k];
    const di = im[k * n + k];
    const d = dr * dr + di * di;
    for (let i = k + 1; i < n; i++) {
      const ar = re[i * n + k];
      const ai = im[i * n + k];
      const lr = (ar * dr + ai * di) / d;
      const li = (ai * dr - ar * di) / d;
      re[i * n + k] = lr;
      im[i * n + k] = li;
      for (let j = k + 1; j < n; j++) {
        const ur = re[k * n + j];
        const ui = im[k * n + j];
        re[i * n + j] -= lr * ur - li * ui;
        im[i * n + j] -= lr * ui + li * ur;
      }
    }
  }
}
