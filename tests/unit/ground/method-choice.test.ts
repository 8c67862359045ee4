import { describe, expect, it } from "vitest";
import { chooseMethod, complexPermittivityMagnitude, SOMMERFELD_MAX_EPS } from "../../../solver/ground/real";
import { solveModel } from "../../../solver/index";
import { ModelError } from "../../../solver/model/errors";
import { makeSegmentSet, mirrorSegmentSet } from "../../../solver/mom/segments";

const setupAt = (z: number, mhz: number) => {
  const segments = makeSegmentSet(
    Float64Array.from([0, 0, z]),
    Float64Array.from([5, 0, z]),
    Float64Array.from([1e-3]),
  );
  return {
    segments,
    mirrored: mirrorSegmentSet(segments),
    wireOfSegment: new Int32Array(1),
    connections: [undefined],
    lowestFrequencyHz: mhz * 1e6,
  };
};
const AVG = { permittivity: 13, conductivity: 0.005 };

describe("real-ground method choice", () => {
  // Issue rule: rigorous within about 0.1 λ of the ground (λ at the lowest frequency), reflection above.
  it('"auto" is Sommerfeld below 0.1 λ and reflection above', () => {
    expect(chooseMethod("auto", setupAt(1.5, 14), AVG)).toBe("sommerfeld"); // λ/10 = 2.14 m
    expect(chooseMethod("auto", setupAt(3, 14), AVG)).toBe("reflection");
    expect(chooseMethod("reflection", setupAt(0.5, 14), AVG)).toBe("reflection");
  });

  // Sea water (ITU-R P.527: σ = 5 S/m, εr = 70) at 3.6 MHz: |ε_c| = σ/(ωε₀) ≈ 2.5e4, beyond the
  // tabulation's range; "auto" takes the reflection method, an explicit "sommerfeld" is refused by name.
  it("keeps Sommerfeld to |ε_c| within its range and says so", () => {
    const sea = { permittivity: 70, conductivity: 5 };
    expect(complexPermittivityMagnitude(sea, 3.6e6)).toBeGreaterThan(SOMMERFELD_MAX_EPS);
    expect(chooseMethod("auto", setupAt(1, 3.6), sea)).toBe("reflection");
    let err: unknown;
    try {
      solveModel(
        {
          wires: [
            {
              id: "d",
              points: [
                [-20, 0, 3],
                [20, 0, 3],
              ],
              radius: 1e-3,
              segments: 11,
            },
          ],
          feed: { wire: "d", at: 0.5 },
          ground: { kind: "real", preset: "sea water", method: "sommerfeld" },
          frequenciesMHz: [3.6],
        },
        { patternStepDeg: 0 },
      );
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(ModelError);
    expect((err as ModelError).path).toBe("ground.method");
  });

  // P.527 sea water (σ 5 S/m, εr 70): |ε_c| ≈ 2.5e4 at 3.6 MHz, beyond the tables; 6.3e3 at 14.2 MHz,
  // within them. A ground-mounted vertical: "auto" must say when it falls back, and only then.
  it("says so when auto falls back to reflection for too good a conductor", () => {
    const vertical = (mhz: number) =>
      solveModel(
        {
          wires: [
            {
              id: "v",
              points: [
                [0, 0, 0],
                [0, 0, 75 / mhz],
              ],
              radius: 0.0125,
              segments: 11,
            },
          ],
          feed: { wire: "v", at: 0 },
          ground: { kind: "real", preset: "sea water" },
          frequenciesMHz: [mhz],
        },
        { patternStepDeg: 0 },
      );
    const low = vertical(3.6);
    expect(low.groundMethod).toBe("reflection");
    const w = low.warnings.find((x) => x.code === "ground-method-fallback");
    expect(w?.path).toBe("ground.method");
    expect(w?.message).toMatch(/reflection method ran/);
    const high = vertical(14.2);
    expect(high.groundMethod).toBe("sommerfeld");
    expect(high.warnings.some((x) => x.code === "ground-method-fallback")).toBe(false);
  });
});
