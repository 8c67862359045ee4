import { describe, expect, it } from "vitest";
import { GROUND_PRESETS, resolveRealGround } from "../../../solver/ground/presets";
import { ModelError } from "../../../solver/model/errors";

describe("ground presets and resolver", () => {
  // ITU-R P.527-3 (1992) Figs. 1–2 at HF, from memory: wet ground σ = 1e-2 S/m, εr = 30.
  it("resolves a preset by name, forgiving case and separators", () => {
    const g = resolveRealGround({ kind: "real", preset: "Wet_Ground" });
    expect(g).toMatchObject({ conductivity: 1e-2, permittivity: 30, preset: "wet ground", method: "auto" });
  });

  // "Average ground" σ = 0.005 S/m, εr = 13: common practice, no published source.
  it("knows average ground", () => {
    expect(GROUND_PRESETS["average ground"]).toMatchObject({ conductivity: 0.005, permittivity: 13 });
  });

  it("lets explicit values override a preset, and takes explicit values alone", () => {
    expect(resolveRealGround({ kind: "real", preset: "sea water", permittivity: 81 })).toMatchObject({
      conductivity: 5,
      permittivity: 81,
    });
    expect(
      resolveRealGround({ kind: "real", conductivity: 0.002, permittivity: 10, method: "reflection" }),
    ).toMatchObject({ conductivity: 0.002, permittivity: 10, method: "reflection" });
  });

  const fails = (input: Parameters<typeof resolveRealGround>[0], path: string) => {
    try {
      resolveRealGround(input);
    } catch (e) {
      expect(e).toBeInstanceOf(ModelError);
      expect((e as ModelError).path).toBe(path);
      return;
    }
    throw new Error(`expected a ModelError at ${path}`);
  };

  it("names the field for bad input", () => {
    fails({ kind: "real", preset: "moon dust" }, "ground.preset");
    fails({ kind: "real", permittivity: 13 }, "ground.conductivity");
    fails({ kind: "real", conductivity: 0.005 }, "ground.permittivity");
    fails({ kind: "real", conductivity: -1, permittivity: 13 }, "ground.conductivity");
    fails({ kind: "real", conductivity: 0.005, permittivity: 0.5 }, "ground.permittivity");
    fails({ kind: "real", conductivity: Number.NaN, permittivity: 13 }, "ground.conductivity");
  });
});
