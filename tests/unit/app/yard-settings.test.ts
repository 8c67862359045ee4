import { describe, expect, it } from "vitest";
import { formatConstant } from "../../../app/panels/YardSettings";
import {
  groundChoice,
  setBands,
  setGround,
  setGroundMethod,
  setItuRegion,
  toggleBand,
} from "../../../app/plan/commands";
import { findElement } from "../../../app/plan/elements";
import { defaultRadials, fieldsFor } from "../../../app/plan/fields";
import { createAppStore } from "../../../app/store/store";
import { GROUND_PRESETS } from "../../../solver/ground/presets";
import { type Plan, parsePlan } from "../../../solver/plan/schema";
import { fixturePlan } from "./fixture";

/** The plan-level settings commands (soil, method, bands, ITU region): plan in, plan out. */

const withGround = (ground: Plan["ground"]): Plan => ({ ...fixturePlan(), ground });
/** Every result must still be a plan the solver's own parser accepts. */
const valid = (plan: Plan) => expect(() => parsePlan(JSON.parse(JSON.stringify(plan)))).not.toThrow();

describe("reading the plan's ground as a choice", () => {
  it("reads perfect ground, a preset, a preset with overrides, and explicit values", () => {
    expect(groundChoice({ kind: "perfect" })).toEqual({ kind: "perfect" });
    // The values are the preset table's (solver/ground/presets.ts: P.527 classes, and "average ground"
    // as common practice, no published source), looked up as the solver looks them up.
    const avg = GROUND_PRESETS["average ground"];
    expect(groundChoice({ kind: "real", preset: "average ground" })).toEqual({
      kind: "preset",
      preset: "average ground",
      conductivity: avg.conductivity,
      permittivity: avg.permittivity,
      method: "auto",
    });
    // The solver's name matching: case, "-" and "_" do not matter.
    expect(groundChoice({ kind: "real", preset: "Very_Dry-Ground" })).toMatchObject({
      kind: "preset",
      preset: "very dry ground",
    });
    // An explicit value overrides the preset: that is a custom soil, with the values in force.
    expect(
      groundChoice({ kind: "real", preset: "wet ground", permittivity: 20, method: "reflection" }),
    ).toEqual({
      kind: "custom",
      conductivity: GROUND_PRESETS["wet ground"].conductivity,
      permittivity: 20,
      method: "reflection",
    });
    expect(groundChoice({ kind: "real", conductivity: 0.02, permittivity: 10 })).toMatchObject({
      kind: "custom",
      conductivity: 0.02,
      permittivity: 10,
    });
  });

  it("reads a ground the solver would refuse (unknown preset) as null", () => {
    expect(groundChoice({ kind: "real", preset: "moon dust" })).toBeNull();
    expect(groundChoice({ kind: "real" })).toBeNull();
  });
});

describe("setGround", () => {
  it("sets every named soil and perfect ground, each a valid plan", () => {
    let plan = fixturePlan();
    for (const name of Object.keys(GROUND_PRESETS)) {
      const r = setGround(plan, { kind: "preset", preset: name });
      expect(r.refused).toBeUndefined();
      expect(r.plan.ground).toEqual({ kind: "real", preset: name });
      valid(r.plan);
      plan = r.plan;
    }
    const perfect = setGround(plan, { kind: "perfect" });
    expect(perfect.plan.ground).toEqual({ kind: "perfect" });
    valid(perfect.plan);
  });

  it("sets custom σ and εr, keeps the plan's method, and leaves the input plan alone", () => {
    const before = withGround({ kind: "real", preset: "average ground", method: "sommerfeld" });
    const snapshot = JSON.stringify(before);
    const r = setGround(before, { kind: "custom", conductivity: 0.03, permittivity: 20 });
    expect(r.plan.ground).toEqual({
      kind: "real",
      conductivity: 0.03,
      permittivity: 20,
      method: "sommerfeld",
    });
    valid(r.plan);
    expect(JSON.stringify(before)).toBe(snapshot);
    // Over perfect ground there was no method to keep.
    const fromPerfect = setGround(fixturePlan(), { kind: "preset", preset: "wet ground" });
    expect(fromPerfect.plan.ground).toEqual({ kind: "real", preset: "wet ground" });
  });

  it("refuses what the solver would refuse, with a reason, and returns the same plan", () => {
    const plan = withGround({ kind: "real", preset: "average ground" });
    const bad = [
      { kind: "custom", conductivity: 0, permittivity: 10 },
      { kind: "custom", conductivity: -1, permittivity: 10 },
      { kind: "custom", conductivity: Number.NaN, permittivity: 10 },
      { kind: "custom", conductivity: 0.01, permittivity: 0.5 },
      { kind: "custom", conductivity: 0.01, permittivity: Number.POSITIVE_INFINITY },
      { kind: "preset", preset: "moon dust" },
    ] as const;
    for (const soil of bad) {
      const r = setGround(plan, soil);
      expect(r.refused, JSON.stringify(soil)).toMatch(/\w/);
      expect(r.plan).toBe(plan);
    }
  });

  it("returns the very same plan when nothing changes (so the store records nothing)", () => {
    const plan = withGround({ kind: "real", preset: "wet ground" });
    expect(setGround(plan, { kind: "preset", preset: "wet ground" }).plan).toBe(plan);
    const perfect = fixturePlan();
    expect(setGround(perfect, { kind: "perfect" }).plan).toBe(perfect);
  });
});

