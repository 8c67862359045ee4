/** Far field in free space against textbook dipoles (currents prescribed, no moment method). */

import { describe, expect, it } from "vitest";
import { computeFarField } from "../../../solver/fields/farfield";
import type { FarFieldRequest } from "../../../solver/fields/types";
import { ETA0 } from "../../../solver/model/constants";
import type { Vec3 } from "../../../solver/model/types";
import { buildMesh, C, sinusoidalDipole, type Wire } from "./helpers";
import { cin, dipolePowerPerAmpSq } from "./reference-values";

const F = 14e6;
const LAMBDA = C / F;
const K = (2 * Math.PI) / LAMBDA;

function free(wires: Wire[], stepDeg = 2, keepPattern = false) {
  const { mesh, currents } = buildMesh(wires);
  const req: FarFieldRequest = {
    mesh,
    currents,
    frequencyHz: F,
    ground: { kind: "free" },
    acceptedWatts: 1,
    stepDeg,
    keepPattern,
  };
  return computeFarField(req);
}

const uniform = (from: Vec3, to: Vec3): Wire => ({ from, to, segments: 1, current: () => [1, 0] });
const gridGain = (r: ReturnType<typeof free>, elev: number, bearing: number) => {
  const p = r.pattern!;
  const i = p.elevationsDeg.indexOf(elev);
  const j = p.bearingsDeg.indexOf(bearing);
  return p.gainDbi[i * p.bearingsDeg.length + j];
};

