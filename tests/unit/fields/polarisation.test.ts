import { describe, expect, it } from "vitest";
import { solveModel } from "../../../solver/index";
import type { PatternGrid, WireModel } from "../../../solver/model/types";

// Balanis, Antenna Theory, 4th ed., §4.2 (eq. 4-26a–c, from memory): a z-directed current radiates E_θ
// only; by symmetry a horizontal current along x radiates E_φ only in its broadside (y, z = 0) direction.
const lambda = 299.792458 / 14;
function pattern(points: [number, number, number][]): PatternGrid {
  const model: WireModel = {
    wires: [{ id: "d", points, radius: 1e-4 }],
    feed: { wire: "d", at: 0.5 },
    ground: { kind: "free" },
    frequenciesMHz: [14],
  };
  return solveModel(model, { patternStepDeg: 5, keepPattern: true }).results[0].pattern!;
}
const at = (p: PatternGrid, arr: Float64Array, el: number, brg: number) =>
  arr[p.elevationsDeg.indexOf(el) * p.bearingsDeg.length + p.bearingsDeg.indexOf(brg)];

describe("far-field polarisations", () => {
  it("a vertical dipole radiates vertical polarisation only", () => {
    const p = pattern([
      [0, 0, -lambda / 4],
      [0, 0, lambda / 4],
    ]);
    expect(at(p, p.verticalDbi, 0, 45)).toBeCloseTo(2.15, 0);
    expect(at(p, p.horizontalDbi, 0, 45)).toBeLessThan(-100);
  });

  it("a horizontal dipole along x is horizontally polarised broadside (north)", () => {
    const p = pattern([
      [-lambda / 4, 0, 0],
      [lambda / 4, 0, 0],
    ]);
    expect(at(p, p.horizontalDbi, 0, 0)).toBeCloseTo(2.15, 0);
    expect(at(p, p.verticalDbi, 0, 0)).toBeLessThan(-100);
  });

  it("the two polarisations' powers add up to the total everywhere", () => {
    const p = pattern([
      [-2, -1, -1.5],
      [2, 1.5, 1],
    ]);
    for (let q = 0; q < p.gainDbi.length; q += 7) {
      const sum = 10 ** (p.verticalDbi[q] / 10) + 10 ** (p.horizontalDbi[q] / 10);
      expect(sum).toBeCloseTo(10 ** (p.gainDbi[q] / 10), 9);
    }
  });
});
