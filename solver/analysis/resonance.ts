/**
 * Resonances: zeros of the feed reactance X(f) between sweep points. A sign change between two
 * neighbouring points brackets a zero; it is refined by the parabola through three points around the
 * bracket when one exists (and the root lies inside the bracket), else by the straight line (secant).
 * "series" zeros have X rising through zero (the usual resonance); "parallel" ones have X falling
 * through zero (antiresonance, high resistance).
 */

export interface Resonance {
  mhz: number;
  kind: "series" | "parallel";
}

export function findResonances(mhz: number[], reactance: number[]): Resonance[] {
  const idx = mhz.map((_, i) => i).sort((a, b) => mhz[a] - mhz[b]);
  const f = idx.map((i) => mhz[i]);
  const x = idx.map((i) => reactance[i]);
  const out: Resonance[] = [];
  for (let i = 0; i + 1 < f.length; i++) {
    const x0 = x[i];
    const x1 = x[i + 1];
    if (!Number.isFinite(x0) || !Number.isFinite(x1) || f[i + 1] === f[i]) continue;
    if (x0 === 0) {
      if (i === 0 || x[i - 1] === 0) continue;
      out.push({ mhz: f[i], kind: x1 > x[i - 1] ? "series" : "parallel" });
      continue;
    }
    if (!(x0 * x1 < 0 || (x1 === 0 && i + 1 === f.length - 1))) continue;
    let root = f[i] - (x0 * (f[i + 1] - f[i])) / (x1 - x0);
    const j = i + 2 < f.length ? i + 2 : i - 1;
    if (j >= 0 && j < f.length && Number.isFinite(x[j])) {
      const q = parabolaRoot(f[i], x0, f[i + 1], x1, f[j], x[j]);
      if (q !== null && q >= f[i] && q <= f[i + 1]) root = q;
    }
    out.push({ mhz: root, kind: x1 > x0 ? "series" : "parallel" });
  }
  return out;
}

/** Root, inside the span of the first two points, of the parabola through three points; null if none. */
function parabolaRoot(a: number, fa: number, b: number, fb: number, c: number, fc: number): number | null {
  // Newton divided differences: p(t) = fa + d1 (t − a) + d2 (t − a)(t − b).
  const d1 = (fb - fa) / (b - a);
  const d2 = ((fc - fb) / (c - b) - d1) / (c - a);
  if (d2 === 0) return a - fa / d1;
  // d2 t² + (d1 − d2(a + b)) t + (fa − d1 a + d2 a b) = 0
  const A = d2;
  const B = d1 - d2 * (a + b);
  const C = fa - d1 * a + d2 * a * b;
  const disc = B * B - 4 * A * C;
  if (disc < 0) return null;
  const s = Math.sqrt(disc);
  const r1 = (-B + s) / (2 * A);
  const r2 = (-B - s) / (2 * A);
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  if (r1 >= lo && r1 <= hi) return r1;
  if (r2 >= lo && r2 <= hi) return r2;
  return null;
}
