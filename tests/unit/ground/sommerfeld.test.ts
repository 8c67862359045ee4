/**
 * The tabulated Sommerfeld remainder against a slow, independent brute force written here.
 *
 * Production (solver/ground/sommerfeld-integrals.ts): Bessel-function (J0, J1, J2) integrals along the
 * real λ axis with the quasi-static image removed, asymptotes in closed form, then a bicubic table.
 * Brute force (below): the full reflected field, no subtraction, as a two-dimensional plane-wave integral
 * over (kx, ky) = λ(cos α, sin α) — the angle α by the trapezoid rule (no Bessel functions anywhere),
 * λ along a path lifted into the upper half plane, λ + jβ sin(πλ/S) (away from the branch points and
 * the pole near the real axis), then the real axis. The plane-wave amplitudes are Sommerfeld's Hertz
 * potentials (Sommerfeld, Partial Differential Equations in Physics, 1949, §§31–33; the same R_V, R_H
 * as Balanis, Advanced Engineering Electromagnetics, §5.3 at real angles), with E = k0²Π + ∇∇·Π taken
 * in the spectral domain (∇ → (−jkx, −jky, −u0)).
 */
import { describe, expect, it } from "vitest";
import { remainderContext, remainderIntegrals } from "../../../solver/ground/sommerfeld-integrals";
import {
  buildSommerfeldTable,
  contractRemainder,
  lookupRemainder,
} from "../../../solver/ground/sommerfeld-table";
import { EPS0 } from "../../../solver/model/constants";

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const sqrtC = (a: C): C => {
  const m = Math.hypot(a[0], a[1]);
  const i = Math.sqrt(Math.max(0, (m - a[0]) / 2));
  return [Math.sqrt((m + a[0]) / 2), a[1] < 0 ? -i : i];
};
const expC = (a: C): C => {
  const e = Math.exp(a[0]);
  return [e * Math.cos(a[1]), e * Math.sin(a[1])];
};

/** Full reflected E at (x, y, Z) from the image point, for x̂ and ẑ elements; units Il/(4πjωε0) = 1. */
function bruteReflected(k0: number, eps: C, x: number, y: number, Z: number): { hed: C[]; ved: C[] } {
  const k1sq: C = [k0 * k0 * eps[0], k0 * k0 * eps[1]];
  const rho = Math.hypot(x, y);
  const beta = Math.min(0.3 * k0, rho > 0 ? 1 / rho : 0.3 * k0);
  const S = 2 * (Math.sqrt(Math.hypot(eps[0], eps[1])) * k0 + k0);
  const hed: C[] = [
    [0, 0],
    [0, 0],
    [0, 0],
  ];
  const ved: C[] = [
    [0, 0],
    [0, 0],
    [0, 0],
  ];
  const acc = (lam: C, dlam: C, w: number) => {
    const l2 = mul(lam, lam);
    const u0 = sqrtC([l2[0] - k0 * k0, l2[1]]);
    const u1 = sqrtC(sub(l2, k1sq));
    const eu0 = mul(eps, u0);
    const rv = div(sub(eu0, u1), add(eu0, u1));
    const rh = div(sub(u0, u1), add(u0, u1));
    const P = div([2 * (eps[0] - 1), 2 * eps[1]], mul(add(eu0, u1), add(u0, u1)));
    const D = sub(div(rh, u0), mul(u0, P));
    const na = Math.max(64, Math.ceil(Math.hypot(lam[0], lam[1]) * rho * 1.3) + 40);
    const ez = expC([-u0[0] * Z, -u0[1] * Z]);
    const m = mul(mul(lam, dlam), [w / na, 0]);
    for (let i = 0; i < na; i++) {
      const a = (2 * Math.PI * i) / na;
      const kx = mul(lam, [Math.cos(a), 0]);
      const ky = mul(lam, [Math.sin(a), 0]);
      const ph = add(mul(kx, [x, 0]), mul(ky, [y, 0]));
      const f = mul(mul(expC([ph[1], -ph[0]]), ez), m);
      const jkx: C = [-kx[1], kx[0]];
      const jky: C = [-ky[1], ky[0]];
      // Vertical element: Π̃z = R_V/u0 → Ẽ = (jkx R_V, jky R_V, R_V λ²/u0).
      ved[0] = add(ved[0], mul(f, mul(jkx, rv)));
      ved[1] = add(ved[1], mul(f, mul(jky, rv)));
      ved[2] = add(ved[2], mul(f, div(mul(rv, l2), u0)));
      // Horizontal x̂ element: Π̃x = R_H/u0, Π̃z = −jkx P → Ẽ = (k0²R_H/u0 − kx²D, −kx ky D, −jkx(k0²P − u0 D)).
      hed[0] = add(hed[0], mul(f, sub(div(mul([k0 * k0, 0], rh), u0), mul(mul(kx, kx), D))));
      hed[1] = add(hed[1], mul(f, mul([-1, 0], mul(mul(kx, ky), D))));
      hed[2] = add(hed[2], mul(f, mul([0, -1], mul(kx, sub(mul([k0 * k0, 0], P), mul(u0, D))))));
    }
  };
  const n1 = 3000;
  for (let i = 0; i < n1; i++) {
    const s = ((i + 0.5) * S) / n1;
    acc(
      [s, beta * Math.sin((Math.PI * s) / S)],
      [1, ((beta * Math.PI) / S) * Math.cos((Math.PI * s) / S)],
      S / n1,
    );
  }
  const h = Math.min(0.2 / Math.max(rho, Z), k0 / 20);
  for (let s = S + h / 2; s < 36 / Z; s += h) acc([s, 0], [1, 0], h);
  return { hed, ved };
}

