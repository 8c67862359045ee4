import { describe, expect, it } from "vitest";
import { realGroundKernel } from "../../../solver/ground/real";
import { makeSegmentSet, mirrorSegmentSet } from "../../../solver/mom/segments";

// Horizontal, slanted and vertical segments at a few heights (metres), 14 MHz (λ ≈ 21 m).
const starts = Float64Array.from([0, 0, 1, 3, 1, 0.4, 6, -2, 0.05]);
const ends = Float64Array.from([1.2, 0, 1, 3.6, 1.7, 1.2, 6, -2, 1.0]);
const segments = makeSegmentSet(starts, ends, Float64Array.from([1e-3, 1e-3, 2e-3]));
const setup = {
  segments,
  mirrored: mirrorSegmentSet(segments),
  wireOfSegment: Int32Array.from([0, 1, 2]),
  connections: [undefined, undefined, undefined],
  lowestFrequencyHz: 14e6,
};
const f = { frequencyHz: 14e6, omega: 2 * Math.PI * 14e6, k: (2 * Math.PI * 14e6) / 299792458, eta: 376.73 };

describe("Sommerfeld ground kernel", () => {
  // Reciprocity (Harrington 1968, §3-8: Z_mn = Z_nm for a reciprocal medium, which the half-space is):
  // pair (p, q) must equal pair (q, p) with u ↔ v, i.e. J10 ↔ J01 — what `symmetric: true` promises.
  it("is reciprocal pair by pair", () => {
    const g = realGroundKernel(setup, { permittivity: 13, conductivity: 0.005, method: "sommerfeld" });
    expect(g.method).toBe("sommerfeld");
    g.beginFrequency(f);
    for (let p = 0; p < 3; p++) {
      for (let q = 0; q < 3; q++) {
        const a = new Float64Array(10);
        const b = new Float64Array(10);
        g.pairTerms(p, q, a);
        g.pairTerms(q, p, b);
        const swap = [0, 1, 4, 5, 2, 3, 6, 7, 8, 9];
        const scale = Math.max(...Array.from(a, Math.abs));
        for (let i = 0; i < 10; i++) expect(Math.abs(a[i] - b[swap[i]])).toBeLessThan(2e-3 * scale);
      }
    }
  });

  // A ground identical to air reflects nothing: κ = 0 and the remainder vanishes (R_V = R_H = 0), up to
  // the Bessel approximations (A&S 9.4, 1e-7 absolute) integrated over the spectrum; image terms here are O(0.1–1).
  it("adds nothing when the ground is air", () => {
    const g = realGroundKernel(setup, { permittivity: 1, conductivity: 1e-12, method: "sommerfeld" });
    g.beginFrequency(f);
    const a = new Float64Array(10);
    for (let p = 0; p < 3; p++) for (let q = 0; q < 3; q++) g.pairTerms(p, q, a);
    for (let i = 0; i < 10; i++) expect(Math.abs(a[i])).toBeLessThan(2e-5);
  });
});
