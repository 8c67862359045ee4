/**
 * The segment-pair integrals against independent references:
 *  - static (k → 0) self and collinear-adjacent terms in closed form: with F(x) = x·asinh(x/a) − sqrt(x² + a²)
 *    (F″(x) = 1/sqrt(x² + a²); Gradshteyn & Ryzhik 2.261), ∫∫ ds ds′/sqrt((s − s′)² + a²) over
 *    [a1, a2] × [b1, b2] = −[F(a2 − b2) − F(a2 − b1) − F(a1 − b2) + F(a1 − b1)];
 *  - dynamic terms for pairs well apart by brute-force tensor Gauss–Legendre (40 × 40 points, written here,
 *    not the solver's rules), where the integrand is smooth.
 */
import { describe, expect, it } from "vitest";
import { pairIntegrals } from "../../../solver/mom/pair-integrals";
import { makeSegmentSet, type SegmentSet } from "../../../solver/mom/segments";

function set(segs: [number[], number[]][], a: number): SegmentSet {
  return makeSegmentSet(
    Float64Array.from(segs.flatMap((s) => s[0])),
    Float64Array.from(segs.flatMap((s) => s[1])),
    Float64Array.from(segs.map(() => a)),
  );
}

const F = (x: number, a: number) => x * Math.asinh(x / a) - Math.sqrt(x * x + a * a);
const staticRect = (a1: number, a2: number, b1: number, b2: number, a: number) =>
  -(F(a2 - b2, a) - F(a2 - b1, a) - F(a1 - b2, a) + F(a1 - b1, a));

/** Gauss–Legendre on [0, 1] by Newton on P_n, independent of solver/mom/quadrature.ts. */
function gl(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    let t = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let d = 0;
    for (let it = 0; it < 60; it++) {
      let p0 = 1;
      let p1 = t;
      for (let k = 2; k <= n; k++) [p0, p1] = [p1, ((2 * k - 1) * t * p1 - (k - 1) * p0) / k];
      d = (n * (t * p1 - p0)) / (t * t - 1);
      t -= p1 / d;
    }
    x.push((1 + t) / 2);
    w.push(1 / ((1 - t * t) * d * d));
  }
  return { x, w };
}

function bruteForce(S: SegmentSet, p: number, q: number, k: number, a: number): number[] {
  const { x, w } = gl(40);
  const out = new Array(8).fill(0);
  for (let i = 0; i < x.length; i++) {
    for (let j = 0; j < x.length; j++) {
      const u = x[i];
      const v = x[j];
      let r2 = a * a;
      for (let c = 0; c < 3; c++) {
        const d =
          S.start[3 * p + c] +
          u * S.len[p] * S.dir[3 * p + c] -
          (S.start[3 * q + c] + v * S.len[q] * S.dir[3 * q + c]);
        r2 += d * d;
      }
      const R = Math.sqrt(r2);
      const ww = (w[i] * w[j] * S.len[p] * S.len[q]) / R;
      const re = Math.cos(k * R) * ww;
      const im = -Math.sin(k * R) * ww;
      const m = [1, u, v, u * v];
      for (let t = 0; t < 4; t++) {
        out[2 * t] += m[t] * re;
        out[2 * t + 1] += m[t] * im;
      }
    }
  }
  return out;
}

describe("pair integrals", () => {
  const a = 1e-3;
  const l = 0.2;
  const S = set(
    [
      [
        [0, 0, 0],
        [l, 0, 0],
      ],
      [
        [l, 0, 0],
        [2 * l, 0, 0],
      ],
      [
        [0, 1, 0.3],
        [0.15, 1.1, 0.4],
      ],
      [
        [3, 4, 1],
        [3.1, 4.15, 1.05],
      ],
    ],
    a,
  );
  const out = new Float64Array(8);

  it("self term, static part, matches the closed form within 1e-4", () => {
    pairIntegrals(S, 0, S, 0, 1e-9, out);
    const exact = staticRect(0, l, 0, l, a);
    expect(Math.abs(out[0] / exact - 1)).toBeLessThan(1e-4);
  });

  it("collinear neighbours, static part, match the closed form within 5e-4", () => {
    pairIntegrals(S, 0, S, 1, 1e-9, out);
    const exact = staticRect(0, l, l, 2 * l, a);
    expect(Math.abs(out[0] / exact - 1)).toBeLessThan(5e-4);
  });

  it("a pair well apart matches brute-force Gauss in all four moments (k = 2π/3 m⁻¹)", () => {
    const k = (2 * Math.PI) / 3;
    pairIntegrals(S, 0, S, 2, k, out);
    const ref = bruteForce(S, 0, 2, k, a);
    const scale = Math.hypot(ref[0], ref[1]);
    for (let i = 0; i < 8; i++)
      expect(Math.abs(out[i] - ref[i]) / scale, `component ${i}`).toBeLessThan(1e-4);
  });

  it("a distant pair (separable far form) matches brute force within 6e-4", () => {
    // The far form keeps the linear phase and amplitude tilt exactly; what it drops is the curvature of
    // R across each segment: a quadratic phase kℓ²/(2R)·(u − ½)², worth kℓ²/(24R) ≈ 3e-4 here (k = 2.1,
    // ℓ = 0.2 m, R ≈ 5.1 m), and amplitude terms of order (ℓ/R)²/12 ≈ 1e-4. Measured 4.2e-4.
    const k = (2 * Math.PI) / 3;
    pairIntegrals(S, 0, S, 3, k, out);
    const ref = bruteForce(S, 0, 3, k, a);
    const scale = Math.hypot(ref[0], ref[1]);
    for (let i = 0; i < 8; i++)
      expect(Math.abs(out[i] - ref[i]) / scale, `component ${i}`).toBeLessThan(6e-4);
  });

  it("is symmetric: (p, q) equals (q, p) with u and v swapped", () => {
    const k = 2;
    const pq = new Float64Array(8);
    const qp = new Float64Array(8);
    pairIntegrals(S, 1, S, 2, k, pq);
    pairIntegrals(S, 2, S, 1, k, qp);
    const close = (x: number, y: number) => expect(Math.abs(x - y)).toBeLessThan(1e-12 * Math.abs(pq[0]));
    close(pq[0], qp[0]);
    close(pq[1], qp[1]);
    close(pq[2], qp[4]); // ∫∫u G (p,q) = ∫∫v G (q,p)
    close(pq[3], qp[5]);
    close(pq[6], qp[6]);
    close(pq[7], qp[7]);
  });
});
