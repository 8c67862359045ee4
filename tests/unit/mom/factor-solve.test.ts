/**
 * The symmetric fast path falls back to pivoted LU when LDLᵀ without pivoting breaks down
 * (Golub & Van Loan, Matrix Computations, 4th ed., §4.1: LDLᵀ needs non-vanishing, not-too-small
 * pivots; a zero or tiny leading pivot is the textbook failure).
 */
import { describe, expect, it } from "vitest";
import { makeSolveWork, solveSymmetric } from "../../../solver/mom/factor-solve";

function solve(a: number[][], b: number[]) {
  const n = b.length;
  const zr = Float64Array.from(a.flat());
  const zi = new Float64Array(n * n);
  const br = Float64Array.from(b);
  const bi = new Float64Array(n);
  const w = makeSolveWork(n);
  solveSymmetric(w, zr, zi, br, bi);
  return { x: Array.from(br), how: w.last };
}

describe("solveSymmetric", () => {
  it("takes the LDLᵀ path for a well-pivoted symmetric matrix", () => {
    const r = solve(
      [
        [4, 1],
        [1, 3],
      ],
      [1, 2],
    );
    expect(r.how).toBe("ldlt");
    // Cramer's rule: det = 11, x = (1·3 − 1·2, 4·2 − 1·1)/11.
    expect(r.x[0]).toBeCloseTo(1 / 11, 14);
    expect(r.x[1]).toBeCloseTo(7 / 11, 14);
  });

  it("falls back to LU for a zero leading pivot", () => {
    const r = solve(
      [
        [0, 1],
        [1, 0],
      ],
      [2, 3],
    );
    expect(r.how).toBe("lu");
    expect(r.x[0]).toBeCloseTo(3, 14);
    expect(r.x[1]).toBeCloseTo(2, 14);
  });

  it("returns an accurate answer when a tiny leading pivot strains LDLᵀ (either path)", () => {
    const e = 1e-13;
    const r = solve(
      [
        [e, 1, 0],
        [1, 1, 1],
        [0, 1, 2],
      ],
      [1, 2, 3],
    );
    // Residual of the returned x against the original system.
    const A = [
      [e, 1, 0],
      [1, 1, 1],
      [0, 1, 2],
    ];
    const b = [1, 2, 3];
    A.forEach((row, i) => {
      expect(row.reduce((s, v, j) => s + v * r.x[j], 0)).toBeCloseTo(b[i], 12);
    });
  });
});
