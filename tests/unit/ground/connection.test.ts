import { describe, expect, it } from "vitest";
import {
  connectionImpedance,
  connectionResistance,
  dwightRodResistance,
} from "../../../solver/ground/connection";
import { ModelError } from "../../../solver/model/errors";

describe("ground connection resistance", () => {
  // Dwight, AIEE Trans. 1936: R = ρ/(2πL)(ln(4L/a) − 1). Worked by hand: ρ = 200 Ω·m, L = 2.4 m, a = 8 mm:
  // 4L/a = 1200, ln 1200 = 7.090077, − 1 = 6.090077; 200/(2π·2.4) = 13.262912; product 80.772 Ω.
  it("matches a hand-worked Dwight rod value", () => {
    expect(dwightRodResistance(200, 2.4, 0.008)).toBeCloseTo(80.772, 2);
    const r = connectionResistance({ rod: { length: 2.4, radius: 0.008 } }, 1 / 200, 0.001, "wires[0]");
    expect(r.model).toBe("dwight-rod");
    expect(r.ohms).toBeCloseTo(80.772, 2);
    expect(r.label).toMatch(/Dwight 1936.*Sunde 1949.*estimate/);
  });

  // The commonly quoted figure for a 10 ft, 5/8 in rod in 100 Ω·m soil is about 33 Ω (electrical
  // practice, from memory); Dwight's formula gives 33.09 Ω for L = 3.048 m, a = 7.94 mm.
  it("gives the familiar ~33 Ω for a 10 ft rod in 100 Ω·m soil", () => {
    expect(dwightRodResistance(100, 3.048, 0.00794)).toBeCloseTo(33.09, 1);
  });

  // Hemisphere of radius a on a half-space: R = ρ/(2πa) (textbook electrode result). ρ = 200, a = 1 mm:
  // 200/(2π·0.001) = 31 831 Ω by hand.
  it("estimates a bare contact as a hemisphere of the wire radius", () => {
    const r = connectionResistance("contact", 1 / 200, 0.001, "wires[0]");
    expect(r.model).toBe("contact-hemisphere");
    expect(r.ohms).toBeCloseTo(31831, 0);
  });

  it("orders ideal < rod < contact for the same soil", () => {
    const s = 0.005;
    const ideal = connectionResistance("ideal", s, 0.002, "w").ohms;
    const rod = connectionResistance({ rod: { length: 2.4, radius: 0.008 } }, s, 0.002, "w").ohms;
    const contact = connectionResistance("contact", s, 0.002, "w").ohms;
    expect(ideal).toBe(0);
    expect(rod).toBeGreaterThan(ideal);
    expect(contact).toBeGreaterThan(rod);
    expect(connectionResistance({ ohms: 25 }, s, 0.002, "w").ohms).toBe(25);
  });

  it("names the field for bad input", () => {
    const path = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        expect(e).toBeInstanceOf(ModelError);
        return (e as ModelError).path;
      }
      return "no error";
    };
    expect(
      path(() =>
        connectionResistance(
          { rod: { length: -1, radius: 0.01 } },
          0.005,
          0.001,
          "wires[2].groundConnection",
        ),
      ),
    ).toBe("wires[2].groundConnection.rod.length");
    expect(path(() => connectionResistance({ ohms: Number.NaN }, 0.005, 0.001, "w.gc"))).toBe("w.gc.ohms");
    expect(path(() => connectionResistance("contact", 0.005, 0, "w.gc"))).toBe("w.gc");
  });
});

