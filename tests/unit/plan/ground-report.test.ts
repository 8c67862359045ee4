import { describe, expect, it } from "vitest";
import { rodLineImpedance } from "../../../solver/ground/connection";
import { groundMethodWords } from "../../../solver/model/types";
import { analyzePlan } from "../../../solver/plan/analyze";
import { type PlanInput, parsePlan } from "../../../solver/plan/schema";

// A plan's analysis says which near-ground method ran and how each conductor touching the ground is
// joined to it, element by element. The words are the solver's (solver/ground/real.ts, perfect.ts);
// here: that they reach PlanAnalysis for the right elements, and only for conductors that touch.

// A 20 m dipole between two trees at 9 m, three grounded metal masts (bare, on a rod, ideally tied), an
// insulated metal mast (its base gap keeps it off the ground) and a wooden one (not modelled).
const base: PlanInput = {
  version: 1,
  lot: {
    outline: [
      [-20, -20],
      [20, -20],
      [20, 20],
    ],
  },
  ituRegion: 1,
  bands: ["20 m"],
  ground: { kind: "real", preset: "average ground", method: "reflection" },
  supports: [
    { type: "tree", id: "oak", position: [0, 0], height: 9 },
    { type: "tree", id: "ash", position: [12, 0], height: 9 },
    {
      type: "mast",
      id: "bare",
      position: [6, 8],
      height: 6,
      diameter: 0.05,
      material: "aluminium",
      base: { kind: "grounded", tie: { kind: "contact" } },
    },
    {
      type: "mast",
      id: "rodded",
      position: [-6, 8],
      height: 6,
      diameter: 0.05,
      material: "aluminium",
      base: { kind: "grounded", tie: { kind: "rod", length: 2.4, diameter: 0.016 } },
    },
    {
      type: "mast",
      id: "tied",
      position: [6, -8],
      height: 6,
      diameter: 0.05,
      material: "aluminium",
      base: { kind: "grounded", tie: { kind: "ideal" } },
    },
    {
      type: "mast",
      id: "lifted",
      position: [-6, -8],
      height: 6,
      diameter: 0.05,
      material: "aluminium",
      base: { kind: "insulated" },
    },
    {
      type: "mast",
      id: "wood",
      position: [0, 8],
      height: 5,
      diameter: 0.1,
      material: "wood",
      base: { kind: "insulated" },
    },
  ],
  wireRuns: [
    {
      id: "dip",
      anchors: [
        { kind: "support", id: "w", support: "oak", height: 9, rope: 1 },
        { kind: "support", id: "e", support: "ash", height: 9, rope: 1 },
      ],
      wire: { awg: 14 },
      feed: { at: 0.5, system: { kind: "reference", ohms: 50 } },
    },
  ],
};
const plan = (change?: (p: PlanInput) => void) => {
  const p = structuredClone(base);
  change?.(p);
  return parsePlan(p);
};

// Dwight, "Calculation of resistances to ground", AIEE Trans. 55 (1936): one rod of length L, radius a
// in soil of resistivity ρ: R = ρ/(2πL)·(ln(4L/a) − 1). Average ground σ = 0.005 S/m (presets.ts).
const dwight = (1 / 0.005 / (2 * Math.PI * 2.4)) * (Math.log((4 * 2.4) / 0.008) - 1);

