/**
 * Segmentation, junctions, ground nodes, warnings and geometry errors. Expectations follow the basis
 * rules of Harrington 1968 §4 / Gibson (triangles at interior nodes, M − 1 at an M-way junction, none
 * at a free end) and Kirchhoff's current law at junctions.
 */
import { describe, expect, it } from "vitest";
import { buildMesh } from "../../../solver/geometry/mesh";
import { solveModel } from "../../../solver/index";
import { ModelError } from "../../../solver/model/errors";
import type { WireModel } from "../../../solver/model/types";

const C = 299_792_458;
const base = (): WireModel => ({
  wires: [
    {
      id: "a",
      points: [
        [0, 0, 5],
        [10, 0, 5],
        [10, 8, 5],
      ],
      radius: 1e-3,
    },
  ],
  feed: { wire: "a", at: 0.37 },
  ground: { kind: "free" },
  frequenciesMHz: [14],
});
const meshOf = (m: WireModel, spw = 25) =>
  buildMesh(m, {
    maxFrequencyHz: Math.max(...(m.frequenciesMHz as number[])) * 1e6,
    segmentsPerWavelength: spw,
    ground: m.ground.kind !== "free",
  });

function expectModelError(fn: () => unknown, path: string) {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ModelError);
    expect((e as ModelError).path).toBe(path);
    return;
  }
  throw new Error(`expected a ModelError at ${path}`);
}

describe("automatic segmentation", () => {
  it("cuts runs to λ/spw or finer, at least 3 per run, with the feed exactly on a node", () => {
    const m = meshOf(base(), 25);
    const lam = C / 14e6;
    for (let s = 0; s < m.segs.n; s++) expect(m.segs.len[s]).toBeLessThanOrEqual(lam / 25 + 1e-9);
    // Feed at 37 % of 18 m = 6.66 m: a node there.
    const L = 18;
    const seg = m.feed.segment;
    const at = m.feed.atEnd ? m.view.wireEnd[seg] : m.view.wireStart[seg];
    expect(at).toBeCloseTo(0.37 * L, 9);
    expect(m.warnings.filter((w) => w.code === "feed-snapped")).toHaveLength(0);
    // A short run still gets three segments.
    const short = base();
    short.wires[0].points = [
      [0, 0, 5],
      [10, 0, 5],
      [10, 0.5, 5],
    ];
    const ms = meshOf(short, 25);
    const onLastRun = Array.from(ms.view.wireStart).filter((s) => s >= 10 - 1e-9).length;
    expect(onLastRun).toBe(3);
  });

  it("with a fixed count, snaps the feed to the nearest node and warns", () => {
    const m = base();
    m.wires[0].segments = 9;
    const mesh = meshOf(m);
    expect(mesh.segs.n).toBe(9);
    const w = mesh.warnings.find((x) => x.code === "feed-snapped");
    expect(w?.path).toBe("feed.at");
  });
});

