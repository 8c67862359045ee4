import { describe, expect, it } from "vitest";
import { awgDiameter } from "../../../solver/plan/awg";
import { compilePlan } from "../../../solver/plan/compile";
import { type PlanInput, parsePlan } from "../../../solver/plan/schema";
import { catenaryParameter } from "../../../solver/plan/yard-geometry";

// Two trees 12 m apart (x axis) at 9 m, a metal mast, a wire with ropes, sag and droops.
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
  ground: { kind: "real", preset: "average ground" },
  supports: [
    { type: "tree", id: "oak", position: [0, 0], height: 9 },
    { type: "tree", id: "ash", position: [12, 0], height: 9 },
    {
      type: "mast",
      id: "pole",
      position: [6, 8],
      height: 6,
      diameter: 0.05,
      material: "aluminium",
      base: { kind: "grounded", tie: { kind: "contact" } },
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
        { kind: "support", id: "w", support: "oak", height: 9, rope: 1, sagToNext: 0.3 },
        { kind: "support", id: "e", support: "ash", height: 9, rope: 1 },
      ],
      droops: [
        { id: "dw", end: "start", length: 1.5 },
        { id: "de", end: "end", length: 2 },
      ],
      wire: { awg: 14 },
      feed: { at: 0.5, system: { kind: "transformer", ratio: 4 } },
      loads: [{ id: "coil", at: 0.25, henries: 1e-6 }],
    },
  ],
};
const plan = (change?: (p: PlanInput) => void) => {
  const p = structuredClone(base);
  change?.(p);
  return parsePlan(p);
};

describe("compiling a plan", () => {
  const c = compilePlan(plan());
  const dip = c.model.wires.find((w) => w.id === "dip")!;

  it("puts the spans and droops where the plan says, exactly", () => {
    const pts = dip.points;
    // Droop legs hang straight down from the wire's ends; ropes take 1 m off each end of the 12 m span.
    expect(pts[0]).toEqual([1, 0, 7.5]);
    expect(pts[1]).toEqual([1, 0, 9]);
    expect(pts[pts.length - 2]).toEqual([11, 0, 9]);
    expect(pts[pts.length - 1]).toEqual([11, 0, 7]);
    // Mid-span vertex sits exactly the given sag below the chord.
    const mid = pts[1 + (pts.length - 3) / 2];
    expect(mid[0]).toBeCloseTo(6, 12);
    expect(mid[2]).toBeCloseTo(9 - 0.3, 12);
    // The sag follows a catenary y = a(cosh(x/a) − 1) through the ends (quarter-span vertex).
    const a = catenaryParameter(10, 0.3);
    const q = pts[2];
    expect(q[2]).toBeCloseTo(9 - 0.3 + a * (Math.cosh(2.5 / a) - 1), 12);
  });

  it("keeps the parts along the wire adding up to its length", () => {
    const parts = c.parts.filter((p) => p.wire === "dip");
    expect(parts.map((p) => p.elementId)).toEqual(["dw", "dip", "de"]);
    expect(parts[0].toM).toBeCloseTo(1.5, 12);
    expect(parts[2].toM - parts[2].fromM).toBeCloseTo(2, 12);
    expect(c.wireElement.dip).toEqual({ elementId: "dip", kind: "run" });
    expect(c.elementWires.dw).toEqual(["dip"]);
  });

  // ASTM B258: d = 0.005 in · 92^((36 − n)/39); AWG 14 = 0.0641 in (table, from memory).
  it("sizes the wire by AWG per ASTM B258", () => {
    expect(dip.radius).toBeCloseTo(awgDiameter(14) / 2, 15);
    expect((dip.radius * 2) / 0.0254).toBeCloseTo(0.0641, 4);
  });

  it("feeds, loads and references as the plan says", () => {
    expect(c.model.feed).toEqual({ wire: "dip", at: 0.5 });
    expect(c.model.referenceOhms).toBe(200);
    expect(c.model.loads).toEqual([{ wire: "dip", at: 0.25, henries: 1e-6 }]);
  });

  it("turns the metal mast into a grounded vertical wire of its radius and drops the wooden one", () => {
    const pole = c.model.wires.find((w) => w.id === "pole")!;
    expect(pole.points).toEqual([
      [6, 8, 0],
      [6, 8, 6],
    ]);
    expect(pole.radius).toBe(0.025);
    expect(pole.groundConnection).toBe("contact");
    expect(c.model.wires.some((w) => w.id === "wood")).toBe(false);
    expect(c.freeEnds.map((e) => e.elementId).sort()).toEqual(["de", "dw", "pole"]);
  });

  it("lifts an insulated base, drives a rod, lays a radial field with its hub joined", () => {
    const withBase = (b: object) =>
      compilePlan(
        plan((p) => {
          (p.supports![2] as { base: object }).base = b;
        }),
      ).model.wires.filter((w) => w.id.startsWith("pole"));
    expect(withBase({ kind: "insulated" })[0].points[0]).toEqual([6, 8, 0.05]);
    expect(
      withBase({ kind: "grounded", tie: { kind: "rod", length: 1.5, diameter: 0.016 } })[0].groundConnection,
    ).toEqual({
      rod: { length: 1.5, radius: 0.008 },
    });
    const radials = withBase({ kind: "grounded", tie: { kind: "radials", count: 4, length: 5 } });
    expect(radials).toHaveLength(5);
    for (const r of radials.slice(1)) {
      expect(r.points[0]).toEqual([6, 8, 0.05]); // the hub: the mast's own base point
      expect(Math.hypot(r.points[1][0] - 6, r.points[1][1] - 8)).toBeCloseTo(5, 12);
    }
  });

  it("joins a run bonded to the mast part-way along by splitting both at the junction", () => {
    const c2 = compilePlan(
      plan((p) => {
        p.wireRuns![0].anchors.splice(1, 0, {
          kind: "support",
          id: "m",
          support: "pole",
          height: 4,
          bonded: true,
        });
      }),
    );
    const ids = c2.model.wires.map((w) => w.id);
    expect(ids).toEqual(expect.arrayContaining(["dip", "dip#2", "pole", "pole#2"]));
    const end = (id: string, k: 0 | -1) => {
      const w = c2.model.wires.find((x) => x.id === id)!;
      return k === 0 ? w.points[0] : w.points[w.points.length - 1];
    };
    for (const p of [end("dip", -1), end("dip#2", 0), end("pole", -1), end("pole#2", 0)])
      expect(p).toEqual([6, 8, 4]);
    expect(c2.wireElement["dip#2"].elementId).toBe("dip");
  });

  it("names the element when the layout is impossible", () => {
    expect(() =>
      compilePlan(
        plan((p) => {
          p.wireRuns![0].droops![1].length = 9.5;
        }),
      ),
    ).toThrow(/droops\[1\] "de": length: hangs to .* touch the ground/);
    expect(() =>
      compilePlan(
        plan((p) => {
          (p.wireRuns![0].anchors[0] as { rope: number }).rope = 7;
          (p.wireRuns![0].anchors[1] as { rope: number }).rope = 6;
        }),
      ),
    ).toThrow(/anchors\[0\] "w": rope: the ropes/);
  });
});
