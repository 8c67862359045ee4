/**
 * Power balance (Poynting's theorem): a lossless structure radiates exactly what it accepts. The
 * radiated power comes from integrating the far field (solver/fields) over the sphere (free space) or
 * the upper half space (perfect ground); the accepted power from the feed, ½ Re(V I*).
 */
import { describe, expect, it } from "vitest";
import { solveModel } from "../../../solver/index";
import type { WireModel } from "../../../solver/model/types";
import { dipole } from "./helpers";

const F = 7.1;

function balance(m: WireModel, spw = 30) {
  const r = solveModel(m, { segmentsPerWavelength: spw }).results[0];
  return { r, err: Math.abs(r.power.radiated / r.power.accepted - 1) };
}

describe("power balance", () => {
  it("straight dipole in free space", () => {
    const { r, err } = balance(dipole(20, 1e-3, F));
    expect(err).toBeLessThan(0.005);
    // Half-wave dipole directivity 1.64 = 2.15 dBi (Balanis, Antenna Theory, 4th ed., §4.6).
    expect(r.directivityDbi).toBeGreaterThan(2.0);
    expect(r.directivityDbi).toBeLessThan(2.3);
  });

  it("bent dipole (an L) in free space", () => {
    const m = dipole(20, 1e-3, F);
    m.wires[0].points = [
      [0, 0, 0],
      [10, 0, 0],
      [10, 10, 0],
    ];
    expect(balance(m).err).toBeLessThan(0.005);
  });

  it("drooped dipole (inverted V) over perfect ground, solved and converged", () => {
    const m: WireModel = {
      wires: [
        {
          id: "v",
          points: [
            [-9, 0, 6],
            [0, 0, 12],
            [9, 0, 6],
          ],
          radius: 1e-3,
        },
      ],
      feed: { wire: "v", at: 0.5 },
      ground: { kind: "perfect" },
      frequenciesMHz: [F],
    };
    // Convergence: measured |ΔZ|/|Z| ≈ 1.1 % from 40 to 80 segments per λ (mostly X, which creeps up
    // slowly as segments shrink: the delta-gap's local capacitance), 0.5 % from 80 to 120.
    const a = balance(m, 40);
    const b = balance(m, 80);
    expect(b.err).toBeLessThan(0.005);
    const za = a.r.impedance;
    const zb = b.r.impedance;
    expect(Math.hypot(za[0] - zb[0], za[1] - zb[1]) / Math.hypot(zb[0], zb[1])).toBeLessThan(0.015);
  });
});
