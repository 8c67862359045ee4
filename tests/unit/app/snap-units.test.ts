import { describe, expect, it } from "vitest";
import {
  formatStep,
  formatSwr,
  METRES_PER_FOOT,
  SNAP_STEPS,
  snapChoices,
  snapStepAfterUnitSwitch,
} from "../../../app/units";

describe("snap menu in the user's unit", () => {
  // International yard and pound agreement (1959): 1 ft = 0.3048 m exactly.
  it("offers round steps in feet, stored in metres", () => {
    expect(METRES_PER_FOOT).toBe(0.3048);
    expect(SNAP_STEPS.ft.map((m) => formatStep(m, "ft"))).toEqual(["0.5 ft", "1 ft", "5 ft"]);
    expect(SNAP_STEPS.ft[1]).toBeCloseTo(0.3048, 12);
    expect(SNAP_STEPS.m.map((m) => formatStep(m, "m"))).toEqual(["0.1 m", "0.5 m", "1 m"]);
  });

  it("keeps a step from the other unit selectable, shown in this unit", () => {
    // 0.5 m = 1.64042 ft (0.5 / 0.3048): not a round step in feet, so it is added to the list.
    const choices = snapChoices("ft", 0.5);
    expect(choices).toContain(0.5);
    expect(choices).toHaveLength(4);
    expect(formatStep(0.5, "ft")).toBe("1.64 ft");
    expect(snapChoices("ft", SNAP_STEPS.ft[0])).toHaveLength(3);
  });

  it("moves to the step in the same place on the list when the unit changes", () => {
    expect(snapStepAfterUnitSwitch(0.5, "m", "ft")).toBe(SNAP_STEPS.ft[1]);
    expect(snapStepAfterUnitSwitch(SNAP_STEPS.ft[2], "ft", "m")).toBe(1);
    expect(snapStepAfterUnitSwitch(null, "m", "ft")).toBeNull();
    expect(snapStepAfterUnitSwitch(0.25, "m", "ft")).toBe(0.25);
  });
});

describe("SWR figures", () => {
  it("keep two decimals near a match and drop them once the match is hopeless", () => {
    expect(formatSwr(1.349)).toBe("1.35");
    expect(formatSwr(12.34)).toBe("12.3");
    expect(formatSwr(1333.28)).toBe("1333");
    expect(formatSwr(Number.POSITIVE_INFINITY)).toBe("∞");
  });
});
