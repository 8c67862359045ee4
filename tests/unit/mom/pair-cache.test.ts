/**
 * Reusing pair integrals along straight runs must not change the matrix: translation invariance of the
 * free-space kernel (and of the image geometry over a perfect ground) makes the cached and the
 * recomputed entries the same up to rounding.
 */
import { describe, expect, it } from "vitest";
import { freeSpaceGround } from "../../../solver/ground/free";
import { prepareInternal } from "../../../solver/index";
import { ETA0 } from "../../../solver/model/constants";
import type { WireModel } from "../../../solver/model/types";
import { fillMatrix, makeFillScratch } from "../../../solver/mom/fill";
import { findRuns } from "../../../solver/mom/pair-cache";

const model: WireModel = {
  wires: [
    {
      id: "d",
      points: [
        [-5, 0, 8],
        [5, 0, 8],
      ],
      radius: 1e-3,
    },
    {
      id: "p",
      points: [
        [-5, 1.5, 8],
        [5, 1.5, 8],
      ],
      radius: 1e-3,
      segments: 14,
    }, // parallel, cut alike
    {
      id: "v",
      points: [
        [3, -2, 0],
        [3, -2, 9],
      ],
      radius: 1e-3,
    },
  ],
  feed: { wire: "d", at: 0.5 },
  ground: { kind: "free" },
  frequenciesMHz: [14.2],
};

describe("pair cache", () => {
  it("finds runs of equal consecutive segments", () => {
    const { internals } = prepareInternal(model, { segmentsPerWavelength: 20 });
    const m = internals.meshDetail;
    const runs = findRuns(m.segs, m.view.wireOfSegment);
    expect(runs.length.length).toBe(3);
  });

  it("gives the same matrix as computing every pair", () => {
    const { internals } = prepareInternal(model, { segmentsPerWavelength: 20 });
    const mesh = internals.meshDetail;
    const n = mesh.nBasis;
    const f = {
      frequencyHz: 14.2e6,
      omega: 2 * Math.PI * 14.2e6,
      k: (2 * Math.PI * 14.2e6) / 299_792_458,
      eta: ETA0,
    };
    const a = [new Float64Array(n * n), new Float64Array(n * n)];
    const b = [new Float64Array(n * n), new Float64Array(n * n)];
    fillMatrix(mesh, freeSpaceGround(), f, a[0], a[1], makeFillScratch(mesh, true));
    fillMatrix(mesh, freeSpaceGround(), f, b[0], b[1], makeFillScratch(mesh, false));
    let worst = 0;
    let scale = 0;
    for (let i = 0; i < n * n; i++) {
      worst = Math.max(worst, Math.hypot(a[0][i] - b[0][i], a[1][i] - b[1][i]));
      scale = Math.max(scale, Math.hypot(b[0][i], b[1][i]));
    }
    expect(worst / scale).toBeLessThan(1e-11);
  });
});
