import { describe, expect, it } from "vitest";
import { fresnel } from "../../../solver/ground/fresnel";
import { perfectGround } from "../../../solver/ground/perfect";
import {
  type ReflectionWeights,
  reflectionPairTerms,
  reflectionWeights,
} from "../../../solver/ground/reflection";
import { makeSegmentSet, mirrorSegmentSet } from "../../../solver/mom/segments";

const f = 14e6;
const omega = 2 * Math.PI * f;
const k = omega / 299792458;

// Three segments: horizontal along x, slanted, vertical touching the ground.
const starts = Float64Array.from([0, 0, 5, 3, 1, 4, 8, -2, 0]);
const ends = Float64Array.from([1, 0, 5, 3.5, 1.6, 5, 8, -2, 1]);
const radii = Float64Array.from([1e-3, 1e-3, 2e-3]);
const P = makeSegmentSet(starts, ends, radii);
const M = mirrorSegmentSet(P);
const scratch = () => ({
  j: new Float64Array(8),
  w: { vecRe: 0, vecIm: 0, chargeRe: 0, chargeIm: 0 } as ReflectionWeights,
});

describe("reflection method (specular-angle image weighting)", () => {
  // Limit σ → ∞: Fresnel R_v → 1, R_h → −1 (Balanis AEE §5.3), so the weighted image must be the
  // perfect image term for term.
  it("reduces to the perfect-ground image as σ → ∞", () => {
    const perfect = perfectGround({
      segments: P,
      mirrored: M,
      wireOfSegment: new Int32Array(3),
      connections: [],
    });
    perfect.beginFrequency({ frequencyHz: f, omega, k, eta: 376.73 });
    const { j, w } = scratch();
    for (let p = 0; p < 3; p++) {
      for (let q = 0; q < 3; q++) {
        const a = new Float64Array(10);
        const b = new Float64Array(10);
        perfect.pairTerms(p, q, a);
        reflectionPairTerms(P, p, M, q, k, 1, 1e12, omega, j, w, b);
        for (let i = 0; i < 10; i++) expect(b[i]).toBeCloseTo(a[i], 6);
      }
    }
  });

  // Reciprocity: the weights must be the same for (p, q) and (q, p), or Z is not symmetric.
  it("gives reciprocal weights", () => {
    const a: ReflectionWeights = { vecRe: 0, vecIm: 0, chargeRe: 0, chargeIm: 0 };
    const b: ReflectionWeights = { ...a };
    for (let p = 0; p < 3; p++) {
      for (let q = 0; q < 3; q++) {
        reflectionWeights(P, p, M, q, 13, 0.005, omega, a);
        reflectionWeights(P, q, M, p, 13, 0.005, omega, b);
        expect(a.vecRe).toBeCloseTo(b.vecRe, 12);
        expect(a.vecIm).toBeCloseTo(b.vecIm, 12);
        expect(a.chargeRe).toBeCloseTo(b.chargeRe, 12);
        expect(a.chargeIm).toBeCloseTo(b.chargeIm, 12);
      }
    }
  });

  // A horizontal segment's self term sees its image at normal incidence: the image current is R_h times
  // the (unreversed) current, i.e. −R_h times the perfect image; a vertical one: R_v (both from the
  // Fresnel formulas at ψ = 90°, where R_v = −R_h).
  it("weights the self term by the normal-incidence coefficient", () => {
    const w: ReflectionWeights = { vecRe: 0, vecIm: 0, chargeRe: 0, chargeIm: 0 };
    const r = fresnel(13, 0.005, omega, Math.PI / 2);
    reflectionWeights(P, 0, M, 0, 13, 0.005, omega, w);
    // Horizontal: t̂_p·t̂_q̃ = −1, so the vector weight t̂_p·W·t̂_q̃ = −R_v = R_h; charge weight −R_h.
    expect(w.vecRe).toBeCloseTo(r.rhRe, 12);
    expect(w.vecIm).toBeCloseTo(r.rhIm, 12);
    expect(w.chargeRe).toBeCloseTo(-r.rhRe, 12);
    reflectionWeights(P, 2, M, 2, 13, 0.005, omega, w);
    expect(w.vecRe).toBeCloseTo(r.rvRe, 12);
    expect(w.chargeRe).toBeCloseTo(r.rvRe, 12);
  });
});
