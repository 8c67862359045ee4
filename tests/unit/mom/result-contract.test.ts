/**
 * The SolveResult contract of solver/model/types.ts, filled consistently: sizes agree with the mesh,
 * results follow the model's frequency order, the feed values reproduce 1 W and Z = V/I, and SWR
 * follows from Z and the reference impedance (SWR = (1 + |Γ|)/(1 − |Γ|), Γ = (Z − Z0)/(Z + Z0)).
 */
import { describe, expect, it } from "vitest";
import { solveModel } from "../../../solver/index";
import type { WireModel } from "../../../solver/model/types";

const model: WireModel = {
  wires: [
    {
      id: "d",
      points: [
        [-10, 0, 10],
        [10, 0, 10],
      ],
      radius: 1e-3,
      material: "copper",
    },
  ],
  feed: { wire: "d", at: 0.5 },
  ground: { kind: "perfect" },
  frequenciesMHz: [7.3, 7.0, 7.15],
  referenceOhms: 75,
};

describe("SolveResult", () => {
  it("is filled consistently", () => {
    const r = solveModel(model, { patternStepDeg: 5 });
    expect(r.groundMethod).toBe("image");
    expect(r.mesh.segments).toBe(r.segments);
    expect(r.mesh.starts.length).toBe(3 * r.segments);
    expect(r.unknowns).toBe(r.segments - 1);
    expect(r.results.map((x) => x.mhz)).toEqual([7.3, 7.0, 7.15]);
    for (const x of r.results) {
      expect(x.segmentCurrents.startRe.length).toBe(r.segments);
      const [vr, vi] = x.feedVoltage;
      const [ir, ii] = x.feedCurrent;
      expect(0.5 * (vr * ir + vi * ii)).toBeCloseTo(1, 10); // ½ Re(V I*) = 1 W
      const d = ir * ir + ii * ii;
      expect((vr * ir + vi * ii) / d).toBeCloseTo(x.impedance[0], 8);
      expect((vi * ir - vr * ii) / d).toBeCloseTo(x.impedance[1], 8);
      const g =
        Math.hypot(x.impedance[0] - 75, x.impedance[1]) / Math.hypot(x.impedance[0] + 75, x.impedance[1]);
      expect(x.swr).toBeCloseTo((1 + g) / (1 - g), 8);
      expect(x.currents[0].peakAmps).toBeGreaterThanOrEqual(Math.hypot(ir, ii) - 1e-12);
      expect(x.power.accepted).toBe(1);
      expect(x.power.wireLoss).toBeGreaterThan(0);
      expect(Number.isFinite(x.peakGainDbi)).toBe(true);
      expect(x.efficiency).toBeCloseTo(x.power.radiated, 12);
    }
    // A 20 m dipole resonates near 7 MHz: one series resonance within the sweep or none, never NaN.
    for (const f of r.resonancesMHz) expect(f).toBeGreaterThan(7.0);
  });

  it("skips the far field when patternStepDeg is 0 and books radiated power by the balance", () => {
    const x = solveModel(model, { patternStepDeg: 0 }).results[0];
    expect(Number.isNaN(x.peakGainDbi)).toBe(true);
    expect(x.power.radiated).toBeCloseTo(1 - x.power.wireLoss - x.power.loadLoss - x.power.groundLoss, 12);
  });
});
