import { type Plan, parsePlan } from "../../../solver/plan/schema";

/** A small yard for store tests: two trees, a metal pole, a shed, a path, a drooped dipole fed at centre. */
export function fixturePlan(): Plan {
  return parsePlan({
    version: 1,
    name: "test yard",
    units: "m",
    lot: {
      outline: [
        [-15, -10],
        [15, -10],
        [15, 12],
        [-15, 12],
      ],
      northDeg: 0,
    },
    ituRegion: 1,
    bands: ["20 m"],
    ground: { kind: "perfect" },
    supports: [
      { type: "tree", id: "oak", name: "Oak", position: [-8, 0], height: 10, canopyRadius: 3 },
      { type: "tree", id: "birch", name: "Birch", position: [8, 0], height: 9 },
      {
        type: "mast",
        id: "pole",
        name: "Pole",
        position: [0, 6],
        height: 6,
        diameter: 0.05,
        material: "aluminium",
        base: { kind: "grounded", tie: { kind: "contact" } },
      },
      {
        type: "building",
        id: "shed",
        name: "Shed",
        footprint: [
          [5, -8],
          [9, -8],
          [9, -5],
          [5, -5],
        ],
        eaveHeight: 2,
        ridgeHeight: 2.8,
      },
    ],
    walkways: [
      {
        id: "path",
        name: "Path",
        path: [
          [-12, -3],
          [12, -3],
        ],
        width: 1,
      },
    ],
    wireRuns: [
      {
        id: "dipole",
        name: "20 m dipole",
        anchors: [
          { kind: "support", id: "a-oak", name: "", support: "oak", height: 10, rope: 1 },
          { kind: "support", id: "a-birch", name: "", support: "birch", height: 9, rope: 1 },
        ],
        droops: [{ id: "droop-end", name: "", end: "end", length: 1.5 }],
        wire: { awg: 14 },
        material: "copper",
        feed: { at: 0.5 },
      },
    ],
  });
}
