/**
 * The ground-node hook of solver/ground/kernel.ts: a series impedance between a z = 0 wire end and the
 * ground. At a monopole fed at its base, the feed and the ground node are the same node, so the hook's
 * impedance must add to Z_in exactly (Kirchhoff's voltage law) and its loss must be ½ Re(Z)|I|².
 */
import { describe, expect, it } from "vitest";
import type { GroundKernel } from "../../../solver/ground/kernel";
import { perfectGround } from "../../../solver/ground/perfect";
import { solveModel } from "../../../solver/index";
import type { WireModel } from "../../../solver/model/types";

const monopole: WireModel = {
  wires: [
    {
      id: "m",
      points: [
        [0, 0, 0],
        [0, 0, 5],
      ],
      radius: 1e-3,
      groundConnection: { ohms: 10 },
    },
  ],
  feed: { wire: "m", at: 0 },
  ground: { kind: "real", conductivity: 0.005, permittivity: 13 },
  frequenciesMHz: [14],
};

describe("ground-node impedance hook", () => {
  it("adds in series at a grounded feed and books its loss as ground loss", () => {
    // A stand-in "real" ground: perfect images plus the hook returning the wire's stated ohms.
    const factory = (setup: Parameters<typeof perfectGround>[0]): GroundKernel => {
      const img = perfectGround(setup);
      return {
        ...img,
        method: "image+hook",
        beginFrequency: (f) => img.beginFrequency(f),
        pairTerms: (p, q, out) => img.pairTerms(p, q, out),
        nodeImpedance(wire, out) {
          const c = setup.connections[wire];
          if (!c || typeof c !== "object" || !("ohms" in c)) return false;
          out[0] = c.ohms;
          out[1] = 0;
          return true;
        },
      };
    };
    const opt = { segmentsPerWavelength: 40, patternStepDeg: 0 };
    const hooked = solveModel(monopole, opt, { realGround: factory });
    const ideal = solveModel({ ...monopole, ground: { kind: "perfect" } }, opt);
    const zh = hooked.results[0].impedance;
    const zi = ideal.results[0].impedance;
    expect(zh[0] - zi[0]).toBeCloseTo(10, 8);
    expect(zh[1] - zi[1]).toBeCloseTo(0, 8);
    const [ir, ii] = hooked.results[0].feedCurrent;
    expect(hooked.results[0].power.groundLoss).toBeCloseTo(0.5 * 10 * (ir * ir + ii * ii), 10);
    expect(hooked.groundMethod).toBe("image+hook");
  });
});
