import { describe, expect, it } from "vitest";
import { solveResultJson, solveResultText } from "../../../solver/cli-format";
import { prepareInternal, solveModel } from "../../../solver/index";
import { groundMethodWords, type WireModel } from "../../../solver/model/types";

// What a result says about the ground: the near-ground method that ran and, per wire joined to the
// ground at z = 0, how that joint was modelled. The words are the ground kernel's own
// (solver/ground/real.ts, perfect.ts); these checks are about them reaching every result, in model
// order, for exactly the grounded wires.

type Wire = WireModel["wires"][number];
const mast = (id: string, x: number, groundConnection?: Wire["groundConnection"], z0 = 0): Wire => ({
  id,
  points: [
    [x, 0, z0],
    [x, 0, 5],
  ],
  radius: 0.01,
  segments: 3,
  ...(groundConnection !== undefined ? { groundConnection } : {}),
});

// Four 5 m masts 3 m apart at 7.1 MHz: one ideal, one on a rod, one on bare soil (the default), one
// lifted 0.5 m (its connection has no z = 0 end to apply to). The ideal one is fed.
const masts = (ground: WireModel["ground"]): WireModel => ({
  wires: [
    mast("ideal", 0, "ideal"),
    mast("rod", 3, { rod: { length: 2.4, radius: 0.008 } }),
    mast("bare", 6),
    mast("lifted", 9, "ideal", 0.5),
  ],
  feed: { wire: "ideal", at: 0.1 },
  ground,
  frequenciesMHz: [7.1],
});

const NO_PATTERN = { patternStepDeg: 0 };

// Dwight, "Calculation of resistances to ground", AIEE Trans. 55 (1936): one rod of length L, radius a
// in soil of resistivity ρ: R = ρ/(2πL)·(ln(4L/a) − 1). Average ground σ = 0.005 S/m (presets.ts).
const dwight = (1 / 0.005 / (2 * Math.PI * 2.4)) * (Math.log((4 * 2.4) / 0.008) - 1);

describe("ground connections in solver results", () => {
  it("real ground, Sommerfeld: ideal, rod and bare contact each say how they were modelled", () => {
    const r = solveModel(masts({ kind: "real", preset: "average ground", method: "sommerfeld" }), NO_PATTERN);
    expect(r.groundMethod).toBe("sommerfeld");
    expect(r.groundConnections.map((c) => c.wire)).toEqual(["ideal", "rod", "bare"]);
    const [ideal, rod, bare] = r.groundConnections.map((c) => c.label);
    // An ideal tie must say it is an idealisation; a rod that its figure is an estimate (the wording is
    // the ground's, solver/ground/connection.ts, and changes with its model: only the warning word is checked).
    expect(ideal).toMatch(/ideal/);
    expect(ideal).toMatch(/perfect conductor/);
    expect(rod).toContain("2.4 m rod");
    expect(rod).toContain(`≈${dwight.toFixed(1)} Ω`);
    expect(rod).toMatch(/estimate/);
    // Under Sommerfeld the bare end is solved rigorously, and says so.
    expect(bare).toMatch(/bare contact/);
    expect(bare).toMatch(/Sommerfeld/);
  });

  it("are the kernel's own labels, by model wire index", () => {
    const model = masts({ kind: "real", preset: "average ground", method: "reflection" });
    const { prepared, internals } = prepareInternal(model, NO_PATTERN);
    expect(prepared.groundConnections).toEqual(
      [0, 1, 2].map((i) => ({ wire: model.wires[i].id, label: internals.ground.connectionLabel?.(i) })),
    );
    // The reflection method has no rigorous contact: the bare end is a lumped hemisphere estimate.
    expect(prepared.groundConnections[2].label).toMatch(/bare contact.*estimate/);
  });

  it("perfect ground: every grounded end is an ideal connection, and says why", () => {
    const r = solveModel(masts({ kind: "perfect" }), NO_PATTERN);
    expect(r.groundMethod).toBe("image");
    expect(r.groundConnections).toEqual(
      ["ideal", "rod", "bare"].map((wire) => ({ wire, label: "ideal connection (perfect ground)" })),
    );
  });

  it("free space: no ground, no connections", () => {
    const free = masts({ kind: "free" });
    const r = solveModel(free, NO_PATTERN);
    expect(r.groundMethod).toBe("none");
    expect(r.groundConnections).toEqual([]);
  });

  it("a wire with both ends on the ground is listed once", () => {
    const arch: WireModel = {
      wires: [
        {
          id: "arch",
          points: [
            [0, 0, 0],
            [0, 0, 4],
            [6, 0, 4],
            [6, 0, 0],
          ],
          radius: 0.002,
        },
      ],
      feed: { wire: "arch", at: 0.02 },
      ground: { kind: "perfect" },
      frequenciesMHz: [14.1],
    };
    expect(solveModel(arch, NO_PATTERN).groundConnections).toEqual([
      { wire: "arch", label: "ideal connection (perfect ground)" },
    ]);
  });
});

describe("the CLI's report of the ground", () => {
  const r = solveModel(masts({ kind: "real", preset: "average ground", method: "reflection" }), NO_PATTERN);

  it("text: the method in words, then one line per grounded wire with its label", () => {
    const lines = solveResultText(r).split("\n");
    const at = lines.findIndex((l) => l.startsWith("ground: "));
    expect(lines[at]).toContain(groundMethodWords("reflection"));
    expect(lines[at]).toContain('"reflection"');
    expect(lines.slice(at + 1, at + 4)).toEqual(
      r.groundConnections.map((c) => `  wire "${c.wire}" to ground: ${c.label}`),
    );
    expect(lines[at + 4]).toBe("");
    expect(solveResultText(r)).not.toContain('wire "lifted" to ground');
  });

  it("--json carries groundConnections", () => {
    const json = JSON.parse(JSON.stringify(solveResultJson(r)));
    expect(json.groundConnections).toEqual(r.groundConnections);
    expect(json.groundConnections).toHaveLength(3);
  });

  it("free space prints the method and no connection lines", () => {
    const free = solveModel(masts({ kind: "free" }), NO_PATTERN);
    const text = solveResultText(free);
    expect(text).toContain(`ground: ${groundMethodWords("none")}`);
    expect(text).not.toContain("to ground:");
  });

  it("every method the solver names has words of its own", () => {
    for (const m of ["none", "image", "reflection", "sommerfeld"]) expect(groundMethodWords(m)).not.toBe(m);
  });
});
