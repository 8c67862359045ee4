/**
 * Band interpolation of Z (Newman, IEEE Trans. AP-36, 1988): the quadratic fit of f·Z·e^{jkR} through
 * three fills must reproduce full fills across a band. Property check against the direct solution;
 * measured error ≈ 1e-5 relative over a 12 % band, tolerance 1e-4.
 */
import { describe, expect, it } from "vitest";
import { prepareModel } from "../../../solver/index";
import type { WireModel } from "../../../solver/model/types";
import { bandGroups } from "../../../solver/mom/prepare";

const model = (ground: WireModel["ground"]): WireModel => ({
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
    {
      id: "mast",
      points: [
        [0, 2, 0],
        [0, 2, 12],
      ],
      radius: 0.02,
    },
  ],
  feed: { wire: "v", at: 0.5 },
  ground,
  frequenciesMHz: { from: 6.5, to: 7.28, count: 9 },
});

describe("band interpolation", () => {
  for (const ground of [{ kind: "free" }, { kind: "perfect" }] as const) {
    it(`matches full fills across a 12 % band (${ground.kind})`, () => {
      const p = prepareModel(model(ground), { segmentsPerWavelength: 30, patternStepDeg: 0 });
      const hz = p.frequenciesMHz.map((m) => m * 1e6);
      const fast = p.solveSweep(hz);
      const full = p.solveSweep(hz, { interpolate: false });
      fast.forEach((r, i) => {
        const d = full[i].impedance;
        const err = Math.hypot(r.impedance[0] - d[0], r.impedance[1] - d[1]) / Math.hypot(d[0], d[1]);
        expect(err, `${r.mhz} MHz: ${r.impedance} vs ${d}`).toBeLessThan(1e-4);
      });
    });
  }

  it("groups frequencies into bands no wider than the ratio", () => {
    expect(bandGroups([7.2, 3.6, 3.5, 7.0, 14.1], 0.12)).toEqual([[2, 1], [3, 0], [4]]);
  });
});