describe("connection impedance at HF", () => {
  // Quasi-static electrode in a lossy dielectric: σ → σ + jωε₀ε_r in the d.c. formula. When
  // σ = ωε₀ε_r the impedance is R_dc/(1 + j) = R_dc (1 − j)/2: magnitude R/√2 at −45° (worked by hand).
  it("scales the d.c. value by σ/(σ + jωε₀ε_r)", () => {
    const eps0 = 8.8541878128e-12;
    const er = 13;
    const sigma = 0.005;
    const omega = sigma / (eps0 * er);
    const rdc = connectionResistance("contact", sigma, 0.002, "w").ohms;
    const z = connectionImpedance(
      "contact",
      { conductivity: sigma, permittivity: er },
      omega,
      0.002,
      "w",
    ).ohms;
    expect(z[0]).toBeCloseTo(rdc / 2, 6);
    expect(z[1]).toBeCloseTo(-rdc / 2, 6);
    // Far below that frequency the soil is a plain conductor again.
    const lf = connectionImpedance(
      { rod: { length: 2.4, radius: 0.008 } },
      { conductivity: sigma, permittivity: er },
      omega * 1e-6,
      0.002,
      "w",
    ).ohms;
    expect(lf[0]).toBeCloseTo(dwightRodResistance(200, 2.4, 0.008), 4);
    // A stated resistance is taken as given.
    expect(
      connectionImpedance({ ohms: 25 }, { conductivity: sigma, permittivity: er }, omega, 0.002, "w").ohms,
    ).toEqual([25, 0]);
  });

  // The rod at HF as a lossy line in the soil (Sunde, Earth Conduction Effects in Transmission Systems,
  // 1949 — line parameters from memory). Check the closed form Z₀ coth(γL) against an independent
  // integration of the telegrapher's equations dV/dz = −Z′I, dI/dz = −Y′V (RK4, 4000 steps) from the open
  // tip (I = 0) up to the top, with Z′ = jωμ₀Λ/2π and Y′ = 2π(σ + jωε₀ε_r)/Λ, Λ = ln(4L/a) − 1; and its
  // d.c. limit against Dwight's formula.
  it("treats a rod at HF as a lossy line in the soil, Dwight's value at d.c.", () => {
    const mu0 = 1.25663706212e-6;
    const eps0 = 8.8541878128e-12;
    type Cx = [number, number];
    const mul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
    const add = (a: Cx, b: Cx, s = 1): Cx => [a[0] + s * b[0], a[1] + s * b[1]];
    for (const [L, a, sigma, er, f] of [
      [2.4, 0.008, 0.005, 13, 7.1e6],
      [2.4, 0.008, 0.005, 13, 14.2e6],
      [1.2, 0.006, 0.001, 5, 3.6e6],
      [3.0, 0.008, 0.03, 30, 28e6],
    ]) {
      const w = 2 * Math.PI * f;
      const lam = Math.log((4 * L) / a) - 1;
      const zp: Cx = [0, (w * mu0 * lam) / (2 * Math.PI)];
      const yp: Cx = [(2 * Math.PI * sigma) / lam, (2 * Math.PI * w * eps0 * er) / lam];
      const n = 4000;
      const h = L / n;
      let v: Cx = [1, 0];
      let i: Cx = [0, 0];
      // From the tip upward: z runs from the tip, d/dz V = Z′ I and d/dz I = Y′ V toward the top.
      const deriv = (vv: Cx, ii: Cx): [Cx, Cx] => [mul(zp, ii), mul(yp, vv)];
      for (let s = 0; s < n; s++) {
        const [a1, b1] = deriv(v, i);
        const [a2, b2] = deriv(add(v, a1, h / 2), add(i, b1, h / 2));
        const [a3, b3] = deriv(add(v, a2, h / 2), add(i, b2, h / 2));
        const [a4, b4] = deriv(add(v, a3, h), add(i, b3, h));
        v = add(v, add(add(a1, a4), add(a2, a3), 2), h / 6);
        i = add(i, add(add(b1, b4), add(b2, b3), 2), h / 6);
      }
      const d = i[0] * i[0] + i[1] * i[1];
      const want: Cx = [(v[0] * i[0] + v[1] * i[1]) / d, (v[1] * i[0] - v[0] * i[1]) / d];
      const got = connectionImpedance(
        { rod: { length: L, radius: a } },
        { conductivity: sigma, permittivity: er },
        w,
        0.002,
        "w",
      ).ohms;
      expect(Math.hypot(got[0] - want[0], got[1] - want[1]) / Math.hypot(...want)).toBeLessThan(1e-8);
    }
    const dc = connectionImpedance(
      { rod: { length: 2.4, radius: 0.008 } },
      { conductivity: 0.005, permittivity: 13 },
      2 * Math.PI * 50,
      0.002,
      "w",
    ).ohms;
    expect(dc[0]).toBeCloseTo(dwightRodResistance(200, 2.4, 0.008), 3);
    expect(Math.abs(dc[1])).toBeLessThan(1e-3);
  });
});