describe("far field in free space", () => {
  // Balanis, Antenna Theory, 4th ed., eqs. 4-16 (P = η(π/3)|I0 l/λ|²), 4-26..4-31 (U ∝ sin²θ, D0 = 3/2).
  it("a Hertzian dipole has directivity 1.5, a sin²θ pattern and P = η(π/3)(l/λ)²|I0|²", () => {
    const l = LAMBDA / 2000;
    const r = free([uniform([0, 0, -l / 2], [0, 0, l / 2])], 2, true);
    expect(10 ** (r.directivityDbi / 10)).toBeCloseTo(1.5, 5);
    const p = ETA0 * (Math.PI / 3) * (l / LAMBDA) ** 2;
    expect(Math.abs(r.radiatedWatts / p - 1)).toBeLessThan(1e-6);
    // acceptedWatts = 1 W while only p radiates: gain = D · p/1 W everywhere, D(θ) = 1.5 sin²θ, sin θ = cos e.
    for (const e of [-60, -20, 0, 30, 88]) {
      const expected = 10 * Math.log10(1.5 * Math.cos((e * Math.PI) / 180) ** 2 * p);
      expect(gridGain(r, e, 46)).toBeCloseTo(expected, 5);
    }
  });

  // Balanis §4.5.4 (eqs. 4-91, 4-93): half-wave dipole D0 = 4/Cin(2π) ≈ 1.641, R_r = (η/4π)Cin(2π) ≈ 73.08 Ω.
  // The current is the sinusoid sampled onto linear segments, so R_r converges as O(h²).
  it("a half-wave dipole converges to D0 = 4/Cin(2π) and R_r = η Cin(2π)/4π at second order", () => {
    const rExact = (ETA0 / (4 * Math.PI)) * cin(2 * Math.PI);
    const dExact = 4 / cin(2 * Math.PI);
    const err: number[] = [];
    for (const n of [20, 40, 80]) {
      const r = free([sinusoidalDipole([0, 0, 0], [0, 0, 1], LAMBDA / 2, LAMBDA, n)]);
      const rr = 2 * r.radiatedWatts; // |I0| = 1 A at the feed (= I_max for a half wave)
      err.push(Math.abs(rr - rExact));
      expect(Math.abs(10 ** (r.directivityDbi / 10) - dExact)).toBeLessThan(1e-4);
    }
    expect(err[2] / rExact).toBeLessThan(5e-4);
    const rate = Math.log2(err[1] / err[2]);
    expect(rate).toBeGreaterThan(1.8);
    expect(rate).toBeLessThan(2.2);
    expect(rExact).toBeCloseTo(73.08, 2);
  });

  // Balanis §4.3 (eq. 4-37): short dipole with triangular current, R_r = 20π²(l/λ)² for η = 120π; written
  // here as (π/6)η(l/λ)² so it holds for η0 = μ0c. Two linear segments make the triangle exactly.
  it("a short dipole with triangular current radiates ½·(π/6)η(l/λ)²|I0|²", () => {
    const l = LAMBDA / 200;
    const tri: Wire = {
      from: [0, 0, -l / 2],
      to: [0, 0, l / 2],
      segments: 2,
      current: (u) => [1 - Math.abs(2 * u - 1), 0],
    };
    const r = free([tri]);
    const expected = 0.5 * (Math.PI / 6) * ETA0 * (l / LAMBDA) ** 2;
    expect(Math.abs(r.radiatedWatts / expected - 1)).toBeLessThan(2e-4); // finite-length correction ~ (kl)²
  });

  // Balanis eq. 4-68 (general-length dipole), evaluated with Si/Ci from @stdlib. Long dipoles have many
  // lobes: this checks the power quadrature at the 2° display step and at the coarse 5° and 10° steps.
  // 1600 segments keep the sampling error of the sinusoid (O(h²)) below 1e-4, so what is left is quadrature.
  it("integrates the power of 1.5λ and 5λ dipoles to well under 0.5% at 2°, 5° and 10° steps", () => {
    for (const [len, steps] of [
      [1.5, [2, 5, 10]],
      [5, [2, 5]],
    ] as const) {
      const l = len * LAMBDA;
      const exact = dipolePowerPerAmpSq(K * l, ETA0);
      // Unit maximum current: I_max sin(k(l/2 − |z|)) — undo the helper's feed normalisation.
      const norm = Math.sin((K * l) / 2);
      for (const step of steps) {
        const r = free([sinusoidalDipole([0, 0, 0], [0, 0, 1], l, LAMBDA, 1600, [norm, 0])], step);
        const relErr = Math.abs(r.radiatedWatts / exact - 1);
        expect(relErr, `${len} λ at ${step}°`).toBeLessThan(step === 10 ? 2e-3 : 1e-4);
      }
    }
  });

  // Bearing convention (this project's frame: x east, y north, bearing clockwise from north). A current along
  // x radiates sin² of the angle from x (Balanis eq. 4-26 rotated): broadside is north/south.
  it("puts the broadside of an east–west current at bearings 0 and 180", () => {
    const l = LAMBDA / 1000;
    const r = free([uniform([-l / 2, 0, 0], [l / 2, 0, 0])], 2, true);
    expect(gridGain(r, 0, 0)).toBeCloseTo(gridGain(r, 0, 180), 9);
    expect(gridGain(r, 0, 0) - gridGain(r, 0, 90)).toBeGreaterThan(100); // null along the wire
    // sin² of 60° from the wire; the residual (kl)² finite-length term is ~4e-6 dB.
    expect(gridGain(r, 0, 0) - gridGain(r, 0, 30)).toBeCloseTo(
      -10 * Math.log10(1 - Math.sin(Math.PI / 6) ** 2),
      4,
    );
  });

  // The maximum of an x-directed dipole is the whole y–z circle (Balanis eq. 4-26, by symmetry): the
  // reported peak is then the direction nearest the horizon with the smallest bearing, north at e = 0.
  it("reports a ring-shaped maximum at the horizon toward north", () => {
    const l = LAMBDA / 1000;
    const r = free([uniform([-l / 2, 0, 0], [l / 2, 0, 0])]);
    expect(r.peakElevationDeg).toBe(0);
    expect(r.peakBearingDeg).toBe(0);
  });

  // Two-element end-fire array (Balanis §6.3, ordinary end-fire: spacing λ/4, progressive phase −kd):
  // with e^{jωt}, the element further east lagging by 90° beams toward the east, bearing 90.
  it("beams an end-fire pair phased toward the east at bearing 90, elevation 0", () => {
    const l = LAMBDA / 1000;
    const d = LAMBDA / 4;
    const west: Wire = { from: [0, 0, -l / 2], to: [0, 0, l / 2], segments: 1, current: () => [1, 0] };
    const east: Wire = { from: [d, 0, -l / 2], to: [d, 0, l / 2], segments: 1, current: () => [0, -1] };
    const r = free([west, east]);
    expect(r.peakBearingDeg).toBe(90);
    expect(r.peakElevationDeg).toBe(0);
    // Elevation cut over the full great circle through the peak bearing; 180 is the horizon behind (west),
    // where the two fields cancel exactly.
    expect(r.elevationCut.anglesDeg[0]).toBe(-90);
    expect(r.elevationCut.anglesDeg.at(-1)).toBe(270);
    const back = r.elevationCut.anglesDeg.indexOf(180);
    expect(r.elevationCut.gainDbi[back]).toBeLessThan(-100);
    expect(r.azimuthCut.gainDbi[r.azimuthCut.anglesDeg.indexOf(90)]).toBeCloseTo(r.peakGainDbi, 12);
  });
});
