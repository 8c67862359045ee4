import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ModelError } from "../../../solver/model/errors";
import { frequencyList, parseWireModel } from "../../../solver/model/schema";

// Input validation is not physics: these checks pin the messages the CLI and the app show.
const base = {
  wires: [
    {
      id: "top",
      points: [
        [-5, 0, 10],
        [5, 0, 10],
      ],
      radius: 0.001,
    },
  ],
  feed: { wire: "top", at: 0.5 },
  ground: { kind: "free" },
  frequenciesMHz: [14],
};

function messageOf(json: unknown): string {
  try {
    parseWireModel(json);
  } catch (e) {
    expect(e).toBeInstanceOf(ModelError);
    return (e as Error).message;
  }
  return "accepted";
}

describe("parseWireModel", () => {
  it("accepts the documented example", () => {
    const m = parseWireModel({
      ...base,
      wires: [{ ...base.wires[0], material: "copper", segments: 22 }],
      loads: [{ wire: "top", at: 0.25, ohms: 0, henries: 1e-5, farads: 0, arrangement: "series" }],
      frequenciesMHz: { from: 14, to: 14.35, count: 36 },
      referenceOhms: 50,
    });
    expect(m.wires[0].segments).toBe(22);
  });

  it("names the field of the first problem", () => {
    const bad = {
      ...base,
      wires: [
        base.wires[0],
        {
          id: "b",
          points: [
            [1, 2],
            [3, 4, 5],
          ],
          radius: 0.001,
        },
      ],
    };
    expect(messageOf(bad)).toBe("wires[1].points[0]: expected three numbers [x, y, z] in metres");
    expect(messageOf({ ...base, feed: { wire: "nope", at: 0.5 } })).toBe('feed.wire: no wire with id "nope"');
    expect(messageOf({ ...base, feed: { wire: "top", at: 1.5 } })).toMatch(/^feed\.at: /);
    expect(messageOf({ ...base, wires: [{ ...base.wires[0], radius: 0 }] })).toMatch(/^wires\[0\]\.radius: /);
    expect(messageOf({ ...base, frequenciesMHz: [1e7] })).toMatch(/^frequenciesMHz\[0\]: /);
    expect(messageOf({ ...base, ground: { kind: "mud" } })).toMatch(/^ground\.kind: /);
    expect(messageOf({ ...base, colour: "red" })).toBe("colour: unknown field");
    expect(messageOf({ ...base, wires: [base.wires[0], base.wires[0]] })).toBe(
      'wires[1].id: duplicate wire id "top"',
    );
    expect(messageOf(null)).toMatch(/^model: /);
  });

  it("never throws anything but a ModelError on arbitrary JSON", () => {
    fc.assert(
      fc.property(fc.jsonValue(), (json) => {
        try {
          parseWireModel(json);
        } catch (e) {
          return e instanceof ModelError && e.message.length > 0;
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });

  it("expands a frequency range to evenly spaced points including both ends", () => {
    const f = frequencyList({ from: 14, to: 14.35, count: 36 });
    expect(f).toHaveLength(36);
    expect(f[0]).toBe(14);
    expect(f[35]).toBeCloseTo(14.35, 12);
    expect(f[1] - f[0]).toBeCloseTo(0.01, 12);
  });
});
