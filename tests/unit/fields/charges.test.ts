/** Charges from the continuity equation q = −(1/jω) dI/dl (Balanis, Antenna Theory, 4th ed., §4.2). */

import { describe, expect, it } from "vitest";
import { endCharges, segmentCharges } from "../../../solver/fields/charges";
import { buildMesh, C, sinusoidalDipole } from "./helpers";

const F = 7e6;
const OMEGA = 2 * Math.PI * F;

describe("segment charges", () => {
  // Standing wave I = I0 sin(k(h − |z|)): q = −(1/jω) dI/dz = (j k I0/ω) cos(k(h − |z|))·sign(z)
  // (derivative of the textbook current, Balanis eq. 4-56); the piecewise-constant q is that derivative's
  // mean over each segment, i.e. the exact difference quotient.
  it("follow the derivative of a half-wave dipole's current, in quadrature with it", () => {
    const lambda = C / F;
    const k = (2 * Math.PI) / lambda;
    const n = 40;
    const { mesh, currents } = buildMesh([sinusoidalDipole([0, 0, 0], [0, 0, 1], lambda / 2, lambda, n)]);
    const q = segmentCharges(mesh, currents, F);
    for (let i = 0; i < n; i++) {
      const z0 = mesh.starts[3 * i + 2];
      const z1 = mesh.ends[3 * i + 2];
      const cur = (z: number) => Math.sin(k * (lambda / 4 - Math.abs(z)));
      const expected = (cur(z1) - cur(z0)) / (z1 - z0) / OMEGA; // (j/ω) dI/dz, real I → imaginary q
      expect(q.re[i]).toBeCloseTo(0, 20);
      expect(q.im[i] / expected).toBeCloseTo(1, 12);
    }
    // Odd about the feed: the two arms carry opposite charge. Near the tips |q| → k I0/ω.
    expect(q.im[0]).toBeCloseTo(-q.im[n - 1], 15);
    expect(Math.abs(q.im[0]) / (k / OMEGA)).toBeGreaterThan(0.99);
  });

  it("conserve charge: line charge plus end charges sum to zero on every segment", () => {
    const { mesh, currents } = buildMesh([
      { from: [0, 0, 1], to: [3, 1, 4], segments: 5, current: (u) => [1 + u, 2 * u * u - 0.5] },
    ]);
    const q = segmentCharges(mesh, currents, F);
    const p = endCharges(mesh, currents, F);
    for (let i = 0; i < mesh.segments; i++) {
      const len = Math.hypot(
        mesh.ends[3 * i] - mesh.starts[3 * i],
        mesh.ends[3 * i + 1] - mesh.starts[3 * i + 1],
        mesh.ends[3 * i + 2] - mesh.starts[3 * i + 2],
      );
      const scale = Math.hypot(p.endRe[i], p.endIm[i]);
      expect(Math.abs(q.re[i] * len + p.startRe[i] + p.endRe[i])).toBeLessThan(1e-12 * scale);
      expect(Math.abs(q.im[i] * len + p.startIm[i] + p.endIm[i])).toBeLessThan(1e-12 * scale);
    }
  });
});
