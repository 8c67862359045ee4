import { readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ModelError } from "../../../solver/model/errors";
import { planJsonSchema } from "../../../solver/plan/json-schema";
import { isPlanDocument, type PlanError, parsePlan } from "../../../solver/plan/schema";

const demo = JSON.parse(readFileSync(new URL("../../../public/demo-plan.json", import.meta.url), "utf8"));
const messageOf = (doc: unknown): string => {
  try {
    parsePlan(doc);
  } catch (e) {
    expect(e).toBeInstanceOf(ModelError);
    return (e as Error).message;
  }
  return "parsed";
};
const edit = (change: (d: typeof demo) => void) => {
  const d = structuredClone(demo);
  change(d);
  return d;
};

describe("plan schema", () => {
  it("reads the demo plan and tells it from a wire model by the version key", () => {
    expect(parsePlan(demo).wireRuns[0].id).toBe("dipole");
    expect(isPlanDocument(demo)).toBe(true);
    expect(isPlanDocument({ wires: [], feed: { wire: "a", at: 0.5 } })).toBe(false);
  });

  it("keeps plan.schema.json current (regenerate: npx tsx solver/plan/write-plan-schema.ts)", () => {
    const file = JSON.parse(
      readFileSync(new URL("../../../solver/plan/plan.schema.json", import.meta.url), "utf8"),
    );
    expect(file).toEqual(JSON.parse(JSON.stringify(planJsonSchema())));
  });

  // The list of bad plans: each message names the element and the field.
  it.each([
    [
      "unknown support",
      (d: typeof demo) => {
        d.wireRuns[0].anchors[0].support = "elm";
      },
      'wireRuns[0] "dipole": anchors[0] "dipole-west": support: no support with id "elm"',
    ],
    [
      "anchor above its support",
      (d: typeof demo) => {
        d.wireRuns[0].anchors[1].height = 12;
      },
      'wireRuns[0] "dipole": anchors[1] "dipole-east": height: 12 m is above the tree "birch" (9 m)',
    ],
    [
      "negative length",
      (d: typeof demo) => {
        d.wireRuns[0].droops[0].length = -1;
      },
      'wireRuns[0] "dipole": droops[0] "droop-west": length: expected a positive droop length (m)',
    ],
    [
      "empty run",
      (d: typeof demo) => {
        d.wireRuns[0].anchors = [];
      },
      'wireRuns[0] "dipole": anchors: expected at least two anchors',
    ],
    [
      "NaN",
      (d: typeof demo) => {
        d.supports[0].height = Number.NaN;
      },
      'supports[0] "oak": height: expected a finite attach height (m), got NaN',
    ],
  ])("%s: names the element", (_what, change, expected) => {
    const message = messageOf(edit(change));
    expect(message).toContain(expected);
  });

  it("carries the element id on the error", () => {
    try {
      parsePlan(edit((d) => (d.supports[3].height = 0)));
    } catch (e) {
      expect((e as PlanError).elementId).toBe("pole");
    }
  });

  it("rejects a plan from a newer version with a clear message", () => {
    expect(messageOf({ ...demo, version: 2 })).toMatch(/newer than this program/);
  });

  // Property check: random damage to the demo plan never crashes the parser — it parses or throws ModelError.
  it("never crashes on damaged plans (fast-check)", () => {
    const junk = fc.oneof(
      fc.constant(Number.NaN),
      fc.constant(Number.POSITIVE_INFINITY),
      fc.double(),
      fc.integer(),
      fc.string(),
      fc.constant(null),
      fc.constant(undefined),
      fc.array(fc.double(), { maxLength: 4 }),
      fc.dictionary(fc.string(), fc.integer()),
    );
    const paths: string[][] = [];
    const walk = (node: unknown, path: string[]) => {
      if (path.length) paths.push(path);
      if (node && typeof node === "object")
        for (const k of Object.keys(node)) walk((node as never)[k], [...path, k]);
    };
    walk(demo, []);
    fc.assert(
      fc.property(fc.constantFrom(...paths), junk, (path, value) => {
        const d = structuredClone(demo);
        let node = d;
        for (const k of path.slice(0, -1)) node = node[k];
        node[path[path.length - 1]] = value;
        try {
          parsePlan(d);
        } catch (e) {
          if (!(e instanceof ModelError)) throw e;
          expect(e.message.length).toBeGreaterThan(5);
        }
      }),
      { numRuns: 400 },
    );
  });
});