describe("junctions and ends", () => {
  it("an M-way junction carries M − 1 triangles; free ends none", () => {
    // Four wires meeting at the origin, 4 segments each: 3 interior triangles per wire + 3 at the junction.
    const arm = (id: string, p: [number, number, number]) => ({
      id,
      points: [[0, 0, 10], p] as [number, number, number][],
      radius: 1e-3,
      segments: 4,
    });
    const m: WireModel = {
      wires: [arm("n", [0, 3, 10]), arm("e", [3, 0, 10]), arm("s", [0, -3, 10]), arm("up", [0, 0, 13])],
      feed: { wire: "up", at: 0.5 },
      ground: { kind: "free" },
      frequenciesMHz: [14],
    };
    expect(meshOf(m).nBasis).toBe(4 * 3 + 3);
  });

  it("current is continuous at a 3-wire junction (Kirchhoff: sum into the node is zero)", () => {
    const m: WireModel = {
      wires: [
        {
          id: "a",
          points: [
            [0, 0, 0],
            [0, 0, 1],
          ],
          radius: 1e-3,
        },
        {
          id: "b",
          points: [
            [0, 0, 1],
            [0.8, 0, 1.5],
          ],
          radius: 1e-3,
        },
        {
          id: "c",
          points: [
            [-0.7, 0.2, 1.6],
            [0, 0, 1],
          ],
          radius: 1e-3,
        }, // ends at the junction
      ],
      feed: { wire: "a", at: 0.3 },
      ground: { kind: "free" },
      frequenciesMHz: [100],
    };
    const r = solveModel(m, { segmentsPerWavelength: 40, patternStepDeg: 0 });
    const c = r.results[0].segmentCurrents;
    const mesh = r.mesh;
    let sumR = 0;
    let sumI = 0;
    let touching = 0;
    let magnitude = 0;
    for (let s = 0; s < mesh.segments; s++) {
      const atStart =
        Math.hypot(mesh.starts[3 * s], mesh.starts[3 * s + 1], mesh.starts[3 * s + 2] - 1) < 1e-9;
      const atEnd = Math.hypot(mesh.ends[3 * s], mesh.ends[3 * s + 1], mesh.ends[3 * s + 2] - 1) < 1e-9;
      // Into the node: +I at a segment's end, −I at its start.
      if (atEnd) {
        sumR += c.endRe[s];
        sumI += c.endIm[s];
        magnitude += Math.hypot(c.endRe[s], c.endIm[s]);
        touching++;
      }
      if (atStart) {
        sumR -= c.startRe[s];
        sumI -= c.startIm[s];
        magnitude += Math.hypot(c.startRe[s], c.startIm[s]);
        touching++;
      }
    }
    expect(touching).toBe(3);
    expect(magnitude).toBeGreaterThan(1e-3);
    expect(Math.hypot(sumR, sumI)).toBeLessThan(1e-12 * magnitude);
  });

  it("a feed at a 3-way junction gives the same impedance whatever the wire order", () => {
    // The physics cannot depend on which junction end the basis bookkeeping pairs with the others.
    const a = {
      id: "a",
      points: [
        [0, 0, 1],
        [0, 0, 0.2],
      ] as [number, number, number][],
      radius: 1e-3,
    };
    const b = {
      id: "b",
      points: [
        [0, 0, 1],
        [0.8, 0, 1.5],
      ] as [number, number, number][],
      radius: 1e-3,
    };
    const c = {
      id: "c",
      points: [
        [-0.7, 0.2, 1.6],
        [0, 0, 1],
      ] as [number, number, number][],
      radius: 1e-3,
    };
    const z = [
      [a, b, c],
      [b, a, c],
      [c, b, a],
    ].map(
      (wires) =>
        solveModel(
          { wires, feed: { wire: "a", at: 0 }, ground: { kind: "free" }, frequenciesMHz: [100] },
          { segmentsPerWavelength: 30, patternStepDeg: 0 },
        ).results[0].impedance,
    );
    for (const zz of z.slice(1)) {
      expect(zz[0]).toBeCloseTo(z[0][0], 4);
      expect(zz[1]).toBeCloseTo(z[0][1], 4);
    }
  });

  it("free ends carry no current; a z = 0 end over ground does", () => {
    const r = solveModel(
      {
        wires: [
          {
            id: "m",
            points: [
              [0, 0, 0],
              [0, 0, 5],
            ],
            radius: 1e-3,
          },
        ],
        feed: { wire: "m", at: 0 },
        ground: { kind: "perfect" },
        frequenciesMHz: [14],
      },
      { patternStepDeg: 0 },
    );
    const c = r.results[0].segmentCurrents;
    const last = r.mesh.segments - 1;
    expect(Math.hypot(c.startRe[0], c.startIm[0])).toBeGreaterThan(1e-3);
    expect(Math.hypot(c.endRe[last], c.endIm[last])).toBe(0);
    expect(r.results[0].feedCurrent[0]).toBeCloseTo(c.startRe[0], 12);
  });
});

