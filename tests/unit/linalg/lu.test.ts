import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { luFactor, luSolve } from "../../../solver/mom/lu";
import { setSimdEnabled, simdKernel } from "../../../solver/mom/lu-simd";
import { naiveSolve, randomSystem, relResidual } from "./reference";

/** Factor a copy of A, solve, and return x (A and b untouched). */
function solveWithLu(n: number, aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array) {
  const re = aRe.slice();
  const im = aIm.slice();
  const piv = new Int32Array(n);
  luFactor(n, re, im, piv);
  const xRe = bRe.slice();
  const xIm = bIm.slice();
  luSolve(n, re, im, piv, xRe, xIm);
  return { xRe, xIm };
}

describe("complex LU with partial pivoting", () => {
  // Worked by hand: A = [[1, i], [i, 2]], b = [1+i, 0].
  // det A = 1·2 − i·i = 3. A⁻¹ = (1/3)[[2, −i], [−i, 1]]; x = (1/3)[2(1+i), −i(1+i)] = [(2+2i)/3, (1−i)/3].
  it("solves a 2×2 system worked by hand", () => {
    const { xRe, xIm } = solveWithLu(
      2,
      Float64Array.from([1, 0, 0, 2]),
      Float64Array.from([0, 1, 1, 0]),
      Float64Array.from([1, 0]),
      Float64Array.from([1, 0]),
    );
    expect(xRe[0]).toBeCloseTo(2 / 3, 14);
    expect(xIm[0]).toBeCloseTo(2 / 3, 14);
    expect(xRe[1]).toBeCloseTo(1 / 3, 14);
    expect(xIm[1]).toBeCloseTo(-1 / 3, 14);
  });

  // Needs a row interchange at the first step (a₀₀ = 0): A = [[0, 1], [2, 0]] (real), b = [3, 4] → x = [2, 3].
  it("pivots past a zero leading entry", () => {
    const { xRe, xIm } = solveWithLu(
      2,
      Float64Array.from([0, 1, 2, 0]),
      new Float64Array(4),
      Float64Array.from([3, 4]),
      new Float64Array(2),
    );
    expect(xRe[0]).toBeCloseTo(2, 14);
    expect(xRe[1]).toBeCloseTo(3, 14);
    expect(Math.abs(xIm[0]) + Math.abs(xIm[1])).toBe(0);
  });

  it("leaves a small residual on a random well-conditioned 161×161 system (exercises the KCHUNK split)", () => {
    const n = 161;
    const s = randomSystem(n, 12345);
    const { xRe, xIm } = solveWithLu(n, s.aRe, s.aIm, s.bRe, s.bIm);
    expect(relResidual(n, s.aRe, s.aIm, xRe, xIm, s.bRe, s.bIm)).toBeLessThan(1e-10);
  });

  it("agrees with a naive Gaussian-elimination reference (complex symmetric, like a MoM matrix)", () => {
    const n = 75; // not a multiple of any block size
    const s = randomSystem(n, 777, { symmetric: true });
    const { xRe, xIm } = solveWithLu(n, s.aRe, s.aIm, s.bRe, s.bIm);
    const ref = naiveSolve(n, s.aRe, s.aIm, s.bRe, s.bIm);
    let err = 0;
    let norm = 0;
    for (let i = 0; i < n; i++) {
      err += (xRe[i] - ref.xRe[i]) ** 2 + (xIm[i] - ref.xIm[i]) ** 2;
      norm += ref.xRe[i] ** 2 + ref.xIm[i] ** 2;
    }
    expect(Math.sqrt(err / norm)).toBeLessThan(1e-11);
  });

  it("throws a clear error on a singular matrix", () => {
    // Row 2 = row 0 + row 1: rank 2.
    const re = Float64Array.from([1, 2, 3, 4, 5, 6, 5, 7, 9]);
    const im = Float64Array.from([0, 1, 0, 1, 0, 1, 1, 1, 1]);
    expect(() => luFactor(3, re, im, new Int32Array(3))).toThrow(/singular/);
    // An exactly zero column.
    const z = new Float64Array(16);
    z[0] = 1;
    z[5] = 1;
    z[15] = 1;
    expect(() => luFactor(4, z, new Float64Array(16), new Int32Array(4))).toThrow(/column 2/);
  });

  it("handles the empty and 1×1 systems", () => {
    expect(() => luFactor(0, new Float64Array(0), new Float64Array(0), new Int32Array(0))).not.toThrow();
    // (3 + 4j)·x = 25 → x = 25/(3 + 4j) = 3 − 4j.
    const { xRe, xIm } = solveWithLu(
      1,
      Float64Array.of(3),
      Float64Array.of(4),
      Float64Array.of(25),
      Float64Array.of(0),
    );
    expect(xRe[0]).toBeCloseTo(3, 14);
    expect(xIm[0]).toBeCloseTo(-4, 14);
    expect(() => luFactor(1, Float64Array.of(0), Float64Array.of(0), new Int32Array(1))).toThrow(
      /column 0 of 1/,
    );
  });

  it("names a NaN entry instead of returning garbage", () => {
    const re = Float64Array.from([1, 0, 0, 1]);
    const im = Float64Array.from([0, 0, Number.NaN, 0]);
    expect(() => luFactor(2, re, im, new Int32Array(2))).toThrow(/entry \(1, 0\) is not finite/);
  });

  it("rejects arrays that are too short, naming the problem", () => {
    expect(() => luFactor(3, new Float64Array(8), new Float64Array(9), new Int32Array(3))).toThrow(
      /need n·n = 9/,
    );
    expect(() => luFactor(3, new Float64Array(9), new Float64Array(9), new Int32Array(2))).toThrow(/pivot/);
  });

  it("property: residual stays small for random sizes 1..40", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.boolean(),
        (n, seed, sym) => {
          const s = randomSystem(n, seed, { symmetric: sym });
          const { xRe, xIm } = solveWithLu(n, s.aRe, s.aIm, s.bRe, s.bIm);
          return relResidual(n, s.aRe, s.aIm, xRe, xIm, s.bRe, s.bIm) < 1e-10;
        },
      ),
      { numRuns: 200 },
    );
  });

  it("property: matches the naive reference for random sizes 1..40 without diagonal dominance", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 2 ** 30 }), (n, seed) => {
        // Diagonal shift 0: a plain random matrix, so pivoting actually matters.
        const s = randomSystem(n, seed, { diagonalShift: 0 });
        const { xRe, xIm } = solveWithLu(n, s.aRe, s.aIm, s.bRe, s.bIm);
        const ref = naiveSolve(n, s.aRe, s.aIm, s.bRe, s.bIm);
        let err = 0;
        let norm = 0;
        for (let i = 0; i < n; i++) {
          err += (xRe[i] - ref.xRe[i]) ** 2 + (xIm[i] - ref.xIm[i]) ** 2;
          norm += ref.xRe[i] ** 2 + ref.xIm[i] ** 2;
        }
        // Random matrices can be mildly ill-conditioned; both solvers pivot, so they agree far better than this.
        return Math.sqrt(err / norm) < 1e-8;
      }),
      { numRuns: 200 },
    );
  });

  // Node 20 has WebAssembly SIMD; if this fails the fast path silently fell back to JS.
  it("has the WebAssembly SIMD kernel available in Node", () => {
    expect(simdKernel()).not.toBeNull();
  });

  it("gives the same factors with the SIMD kernel and with the pure-JS fallback", () => {
    const n = 67; // odd: exercises the SIMD kernel's odd-column tail
    const s = randomSystem(n, 4242, { diagonalShift: 0 });
    const run = () => {
      const re = s.aRe.slice();
      const im = s.aIm.slice();
      const piv = new Int32Array(n);
      luFactor(n, re, im, piv);
      return { re, im, piv };
    };
    const fast = run();
    setSimdEnabled(false);
    let slow: ReturnType<typeof run>;
    try {
      slow = run();
    } finally {
      setSimdEnabled(true);
    }
    expect(Array.from(fast.piv)).toEqual(Array.from(slow.piv));
    let diff = 0;
    let scale = 0;
    for (let i = 0; i < n * n; i++) {
      diff = Math.max(diff, Math.abs(fast.re[i] - slow.re[i]), Math.abs(fast.im[i] - slow.im[i]));
      scale = Math.max(scale, Math.abs(slow.re[i]), Math.abs(slow.im[i]));
    }
    // Same operations in a different association order: agreement to rounding, scaled by the entries.
    expect(diff / scale).toBeLessThan(1e-12);
  });

  it("property: the pure-JS fallback also solves random systems of sizes 1..40", () => {
    setSimdEnabled(false);
    try {
      fc.assert(
        fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 2 ** 30 }), (n, seed) => {
          const s = randomSystem(n, seed, { symmetric: true });
          const { xRe, xIm } = solveWithLu(n, s.aRe, s.aIm, s.bRe, s.bIm);
          return relResidual(n, s.aRe, s.aIm, xRe, xIm, s.bRe, s.bIm) < 1e-10;
        }),
        { numRuns: 100 },
      );
    } finally {
      setSimdEnabled(true);
    }
  });
});