/** κ × the perfect image's field (I + ∇∇/k²)(e^{−jkR}/R)·s, times k0² (units of the integrals). */
function kappaImage(k: number, kap: C, R: number[], s: number[]): C[] {
  const r = Math.hypot(R[0], R[1], R[2]);
  const kr = k * r;
  const g: C = [Math.cos(kr) / r, -Math.sin(kr) / r];
  const a: C = [1 - 1 / (kr * kr), -1 / kr];
  const b: C = [-1 + 3 / (kr * kr), 3 / kr];
  const rs = (R[0] * s[0] + R[1] * s[1] + R[2] * s[2]) / r;
  return [0, 1, 2].map((i) => {
    const v: C = [a[0] * s[i] + (b[0] * R[i] * rs) / r, a[1] * s[i] + (b[1] * R[i] * rs) / r];
    return mul(mul(v, g), mul(kap, [k * k, 0]));
  });
}

const f = 14e6;
const lambda = 299792458 / f;
const k0 = (2 * Math.PI) / lambda;
const omega = 2 * Math.PI * f;

/** Field of the remainder (from the table) plus κ-image, for source x̂ or ẑ: compare with brute force. */
function fromTable(table: ReturnType<typeof buildSommerfeldTable>, kap: C, x: number, y: number, Z: number) {
  const I = new Float64Array(10);
  lookupRemainder(table, Math.hypot(x, y), Z, I);
  const out = new Float64Array(2);
  const axes = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  const field = (s: number[], sImage: number[]) => {
    const img = kappaImage(k0, kap, [x, y, Z], sImage);
    return axes.map((e, i) => {
      contractRemainder(I, k0, x, y, e, 0, s, 0, out);
      return [out[0] * k0 * k0 + img[i][0], out[1] * k0 * k0 + img[i][1]] as C;
    });
  };
  return { hed: field([1, 0, 0], [-1, 0, 0]), ved: field([0, 0, 1], [0, 0, 1]) };
}

