import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { prepareInternal } from "../../../solver/index";
import type { WireModel } from "../../../solver/model/types";
import { factorSymmetric, ldltFactor, ldltSolve, luFactor, luSolve } from "../../../solver/mom/lu";
import { setSimdEnabled } from "../../../solver/mom/lu-simd";
import { naiveSolve, randomSystem, relResidual } from "./reference";

function solveLdlt(n: number, aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array) {
  const re = aRe.slice();
  const im = aIm.slice();
  ldltFactor(n, re, im);
  const xRe = bRe.slice();
  const xIm = bIm.slice();
  ldltSolve(n, re, im, xRe, xIm);
  return { xRe, xIm };
}

function relDiff(a: Float64Array, b: Float64Array, c: Float64Array, d: Float64Array): number {
  let e = 0;
  let s = 0;
  for (let i = 0; i < a.length; i++) {
    e += (a[i] - c[i]) ** 2 + (b[i] - d[i]) ** 2;
    s += c[i] ** 2 + d[i] ** 2;
  }
  return Math.sqrt(e / s);
}

describe("complex-symmetric LDLᵀ (no pivoting)", () => {
  // By hand: A = [[2, i], [i, 2]] (symmetric, not Hermitian), b = [1, 0].
  // det = 4 − i² = 5; x = (1/5)[2, −i].
  it("solves a 2×2 complex-symmetric system worked by hand", () => {
    const { xRe, xIm } = solveLdlt(
      2,
      Float64Array.from([2, 0, 0, 2]),
      Float64Array.from([0, 1, 1, 0]),
      Float64Array.from([1, 0]),
      Float64Array.from([0, 0]),
    );
    expect(xRe[0]).toBeCloseTo(0.4, 14);
    expect(xIm[0]).toBeCloseTo(0, 14);
    expect(xRe[1]).toBeCloseTo(0, 14);
    expect(xIm[1]).toBeCloseTo(-0.2, 14);
  });

  it("reads only the upper triangle", () => {
    const n = 90; // several LDLT_BLOCKs plus a remainder
    const s = randomSystem(n, 99, { symmetric: true });
    const re = s.aRe.slice();
    const im = s.aIm.slice();
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        re[i * n + j] = Number.NaN;
        im[i * n + j] = Number.NaN;
      }
    }
    ldltFactor(n, re, im);
    const xRe = s.bRe.slice();
    const xIm = s.bIm.slice();
    ldltSolve(n, re, im, xRe, xIm);
    expect(relResidual(n, s.aRe, s.aIm, xRe, xIm, s.bRe, s.bIm)).toBeLessThan(1e-10);
  });

  it("refuses a zero pivot and points at pivoting", () => {
    // [[0, 1], [1, 0]] is symmetric and well conditioned but has no LDLᵀ without interchanges.
    const re = Float64Array.from([0, 1, 1, 0]);
    expect(() => ldltFactor(2, re, new Float64Array(4))).toThrow(/pivot 0 of 2.*use luFactor/);
  });

  it("property: agrees with the naive elimination reference for random sizes 1..80", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 80 }), fc.integer({ min: 1, max: 2 ** 30 }), (n, seed) => {
        // Diagonal shift n keeps the pivots large, the case LDLᵀ without pivoting is meant for.
        const s = randomSystem(n, seed, { symmetric: true });
        const x = solveLdlt(n, s.aRe, s.aIm, s.bRe, s.bIm);
        const ref = naiveSolve(n, s.aRe, s.aIm, s.bRe, s.bIm);
        return relDiff(x.xRe, x.xIm, ref.xRe, ref.xIm) < 1e-11;
      }),
      { numRuns: 60 },
    );
  });

  it("gives the same answer through the pure-JS kernel", () => {
    const n = 71;
    const s = randomSystem(n, 5, { symmetric: true });
    const fast = solveLdlt(n, s.aRe, s.aIm, s.bRe, s.bIm);
    setSimdEnabled(false);
    let slow: ReturnType<typeof solveLdlt>;
    try {
      slow = solveLdlt(n, s.aRe, s.aIm, s.bRe, s.bIm);
    } finally {
      setSimdEnabled(true);
    }
    expect(relDiff(fast.xRe, fast.xIm, slow.xRe, slow.xIm)).toBeLessThan(1e-13);
  });

  // The case it exists for: a real moment-method matrix (a half-wave dipole over perfect ground beside a
  // grounded mast). Checked against the pivoted LU on the same matrix, not against physics.
  it("solves a moment-method impedance matrix like the pivoted LU does", () => {
    const model: WireModel = {
      wires: [
        {
          id: "d",
          points: [
            [-5.2, 0, 8],
            [5.2, 0, 8],
          ],
          radius: 0.001,
          segments: 41,
        },
        {
          id: "mast",
          points: [
            [3, 2, 0],
            [3, 2, 6],
          ],
          radius: 0.02,
          segments: 12,
        },
      ],
      feed: { wire: "d", at: 0.5 },
      ground: { kind: "perfect" },
      frequenciesMHz: [14.1],
    };
    const { internals } = prepareInternal(model, { patternStepDeg: 0 });
    const z = internals.solver.matrixAt(14.1e6);
    const n = z.n;
    const aRe = z.re.slice(0, n * n);
    const aIm = z.im.slice(0, n * n);
    const bRe = new Float64Array(n);
    const bIm = new Float64Array(n);
    bRe[n >> 2] = 1;
    const lre = aRe.slice();
    const lim = aIm.slice();
    const piv = new Int32Array(n);
    luFactor(n, lre, lim, piv);
    const luX = { xRe: bRe.slice(), xIm: bIm.slice() };
    luSolve(n, lre, lim, piv, luX.xRe, luX.xIm);
    // The fill is symmetric only to quadrature accuracy (self-pair J10 vs J01 come from different rules;
    // about 1e-10 of max|Z| here), and ldltFactor reads the upper triangle: compare on that matrix.
    const sRe = aRe.slice();
    const sIm = aIm.slice();
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        sRe[i * n + j] = sRe[j * n + i];
        sIm[i * n + j] = sIm[j * n + i];
      }
    }
    const x = solveLdlt(n, aRe, aIm, bRe, bIm);
    expect(relResidual(n, sRe, sIm, x.xRe, x.xIm, bRe, bIm)).toBeLessThan(1e-11);
    expect(relDiff(x.xRe, x.xIm, luX.xRe, luX.xIm)).toBeLessThan(1e-6);
    // And the safe entry point picks LDLᵀ for it: symmetric to quadrature accuracy, no growth.
    expect(factorSymmetric(n, aRe.slice(), aIm.slice(), new Int32Array(n))).toBe("ldlt");
  });
});

