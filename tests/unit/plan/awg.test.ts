import { describe, expect, it } from "vitest";
import { awgDiameter } from "../../../solver/plan/awg";

describe("AWG diameters", () => {
  // ASTM B258 table of nominal diameters (values from memory), inches, rounded to 4 decimals.
  it.each([
    [10, 0.1019],
    [12, 0.0808],
    [14, 0.0641],
    [36, 0.005],
    [-3, 0.46],
  ])("AWG %i is %f in", (awg, inches) => {
    expect(awgDiameter(awg) / 0.0254).toBeCloseTo(inches, 4);
  });
  it("rejects gauges off the scale", () => {
    expect(() => awgDiameter(41)).toThrow(/outside/);
  });
});