describe("setGroundMethod", () => {
  it("stores reflection or Sommerfeld, and auto as no method at all", () => {
    const plan = withGround({ kind: "real", preset: "average ground" });
    const refl = setGroundMethod(plan, "reflection");
    expect(refl.ground).toEqual({ kind: "real", preset: "average ground", method: "reflection" });
    valid(refl);
    const back = setGroundMethod(refl, "auto");
    expect(back.ground).toEqual({ kind: "real", preset: "average ground" });
    expect(setGroundMethod(plan, "auto")).toBe(plan);
  });

  it("does nothing over perfect ground", () => {
    const plan = fixturePlan();
    expect(setGroundMethod(plan, "sommerfeld")).toBe(plan);
  });
});

describe("bands and ITU region", () => {
  it("keeps the bands in table order without repeats", () => {
    const r = setBands(fixturePlan(), ["10 m", "40 m", "20 m", "40 m"]);
    expect(r.plan.bands).toEqual(["40 m", "20 m", "10 m"]);
    valid(r.plan);
  });

  it("toggles one band, and refuses to turn off the last one", () => {
    const plan = fixturePlan(); // 20 m only
    const two = toggleBand(plan, "80 m", true);
    expect(two.plan.bands).toEqual(["80 m", "20 m"]);
    expect(toggleBand(two.plan, "20 m", false).plan.bands).toEqual(["80 m"]);
    const last = toggleBand(plan, "20 m", false);
    expect(last.refused).toMatch(/at least one band/);
    expect(last.plan).toBe(plan);
    expect(setBands(plan, []).refused).toMatch(/at least one band/);
    expect(toggleBand(plan, "20 m", true).plan).toBe(plan);
  });

  it("sets the ITU region", () => {
    const plan = fixturePlan();
    const r2 = setItuRegion(plan, 2);
    expect(r2.ituRegion).toBe(2);
    valid(r2);
    expect(setItuRegion(r2, 2)).toBe(r2);
  });
});

describe("through the store", () => {
  it("each settings change is one undo step; undo and redo walk them", () => {
    const store = createAppStore(withGround({ kind: "real", preset: "average ground" }));
    const apply = (f: (p: Plan) => Plan) => store.getState().applyEdit(f, "immediately");
    apply((p) => setGround(p, { kind: "preset", preset: "very dry ground" }).plan);
    apply((p) => setGroundMethod(p, "reflection"));
    apply((p) => toggleBand(p, "40 m", true).plan);
    apply((p) => setItuRegion(p, 3));
    // A refused edit returns the same plan: nothing is recorded.
    apply((p) => setGround(p, { kind: "custom", conductivity: -1, permittivity: 4 }).plan);
    expect(store.getState().history.past).toHaveLength(4);
    const s = () => store.getState();
    expect(s().plan.ground).toEqual({ kind: "real", preset: "very dry ground", method: "reflection" });
    s().undo();
    s().undo();
    expect(s().plan.bands).toEqual(["20 m"]);
    expect(s().plan.ituRegion).toBe(1);
    s().undo();
    s().undo();
    expect(s().plan.ground).toEqual({ kind: "real", preset: "average ground" });
    s().redo();
    expect(s().plan.ground).toEqual({ kind: "real", preset: "very dry ground" });
  });
});

describe("formatConstant (σ and εr as shown)", () => {
  it("writes the preset values without exponents or trailing zeros", () => {
    expect(formatConstant(1e-4)).toBe("0.0001");
    expect(formatConstant(5e-3)).toBe("0.005");
    expect(formatConstant(5)).toBe("5");
    expect(formatConstant(13)).toBe("13");
    expect(formatConstant(0.1 + 0.2)).toBe("0.3");
  });
});

describe("a mast grounded through a radial field (the inspector's Base select)", () => {
  const base = (plan: Plan, value: string) => {
    const ref = findElement(plan, "pole");
    if (!ref) throw new Error("no pole in the fixture");
    const def = fieldsFor(ref).find((f) => f.key === "base");
    if (!def) throw new Error("no base field");
    return def.set(plan, ref, value);
  };

  it("gives 8 radials a quarter wave long at the lowest band's lower edge", () => {
    // λ/4 = c / 4f with c = 299.792458 m·MHz; 20 m starts at 14.000 MHz (ITU RR Art. 5): 5.353 m.
    expect(defaultRadials(fixturePlan())).toEqual({ kind: "radials", count: 8, length: 5.35 });
    // 160 m in region 1 starts at 1.810 MHz (ITU RR Art. 5, from memory): 41.41 m.
    const low = setBands(fixturePlan(), ["160 m", "20 m"]).plan;
    expect(defaultRadials(low).length).toBeCloseTo(41.41, 2);
  });

  it("sets a schema-valid radial base, and choosing it again keeps a field the user sized", () => {
    const plan = withGround({ kind: "real", preset: "average ground" });
    const next = base(plan, "grounded:radials");
    const pole = next.supports.find((s) => s.id === "pole");
    expect(pole).toMatchObject({ base: { kind: "grounded", tie: { kind: "radials", count: 8 } } });
    valid(next);
    const sized = {
      ...next,
      supports: next.supports.map((s) =>
        s.id === "pole" && s.type === "mast"
          ? {
              ...s,
              base: { kind: "grounded" as const, tie: { kind: "radials" as const, count: 16, length: 3 } },
            }
          : s,
      ),
    };
    expect(base(sized, "grounded:radials")).toBe(sized);
    expect(base(sized, "grounded:contact").supports.find((s) => s.id === "pole")).toMatchObject({
      base: { tie: { kind: "contact" } },
    });
  });
});
