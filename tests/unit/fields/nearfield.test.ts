/** Near fields from segment currents and charges, against closed forms and boundary conditions. */

import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { nearFieldAt } from "../../../solver/fields/nearfield";
import { ETA0 } from "../../../solver/model/constants";
import type { Vec3 } from "../../../solver/model/types";
import { buildMesh, C, sinusoidalDipole } from "./helpers";

const F = 14e6;
const LAMBDA = C / F;
const K = (2 * Math.PI) / LAMBDA;

type Cx = [number, number];
const mul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const expj = (x: number): Cx => [Math.cos(x), Math.sin(x)];
const cabs = (a: Cx) => Math.hypot(a[0], a[1]);
const sub = (a: Cx, b: Cx): Cx => [a[0] - b[0], a[1] - b[1]];
const comp = (v: Float64Array, i: number): Cx => [v[2 * i], v[2 * i + 1]];

/** Hertzian dipole (I0 l along z at the origin), Balanis, Antenna Theory, 4th ed., eqs. 4-8a..4-10c:
 *  H_φ = jkI0l sinθ/(4πr)[1 + 1/(jkr)]e^{−jkr},  E_r = ηI0l cosθ/(2πr²)[1 + 1/(jkr)]e^{−jkr},
 *  E_θ = jηkI0l sinθ/(4πr)[1 + 1/(jkr) − 1/(kr)²]e^{−jkr}. */
function hertzian(l: number, r: number, theta: number) {
  const kr = K * r;
  const ph = expj(-kr);
  const one: Cx = [1, -1 / kr]; // 1 + 1/(jkr)
  const hPhi = mul(mul([0, (K * l * Math.sin(theta)) / (4 * Math.PI * r)], one), ph);
  const eR = mul(mul([(ETA0 * l * Math.cos(theta)) / (2 * Math.PI * r * r), 0], one), ph);
  const eTh = mul(
    mul([0, (ETA0 * K * l * Math.sin(theta)) / (4 * Math.PI * r)], [1 - 1 / (kr * kr), -1 / kr]),
    ph,
  );
  return { hPhi, eR, eTh };
}

describe("near field", () => {
  it("reproduces the Hertzian dipole's near, intermediate and far fields", () => {
    const l = LAMBDA / 200000; // (l/r)² end-charge correction < 1e-7 at r = 0.02 λ
    const { mesh, currents } = buildMesh([
      { from: [0, 0, -l / 2], to: [0, 0, l / 2], segments: 1, current: () => [1, 0] },
    ]);
    mesh.radii.fill(0);
    for (const r of [0.02 * LAMBDA, 0.15 * LAMBDA, 3 * LAMBDA]) {
      for (const theta of [0.3, Math.PI / 2, 2.5]) {
        const phi = 0.7;
        const st = Math.sin(theta);
        const ct = Math.cos(theta);
        const pt: Vec3 = [r * st * Math.cos(phi), r * st * Math.sin(phi), r * ct];
        const f = nearFieldAt(mesh, currents, F, "free", pt);
        const ref = hertzian(l, r, theta);
        // Project onto r̂, θ̂, φ̂.
        const rh = [st * Math.cos(phi), st * Math.sin(phi), ct];
        const th = [ct * Math.cos(phi), ct * Math.sin(phi), -st];
        const fh = [-Math.sin(phi), Math.cos(phi), 0];
        const proj = (v: Float64Array, u: number[]): Cx => [
          u[0] * v[0] + u[1] * v[2] + u[2] * v[4],
          u[0] * v[1] + u[1] * v[3] + u[2] * v[5],
        ];
        const eScale = cabs(ref.eR) + cabs(ref.eTh);
        expect(cabs(sub(proj(f.e, rh), ref.eR)) / eScale).toBeLessThan(1e-6);
        expect(cabs(sub(proj(f.e, th), ref.eTh)) / eScale).toBeLessThan(1e-6);
        expect(cabs(proj(f.e, fh)) / eScale).toBeLessThan(1e-9);
        expect(cabs(sub(proj(f.h, fh), ref.hPhi)) / cabs(ref.hPhi)).toBeLessThan(1e-6);
      }
    }
  });

  // Centre-fed dipole with I = I_m sin(k(h − |z|)), exact field of the filament (Balanis §8.4 / Jordan &
  // Balmain eq. 14-2; from memory of the form): E_z = −j(ηI_m/4π)[e^{−jkR1}/R1 + e^{−jkR2}/R2 − 2cos(kh)e^{−jkR0}/R0],
  // R1, R2 to the ends, R0 to the centre. The sampled (piecewise-linear) current converges to it.
  it("matches the closed-form E_z of a sinusoidal-current dipole", () => {
    const h = LAMBDA / 4;
    const { mesh, currents } = buildMesh([sinusoidalDipole([0, 0, 0], [0, 0, 1], 2 * h, LAMBDA, 200)]);
    mesh.radii.fill(0);
    for (const pt of [
      [0.05 * LAMBDA, 0, 0.1 * LAMBDA],
      [0.2 * LAMBDA, 0.1 * LAMBDA, -0.3 * LAMBDA],
      [0.02 * LAMBDA, 0, 0],
    ] as Vec3[]) {
      const r1 = Math.hypot(pt[0], pt[1], pt[2] - h);
      const r2 = Math.hypot(pt[0], pt[1], pt[2] + h);
      const r0 = Math.hypot(pt[0], pt[1], pt[2]);
      const term = (r: number): Cx => [Math.cos(K * r) / r, -Math.sin(K * r) / r];
      const sum: Cx = [
        term(r1)[0] + term(r2)[0] - 2 * Math.cos(K * h) * term(r0)[0],
        term(r1)[1] + term(r2)[1] - 2 * Math.cos(K * h) * term(r0)[1],
      ];
      const ez = mul([0, -ETA0 / (4 * Math.PI)], sum);
      const f = nearFieldAt(mesh, currents, F, "free", pt);
      expect(cabs(sub(comp(f.e, 2), ez)) / cabs(ez)).toBeLessThan(2e-3);
    }
  });

  // Perfect conductor boundary conditions (any electromagnetics text, e.g. Balanis AEE §1.8): on z = 0 the
  // tangential E and the normal H of source + image vanish.
  it("over perfect ground has no tangential E and no normal H on the ground plane", () => {
    fc.assert(
      fc.property(
        fc.tuple(fc.double({ min: -5, max: 5, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true })),
        fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true })),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        ([x, y], [ax, ay], tilt) => {
          const from: Vec3 = [1, 2, 3];
          const to: Vec3 = [1 + 4 * ax, 2 + 4 * ay, 3 + 4 * tilt];
          const { mesh, currents } = buildMesh([
            { from, to, segments: 6, current: (u) => [Math.sin(Math.PI * u), 0.3 * u] },
          ]);
          const f = nearFieldAt(mesh, currents, F, "perfect", [x, y, 0]);
          const eMag = Math.hypot(...f.e);
          const hMag = Math.hypot(...f.h);
          expect(Math.hypot(f.e[0], f.e[1], f.e[2], f.e[3])).toBeLessThan(1e-9 * eMag);
          expect(Math.hypot(f.h[4], f.h[5])).toBeLessThan(1e-9 * hMag);
        },
      ),
      { numRuns: 30 },
    );
  });
});