describe("factorSymmetric: LDLᵀ when safe, pivoted LU otherwise", () => {
  function solveSym(n: number, aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array) {
    const re = aRe.slice();
    const im = aIm.slice();
    const piv = new Int32Array(n);
    const used = factorSymmetric(n, re, im, piv);
    const xRe = bRe.slice();
    const xIm = bIm.slice();
    luSolve(n, re, im, piv, xRe, xIm);
    return { used, res: relResidual(n, aRe, aIm, xRe, xIm, bRe, bIm) };
  }

  it("uses LDLᵀ on a symmetric matrix with a strong diagonal", () => {
    const s = randomSystem(60, 8, { symmetric: true });
    const r = solveSym(60, s.aRe, s.aIm, s.bRe, s.bIm);
    expect(r.used).toBe("ldlt");
    expect(r.res).toBeLessThan(1e-12);
  });

  it("falls back to LU on an asymmetric matrix", () => {
    const s = randomSystem(60, 8);
    const r = solveSym(60, s.aRe, s.aIm, s.bRe, s.bIm);
    expect(r.used).toBe("lu");
    expect(r.res).toBeLessThan(1e-12);
  });

  it("falls back to LU on a zero pivot and on large growth", () => {
    // [[0, 1], [1, 0]]: no LDLᵀ at all.
    const z = solveSym(
      2,
      Float64Array.of(0, 1, 1, 0),
      new Float64Array(4),
      Float64Array.of(1, 2),
      new Float64Array(2),
    );
    expect(z.used).toBe("lu");
    expect(z.res).toBeLessThan(1e-15);
    // [[1e-8, 1], [1, 1]]: LDLᵀ exists but d₂ = 1 − 1e8, a growth of 1e8 (Golub & Van Loan §3.4's example
    // of why pivoting matters, in symmetric form).
    const g = solveSym(
      2,
      Float64Array.of(1e-8, 1, 1, 1),
      new Float64Array(4),
      Float64Array.of(1, 2),
      new Float64Array(2),
    );
    expect(g.used).toBe("lu");
    expect(g.res).toBeLessThan(1e-15);
  });

  it("property: always solves random symmetric systems, with or without a strong diagonal", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 40 }),
        fc.integer({ min: 1, max: 2 ** 30 }),
        fc.boolean(),
        (n, seed, strong) => {
          const s = randomSystem(n, seed, { symmetric: true, diagonalShift: strong ? n : 0 });
          return solveSym(n, s.aRe, s.aIm, s.bRe, s.bIm).res < 1e-9;
        },
      ),
      { numRuns: 100 },
    );
  });
});