describe("Sommerfeld reflected field over lossy ground", () => {
  // Average ground (common practice: σ = 0.005 S/m, εr = 13) and ITU-R P.527 very dry ground (σ = 1e-4,
  // εr = 3: R_V's pole and u1's branch point close to the real axis, the hard case for the real-axis path).
  for (const [name, er, sigma] of [
    ["average ground", 13, 0.005],
    ["very dry ground", 3, 1e-4],
  ] as const) {
    it(`table + κ-image matches the brute-force plane-wave integral (${name})`, () => {
      const eps: C = [er, -sigma / (omega * EPS0)];
      const table = buildSommerfeldTable(
        { k0, epsRe: eps[0], epsIm: eps[1] },
        { rMax: 1.2 * lambda, thetaNodes: 17 },
      );
      const kap = table.ctx.kap;
      // Points off the table's nodes: (ρ, Z) in wavelengths, azimuth in radians.
      const points: [number, number, number][] = [
        [0, 0.11, 0],
        [0.04, 0.07, 0.3],
        [0.3, 0.1, 1.0],
        [0.27, 0.43, 2.0],
        [1.0, 0.2, 0.5],
        [0.02, 0.031, 0.7],
      ];
      for (const [rl, zl, phi] of points) {
        const x = rl * lambda * Math.cos(phi);
        const y = rl * lambda * Math.sin(phi);
        const Z = zl * lambda;
        const b = bruteReflected(k0, eps, x, y, Z);
        const t = fromTable(table, kap, x, y, Z);
        // Compare the whole vectors; the tolerance is relative to the remainder alone (what the table
        // carries), so the check is not swamped by the exactly-known image.
        const I = new Float64Array(10);
        remainderIntegrals(table.ctx, Math.hypot(x, y), Z, I);
        let remNorm = 0;
        for (let c = 0; c < 10; c++) remNorm = Math.max(remNorm, Math.abs(I[c]));
        for (const part of ["hed", "ved"] as const) {
          let err = 0;
          let mag = 0;
          for (let i = 0; i < 3; i++) {
            err = Math.max(err, Math.hypot(t[part][i][0] - b[part][i][0], t[part][i][1] - b[part][i][1]));
            mag = Math.max(mag, Math.hypot(b[part][i][0], b[part][i][1]));
          }
          const tol = 3e-3 * Math.max(remNorm, 1e-3 * mag) + 1e-6 * mag;
          if (!(err <= tol)) {
            throw new Error(
              `${name} ${part} at ρ=${rl}λ Z=${zl}λ: |table − brute| = ${err.toExponential(3)} > ${tol.toExponential(3)} (|E| ${mag.toExponential(3)})`,
            );
          }
        }
      }
    }, 120_000);
  }

  // Limit: a perfect conductor's reflection is the image exactly, so as σ grows the remainder must
  // shrink toward nothing relative to the image (it is O(|ε_c|^−½): the surface-impedance correction).
  it("remainder vanishes relative to the image as σ grows", () => {
    const rho = 0.2 * lambda;
    const Z = 0.1 * lambda;
    const sizes: number[] = [];
    for (const sigma of [0.01, 1, 100]) {
      const ctx = remainderContext({ k0, epsRe: 10, epsIm: -sigma / (omega * EPS0) });
      const I = new Float64Array(10);
      remainderIntegrals(ctx, rho, Z, I);
      const img = kappaImage(k0, [1, 0], [rho, 0, Z], [0, 0, 1]);
      sizes.push(Math.hypot(I[6], I[7]) / Math.hypot(img[2][0], img[2][1]));
    }
    expect(sizes[1]).toBeLessThan(sizes[0]);
    expect(sizes[2]).toBeLessThan(sizes[1]);
    expect(sizes[2]).toBeLessThan(0.02);
  });

  // Far from the source and away from grazing the reflected field is the image weighted by the Fresnel
  // coefficients (geometrical optics; Balanis AEE §5.3, Collin, Antennas and Radiowave Propagation): for a
  // vertical element the θ-field is R_v times the perfect image's. At k0R′ ≈ 60 the error is O(1/k0R′).
  it("tends to the Fresnel-weighted image far away (vertical element, ψ = 40°)", () => {
    const eps: C = [13, -0.005 / (omega * EPS0)];
    const ctx = remainderContext({ k0, epsRe: eps[0], epsIm: eps[1] });
    const R = 10 * lambda;
    const psi = (40 * Math.PI) / 180;
    const rho = R * Math.cos(psi);
    const Z = R * Math.sin(psi);
    const I = new Float64Array(10);
    remainderIntegrals(ctx, rho, Z, I);
    const img = kappaImage(k0, [1, 0], [rho, 0, Z], [0, 0, 1]);
    const kap = ctx.kap;
    // Total reflected E_z = κ·image + remainder I5; E_ρ = κ·image_ρ + I6.
    const ez = add(mul(kap, img[2]), [I[6], I[7]]);
    const eimg = img[2];
    const ratio = div(ez, eimg);
    // Fresnel R_v at ψ (solver/ground/fresnel.ts formula, written out again here).
    const s = Math.sin(psi);
    const q = sqrtC([eps[0] - Math.cos(psi) ** 2, eps[1]]);
    const rv = div(sub(mul(eps, [s, 0]), q), add(mul(eps, [s, 0]), q));
    expect(Math.hypot(ratio[0] - rv[0], ratio[1] - rv[1])).toBeLessThan(0.03);
  });
});
