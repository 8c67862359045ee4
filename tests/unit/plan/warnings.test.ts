import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { compilePlan } from "../../../solver/plan/compile";
import { type Plan, parsePlan } from "../../../solver/plan/schema";

// Plan warnings are geometry, not physics: each must name the element to fix. The thresholds (reach
// height 2.4 m, support height limits, power-line fall distance) are common practice, no published source.
// The raw JSON, edited freely before parsing (so the edits go through the same validation a file would).
// biome-ignore lint/suspicious/noExplicitAny: an untyped document on purpose
const demo: any = JSON.parse(readFileSync("public/demo-plan.json", "utf8"));
// biome-ignore lint/suspicious/noExplicitAny: see above
const edit = (change: (p: any) => void): Plan => {
  const p = structuredClone(demo);
  change(p);
  return parsePlan(p);
};
const warningsOf = (p: Plan) => compilePlan(p).warnings;

describe("plan warnings point at the element", () => {
  it("the demo garden itself raises no geometric warning", () => {
    const codes = warningsOf(parsePlan(demo)).map((w) => w.code);
    for (const c of [
      "wire-end-within-reach",
      "wire-through-roof",
      "wire-through-trunk",
      "support-too-tall",
    ]) {
      expect(codes).not.toContain(c);
    }
  });

  it("a drooped end hanging within reach above a walkway", () => {
    const p = edit((d) => {
      d.wireRuns[0].droops[0].length = 7.5; // west end down to about 1.5 m
      const west = d.supports.find((s: { id: string }) => s.id === "oak").position;
      d.walkways.push({
        id: "side-path",
        name: "Side path",
        path: [
          [west[0] - 3, west[1] - 0.6],
          [west[0] + 3, west[1] - 0.6],
        ],
        width: 1.2,
      });
    });
    const w = warningsOf(p).find((x) => x.code === "wire-end-within-reach");
    expect(w).toBeDefined();
    expect(w!.elementId).toBe("droop-west");
    expect(w!.message).toContain("Side path");
  });

  it("a wire through a roof names the wire part, and an implausible support height names the support", () => {
    const p = edit((d) => {
      // A tall outbuilding straight under the span between the trees (the wire is at about 9 m).
      d.supports.push({
        type: "building",
        id: "barn",
        name: "Barn",
        footprint: [
          [-1, 10],
          [1.5, 10],
          [1.5, 12.5],
          [-1, 12.5],
        ],
        eaveHeight: 9.5,
        ridgeHeight: 11,
        ridgeDeg: 90,
      });
      d.supports.find((s: { id: string }) => s.id === "birch").totalHeight = 95;
    });
    const ws = warningsOf(p);
    const roof = ws.find((x) => x.code === "wire-through-roof");
    expect(roof?.message).toContain("Barn");
    expect(roof?.elementId).toBeTruthy();
    const tall = ws.find((x) => x.code === "support-too-tall");
    expect(tall?.elementId).toBe("birch");
  });

  it("a wire near a power line", () => {
    const p = edit((d) => {
      d.powerLines.push({
        id: "service",
        name: "Service drop",
        points: [
          [-12, 13, 7],
          [12, 13, 7],
        ],
      });
    });
    const w = warningsOf(p).find((x) => x.code === "near-power-line");
    expect(w?.message).toContain("Service drop");
  });
});
