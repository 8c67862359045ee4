import { describe, expect, it } from "vitest";
import { groundLossWatts } from "../../../solver/ground/ground-loss";
import type { MeshView, SegmentCurrents } from "../../../solver/model/types";

const f = 14e6;
const lambda = 299792458 / f;
const ETA = 376.730313668;

/** One short segment with a uniform 1 A current: a Hertzian dipole of moment I·l. */
function element(start: [number, number, number], end: [number, number, number]) {
  const mesh: MeshView = {
    segments: 1,
    starts: Float64Array.from(start),
    ends: Float64Array.from(end),
    radii: Float64Array.from([1e-4]),
    wireOfSegment: Int32Array.from([0]),
    wireStart: Float64Array.from([0]),
    wireEnd: Float64Array.from([Math.hypot(end[0] - start[0], end[1] - start[1], end[2] - start[2])]),
  };
  const one = Float64Array.from([1]);
  const zero = Float64Array.from([0]);
  const currents: SegmentCurrents = { startRe: one, startIm: zero, endRe: one, endIm: zero };
  return { mesh, currents };
}

describe("spectral ground-loss integral", () => {
  // With a "ground" identical to air (εr = 1, σ = 0) the flux through z = 0 is the power the element
  // radiates downward: by symmetry half its free-space power P = η(π/3)(Il/λ)² (Balanis, Antenna Theory,
  // 4th ed., eq. 4-16). Evanescent waves carry no power in a lossless medium, which the sum must respect.
  it("gives half the Hertzian dipole's power when the ground is air", () => {
    const l = lambda / 200;
    const h = 0.1 * lambda;
    const half = 0.5 * ETA * (Math.PI / 3) * (l / lambda) ** 2;
    const horizontal = element([0, 0, h], [l, 0, h]);
    const vertical = element([0, 0, h], [0, 0, h + l]);
    const air = { permittivity: 1, conductivity: 0 };
    expect(groundLossWatts(horizontal.mesh, horizontal.currents, f, air) / half).toBeCloseTo(1, 3);
    expect(groundLossWatts(vertical.mesh, vertical.currents, f, air) / half).toBeCloseTo(1, 3);
  });

  // A perfect conductor takes no power; a good one takes little, in proportion to its surface resistance
  // √(ωμ₀/2σ) (Leontovich; Jackson, Classical Electrodynamics, 3rd ed., §8.1), so ×100 in σ gives ÷10.
  it("vanishes like the surface resistance as σ grows", () => {
    const e = element([0, 0, 0.1 * lambda], [lambda / 200, 0, 0.1 * lambda]);
    const a = groundLossWatts(e.mesh, e.currents, f, { permittivity: 1, conductivity: 1e3 });
    const b = groundLossWatts(e.mesh, e.currents, f, { permittivity: 1, conductivity: 1e5 });
    expect(a / b).toBeGreaterThan(9.5);
    expect(a / b).toBeLessThan(10.5);
  });

  it("refuses wires that touch the ground", () => {
    const e = element([0, 0, 0], [0, 0, 1]);
    expect(() => groundLossWatts(e.mesh, e.currents, f, { permittivity: 13, conductivity: 0.005 })).toThrow(
      /above z = 0/,
    );
  });
});
