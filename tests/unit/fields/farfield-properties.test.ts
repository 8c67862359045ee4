/** Property checks of the far field (fast-check): the fast grid kernel against the plain per-segment sum,
 *  non-negative and quadratic power, rotation invariance, and clear errors for bad input. */

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeFarField } from "../../../solver/fields/farfield";
import { directionGrid } from "../../../solver/fields/grid";
import { radiationGrid } from "../../../solver/fields/radiation";
import { radiationVectorAt } from "../../../solver/fields/reference";
import { buildRuns } from "../../../solver/fields/runs";
import type { FarFieldRequest } from "../../../solver/fields/types";
import { ModelError } from "../../../solver/model/errors";
import type { MeshView, SegmentCurrents, Vec3 } from "../../../solver/model/types";
import { buildMesh, C, type Wire } from "./helpers";

const F = 14.2e6;
const K = (2 * Math.PI * F) / C;

const coord = fc.double({ min: -15, max: 15, noNaN: true });
const point = fc.tuple(coord, coord, fc.double({ min: 0.5, max: 20, noNaN: true }));
const amp = fc.double({ min: -2, max: 2, noNaN: true });
/** A wire with a random smooth current; sometimes level (equal heights) to exercise the shared-row path. */
const wire = fc
  .record({
    from: point,
    to: point,
    level: fc.boolean(),
    segments: fc.integer({ min: 1, max: 9 }),
    a: fc.tuple(amp, amp, amp, amp),
  })
  .filter((w) => Math.hypot(w.to[0] - w.from[0], w.to[1] - w.from[1]) > 0.5)
  .map(
    (w): Wire => ({
      from: w.from,
      to: (w.level ? [w.to[0], w.to[1], w.from[2]] : w.to) as Vec3,
      segments: w.segments,
      current: (u) => [w.a[0] + w.a[1] * Math.sin(3 * u), w.a[2] * u + w.a[3] * u * u],
    }),
  );
const model = fc.array(wire, { minLength: 1, maxLength: 4 });

function request(mesh: MeshView, currents: SegmentCurrents, over: Partial<FarFieldRequest> = {}) {
  return {
    mesh,
    currents,
    frequencyHz: F,
    ground: { kind: "free" },
    acceptedWatts: 1,
    stepDeg: 10,
    keepPattern: false,
    ...over,
  } as FarFieldRequest;
}

