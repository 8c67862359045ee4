import { describe, expect, it } from "vitest";
import { solveModel } from "../../../solver/index";
import { ModelError } from "../../../solver/model/errors";
import type { WireModel } from "../../../solver/model/types";

// A ground-mounted quarter-wave vertical at 7.1 MHz, fed at its base (λ/4 ≈ 10.56 m).
const vertical = (
  ground: WireModel["ground"],
  groundConnection?: WireModel["wires"][0]["groundConnection"],
) =>
  solveModel(
    {
      wires: [
        {
          id: "vertical",
          points: [
            [0, 0, 0],
            [0, 0, 10.2],
          ],
          radius: 0.01,
          groundConnection,
        },
      ],
      feed: { wire: "vertical", at: 0 },
      ground,
      frequenciesMHz: [7.1],
    },
    { patternStepDeg: 5 },
  );

describe("ground-system warnings", () => {
  it("say how much a vertical on a bare contact loses in average soil, from the solved budget", () => {
    const r = vertical({ kind: "real", preset: "average ground" });
    const w = r.warnings.find((x) => x.code === "poor-ground-system");
    expect(w?.wire).toBe("vertical");
    const p = r.results[0].power;
    // The percentage in the message is the solver's own ground-loss share.
    expect(w?.message).toContain(`${((100 * p.groundLoss) / p.accepted).toFixed(0)} %`);
    // A bare end of a 1 cm conductor in 0.005 S/m soil: a few kΩ of spreading resistance, so almost all is
    // lost (common practice, no published source: "a vertical needs radials").
    expect(p.groundLoss / p.accepted).toBeGreaterThan(0.9);
  });

  it("stay quiet over perfect ground, and label an ideal connection as an idealisation", () => {
    expect(vertical({ kind: "perfect" }).warnings.map((w) => w.code)).not.toContain("poor-ground-system");
    const ideal = vertical({ kind: "real", preset: "average ground" }, "ideal");
    expect(ideal.warnings.map((w) => w.code)).toContain("ground-connection-idealised");
  });

  it("refuse a buried wire, saying what to do instead", () => {
    const buried = () =>
      solveModel({
        wires: [
          {
            id: "rod",
            points: [
              [0, 0, 0.5],
              [0, 0, -2],
            ],
            radius: 0.008,
          },
        ],
        feed: { wire: "rod", at: 0.5 },
        ground: { kind: "real", preset: "average ground" },
        frequenciesMHz: [7.1],
      });
    expect(buried).toThrow(ModelError);
    expect(buried).toThrow(/^wires\[0\]\.points\[1\]: point is below the ground.*"rod"/);
  });
});