describe("a plan analysis reports the ground", () => {
  it("real ground: each grounded mast with the solver's words for its tie, nothing for the others", () => {
    const a = analyzePlan(plan(), { quick: true });
    expect(a.groundMethod).toBe("reflection");
    const byElement = Object.fromEntries(a.groundConnections.map((c) => [c.elementId, c]));
    expect(Object.keys(byElement).sort()).toEqual(["bare", "rodded", "tied"]);
    // The entry names the compiled wire it came from, and that wire is the element's.
    for (const c of a.groundConnections) expect(a.compiled.wireElement[c.wire].elementId).toBe(c.elementId);
    expect(byElement.bare.label).toMatch(/bare contact/);
    expect(byElement.bare.label).toMatch(/estimate/);
    expect(byElement.rodded.label).toContain(`2.4 m rod, ≈${dwight.toFixed(1)} Ω`);
    expect(byElement.rodded.label).toMatch(/estimate/);
    expect(byElement.tied.label).toMatch(/ideal connection/);
    expect(byElement.tied.label).toMatch(/perfect conductor/);
  });

  it("real ground, Sommerfeld: the method is reported as such, and the bare contact as solved with it", () => {
    const a = analyzePlan(
      plan((p) => {
        p.ground = { kind: "real", preset: "average ground", method: "sommerfeld" };
      }),
      { quick: true },
    );
    expect(a.groundMethod).toBe("sommerfeld");
    expect(groundMethodWords(a.groundMethod)).toMatch(/Sommerfeld/);
    expect(a.groundConnections.find((c) => c.elementId === "bare")?.label).toMatch(
      /bare contact.*Sommerfeld/,
    );
  });

  it("a ground-fed run is reported under the run", () => {
    const a = analyzePlan(
      plan((p) => {
        p.wireRuns.push({
          id: "vert",
          anchors: [
            { kind: "free", id: "vb", position: [14, 5, 0] },
            { kind: "free", id: "vt", position: [14, 5, 5] },
          ],
          wire: { awg: 14 },
          groundStart: { kind: "rod", length: 2.4, diameter: 0.016 },
        });
      }),
      { quick: true },
    );
    const vert = a.groundConnections.filter((c) => c.elementId === "vert");
    expect(vert).toHaveLength(1);
    expect(vert[0].wire).toBe("vert");
    expect(vert[0].label).toContain("2.4 m rod");
  });

  // A radial field has no ground node; the report says how it was modelled (compile.ts: 5 cm up by
  // default, as many wires as the tie states) rather than leaving the mast out.
  it("a mast on a radial field is reported with its radials", () => {
    const a = analyzePlan(
      plan((p) => {
        const m = p.supports?.find((s) => s.id === "bare");
        if (m?.type === "mast")
          m.base = { kind: "grounded", tie: { kind: "radials", count: 6, length: 5.2 } };
      }),
      { quick: true },
    );
    const r = a.groundConnections.filter((c) => c.elementId === "bare");
    expect(r).toHaveLength(1);
    expect(r[0].label).toMatch(/radial field: 6 × 5\.20 m wires 5 cm above the soil/);
    expect(a.compiled.wireElement[r[0].wire].kind).toBe("radial");
  });

  // The series impedance each tie puts in at the band centre, as modelled. Bare contact under
  // Sommerfeld: its hemisphere term 1/(2πa(σ + jωε₀(1 + ε_r))) (Tagg, Earth Resistances, 1964, at d.c.;
  // the air and soil displacement currents in parallel, Jackson §4.4 from memory). Rod: its line in the
  // soil (checked against the telegrapher's equations in tests/unit/ground/connection.test.ts). Ideal:
  // nothing to state.
  it("gives each tie's series impedance at the band centre; none for an ideal tie", () => {
    const a = analyzePlan(
      plan((p) => {
        p.ground = { kind: "real", preset: "average ground", method: "sommerfeld" };
      }),
      { quick: true },
    );
    const band = a.bands[0];
    const byElement = Object.fromEntries(band.groundTies.map((t) => [t.elementId, t.ohms]));
    expect(Object.keys(byElement).sort()).toEqual(["bare", "rodded"]);
    const w = 2 * Math.PI * band.centreMHz * 1e6;
    const radius = 0.05 / 2; // the bare mast's diameter above
    const g = 2 * Math.PI * radius * 0.005;
    const b = 2 * Math.PI * radius * w * 8.8541878128e-12 * 14;
    const want = [g / (g * g + b * b), -b / (g * g + b * b)];
    expect(
      Math.hypot(byElement.bare[0] - want[0], byElement.bare[1] - want[1]) / Math.hypot(...want),
    ).toBeLessThan(1e-6);
    const rod = rodLineImpedance(2.4, 0.008, { conductivity: 0.005, permittivity: 13 }, w);
    expect(byElement.rodded[0]).toBeCloseTo(rod[0], 6);
    expect(byElement.rodded[1]).toBeCloseTo(rod[1], 6);
    // At 14 MHz the 2.4 m rod is no short: tens of ohms, mostly inductive here.
    expect(Math.hypot(...byElement.rodded)).toBeGreaterThan(30);
  });

  it("perfect ground: every tie is ideal and says it is the perfect ground's", () => {
    const a = analyzePlan(
      plan((p) => {
        p.ground = { kind: "perfect" };
      }),
      { quick: true },
    );
    expect(a.groundMethod).toBe("image");
    expect(a.groundConnections.map((c) => [c.elementId, c.label]).sort()).toEqual([
      ["bare", "ideal connection (perfect ground)"],
      ["rodded", "ideal connection (perfect ground)"],
      ["tied", "ideal connection (perfect ground)"],
    ]);
  });

  it("keeps the plan's ground as the plan states it, for the panel to show beside them", () => {
    // The app's Results panel reads the ground from the analysis (the plan it was computed for), not
    // from the plan being edited: a preset by name, explicit σ and εr as numbers.
    expect(analyzePlan(plan(), { quick: true }).compiled.model.ground).toMatchObject({
      kind: "real",
      preset: "average ground",
    });
    const stated = analyzePlan(
      plan((p) => {
        p.ground = { kind: "real", conductivity: 0.01, permittivity: 30, method: "reflection" };
      }),
      { quick: true },
    ).compiled.model.ground;
    expect(stated).toEqual({ kind: "real", conductivity: 0.01, permittivity: 30, method: "reflection" });
  });
});