describe("warnings", () => {
  it("flags thick wires, short segments and wires that pass too close", () => {
    const m: WireModel = {
      wires: [
        {
          id: "thick",
          points: [
            [0, 0, 10],
            [10, 0, 10],
          ],
          radius: 0.5,
        },
        {
          id: "near",
          points: [
            [0, 0.004, 12],
            [0, 0.004, 20],
          ],
          radius: 1e-3,
        },
        {
          id: "other",
          points: [
            [0.002, 0, 12],
            [0.002, 0, 20],
          ],
          radius: 1e-3,
          segments: 4,
        },
        {
          id: "stub",
          points: [
            [30, 0, 10],
            [30, 0, 10.01],
          ],
          radius: 1e-3,
        },
      ],
      feed: { wire: "thick", at: 0.5 },
      ground: { kind: "free" },
      frequenciesMHz: [14],
    };
    const codes = meshOf(m).warnings.map((w) => `${w.code}:${w.wire}`);
    expect(codes).toContain("thin-wire-radius:thick");
    expect(codes).toContain("segment-short:stub");
    expect(codes.some((c) => c.startsWith("wires-close:"))).toBe(true);
  });
});

describe("more warnings", () => {
  it("flags a wire end resting on another wire's run (not a junction)", () => {
    const m: WireModel = {
      wires: [
        {
          id: "top",
          points: [
            [-5, 0, 10],
            [5, 0, 10],
          ],
          radius: 1e-3,
        },
        {
          id: "drop",
          points: [
            [0.3, 0, 10],
            [0.3, 0, 4],
          ],
          radius: 1e-3,
        },
      ],
      feed: { wire: "top", at: 0.5 },
      ground: { kind: "free" },
      frequenciesMHz: [14],
    };
    expect(meshOf(m).warnings.map((w) => w.code)).toContain("wires-touch");
  });

  it("flags a lossy wire thinner than a few skin depths", () => {
    // δ = sqrt(2/(ωμ0σ)) ≈ 0.18 mm for stainless steel at 1.8 MHz (Ramo, Whinnery & Van Duzer §5.6).
    const r = solveModel(
      {
        wires: [
          {
            id: "w",
            points: [
              [-40, 0, 10],
              [40, 0, 10],
            ],
            radius: 2e-4,
            material: "stainless steel",
          },
        ],
        feed: { wire: "w", at: 0.5 },
        ground: { kind: "free" },
        frequenciesMHz: [1.8],
      },
      { patternStepDeg: 0 },
    );
    expect(r.warnings.find((w) => w.code === "skin-depth")?.path).toBe("wires[0].radius");
  });
});

describe("geometry errors name the offending field", () => {
  it("repeated point (zero-length segment)", () => {
    const m = base();
    m.wires[0].points = [
      [0, 0, 5],
      [0, 0, 5],
      [1, 0, 5],
    ];
    expectModelError(() => meshOf(m), "wires[0].points[1]");
  });
  it("point below ground", () => {
    const m = base();
    m.ground = { kind: "perfect" };
    m.wires.push({
      id: "b",
      points: [
        [0, 5, -1],
        [0, 5, 3],
      ],
      radius: 1e-3,
    });
    expectModelError(() => meshOf(m), "wires[1].points[0]");
  });
  it("feed on an unknown wire", () => {
    const m = base();
    m.feed = { wire: "nope", at: 0.5 };
    expectModelError(() => meshOf(m), "feed.wire");
  });
  it("feed position outside 0..1", () => {
    const m = base();
    m.feed = { wire: "a", at: 1.2 };
    expectModelError(() => meshOf(m), "feed.at");
  });
  it("feed at a free end", () => {
    const m = base();
    m.feed = { wire: "a", at: 1 };
    expectModelError(() => meshOf(m), "feed.at");
  });
  it("load on an unknown wire", () => {
    const m = base();
    m.loads = [
      { wire: "a", at: 0.2, ohms: 5 },
      { wire: "zz", at: 0.2, ohms: 5 },
    ];
    expectModelError(() => meshOf(m), "loads[1].wire");
  });
  it("the error reaches solveModel callers as ModelError", () => {
    const m = base();
    m.feed = { wire: "a", at: 0 };
    expectModelError(() => solveModel(m), "feed.at");
  });
});
