/**
 * Resonance search on reactance samples. References are closed-form functions whose zeros are known
 * exactly (a quadratic is reproduced exactly by the three-point parabola; a series RLC's reactance
 * ωL − 1/(ωC) vanishes at f0 = 1/(2π sqrt(LC)), Thomson's formula).
 */
import { describe, expect, it } from "vitest";
import { findResonances } from "../../../solver/analysis/resonance";
import { frequencyListMHz } from "../../../solver/analysis/sweep";

describe("findResonances", () => {
  it("is exact for a quadratic reactance", () => {
    const f = [1, 1.5, 2.5, 3];
    const x = f.map((v) => 3 * (v * v - 4));
    const r = findResonances(f, x);
    expect(r).toHaveLength(1);
    expect(r[0].mhz).toBeCloseTo(2, 12);
    expect(r[0].kind).toBe("series");
  });

  it("finds a series RLC resonance within 0.1 % from a coarse sweep", () => {
    const L = 2e-6;
    const C = 120e-12;
    const f0 = 1 / (2 * Math.PI * Math.sqrt(L * C)) / 1e6;
    const f = frequencyListMHz({ from: 5, to: 15, count: 11 });
    const x = f.map((m) => 2 * Math.PI * m * 1e6 * L - 1 / (2 * Math.PI * m * 1e6 * C));
    const r = findResonances(f, x);
    expect(r).toHaveLength(1);
    expect(Math.abs(r[0].mhz / f0 - 1)).toBeLessThan(1e-3);
  });

  it("labels a falling zero as parallel (antiresonance) and ignores samples with no sign change", () => {
    const f = [10, 11, 12, 13];
    expect(findResonances(f, [50, 10, -30, -80])[0].kind).toBe("parallel");
    expect(findResonances(f, [5, 6, 7, 8])).toHaveLength(0);
  });

  it("accepts unsorted sweeps", () => {
    const r = findResonances([3, 1, 2.5, 1.5], [3 * 5, 3 * -3, 3 * 2.25, 3 * -1.75]);
    expect(r[0].mhz).toBeCloseTo(2, 12);
  });
});

describe("frequencyListMHz", () => {
  it("spaces a range evenly with both ends", () => {
    const list = frequencyListMHz({ from: 7, to: 7.3, count: 4 });
    [7, 7.1, 7.2, 7.3].forEach((v, i) => {
      expect(list[i]).toBeCloseTo(v, 12);
    });
    expect(frequencyListMHz({ from: 7, to: 8, count: 1 })).toEqual([7]);
  });
});