describe("far-field properties", () => {
  // The closed forms of radiation.ts (node triangles, Horner) and reference.ts (segment by segment) are
  // derived independently; they must agree everywhere on the grid.
  it("the fast grid kernel equals the per-segment radiation integral", () => {
    const grid = directionGrid(10);
    fc.assert(
      fc.property(model, (wires) => {
        const { mesh, currents } = buildMesh(wires);
        const n = radiationGrid(grid, buildRuns(mesh, currents), K);
        let worst = 0;
        let scale = 1e-30;
        for (let i = 0; i < grid.elevationsDeg.length; i += 3) {
          for (let j = 0; j < grid.bearingsDeg.length; j += 5) {
            const ce = grid.cosE[i];
            const se = grid.sinE[i];
            const sb = grid.sinB[j];
            const cb = grid.cosB[j];
            const v = radiationVectorAt(mesh, currents, K, ce * sb, ce * cb, se);
            // θ̂ = (se sb, se cb, −ce), φ̂ = (−cb, sb, 0)
            const thRe = se * sb * v[0] + se * cb * v[2] - ce * v[4];
            const thIm = se * sb * v[1] + se * cb * v[3] - ce * v[5];
            const phRe = -cb * v[0] + sb * v[2];
            const phIm = -cb * v[1] + sb * v[3];
            const q = i * grid.bearingsDeg.length + j;
            worst = Math.max(
              worst,
              Math.hypot(n.thRe[q] - thRe, n.thIm[q] - thIm, n.phRe[q] - phRe, n.phIm[q] - phIm),
            );
            scale = Math.max(scale, Math.hypot(thRe, thIm, phRe, phIm));
          }
        }
        // Long runs are interpolated from a table in r̂·t̂ (error ≈ 2e-10 of Σ|I|ℓ, radiation.ts).
        expect(worst / scale).toBeLessThan(1e-8);
      }),
      { numRuns: 40 },
    );
  });

  it("radiated power is non-negative and scales with |c|² when every current is multiplied by c", () => {
    fc.assert(
      fc.property(model, amp, amp, fc.constantFrom("free", "perfect", "real"), (wires, cr, ci, kind) => {
        const { mesh, currents } = buildMesh(wires);
        const ground =
          kind === "real" ? { kind, permittivity: 13, conductivity: 0.005 } : ({ kind } as { kind: "free" });
        const p = computeFarField(request(mesh, currents, { ground })).radiatedWatts;
        const mul = (re: Float64Array, im: Float64Array) => [
          re.map((x, s) => cr * x - ci * im[s]),
          im.map((y, s) => cr * y + ci * re[s]),
        ];
        const [sr, si] = mul(currents.startRe, currents.startIm);
        const [er, ei] = mul(currents.endRe, currents.endIm);
        const scaled = { startRe: sr, startIm: si, endRe: er, endIm: ei };
        const q = computeFarField(request(mesh, scaled, { ground })).radiatedWatts;
        expect(p).toBeGreaterThanOrEqual(0);
        expect(Math.abs(q - (cr * cr + ci * ci) * p)).toBeLessThanOrEqual(1e-9 * (q + p) + 1e-300);
      }),
      { numRuns: 40 },
    );
  });

  // Total power radiated in free space does not depend on orientation; at a 5° step the quadrature is
  // accurate far below the tolerance for models of this size (a few wavelengths).
  it("radiated power in free space is invariant under rotation about z", () => {
    fc.assert(
      fc.property(model, fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (wires, angle) => {
        const c = Math.cos(angle);
        const s = Math.sin(angle);
        const rot = (p: Vec3): Vec3 => [c * p[0] - s * p[1], s * p[0] + c * p[1], p[2]];
        const a = buildMesh(wires);
        const b = buildMesh(wires.map((w) => ({ ...w, from: rot(w.from), to: rot(w.to) })));
        const pa = computeFarField(request(a.mesh, a.currents, { stepDeg: 5 })).radiatedWatts;
        const pb = computeFarField(request(b.mesh, b.currents, { stepDeg: 5 })).radiatedWatts;
        expect(Math.abs(pa - pb)).toBeLessThanOrEqual(1e-6 * pa + 1e-300);
      }),
      { numRuns: 25 },
    );
  });

  it("rejects bad input with a message naming the field", () => {
    const { mesh, currents } = buildMesh([
      { from: [0, 0, 5], to: [4, 0, 5], segments: 2, current: () => [1, 0] },
    ]);
    const fails = (over: Partial<FarFieldRequest>, path: string) => {
      let error: unknown;
      try {
        computeFarField(request(mesh, currents, over));
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(ModelError);
      expect((error as ModelError).path).toBe(path);
    };
    fails({ stepDeg: 7 }, "stepDeg");
    fails({ stepDeg: 0 }, "stepDeg");
    fails({ frequencyHz: -1 }, "frequencyHz");
    fails({ acceptedWatts: 0 }, "acceptedWatts");
    fails({ ground: { kind: "real", permittivity: 0.5, conductivity: 0.01 } }, "ground.permittivity");
    fails({ ground: { kind: "dirt" } as never }, "ground.kind");
    const bad = { ...mesh, ends: mesh.starts.slice() };
    fails({ mesh: bad }, "mesh segment 0");
    fails({ currents: { ...currents, endIm: new Float64Array(1) } }, "currents.endIm");
  });
});
