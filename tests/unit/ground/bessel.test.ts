import { describe, expect, it } from "vitest";
import { besselJ0, besselJ1, besselJ2 } from "../../../solver/ground/bessel";

describe("Bessel J0, J1, J2 of real argument", () => {
  // Tabulated values, Abramowitz & Stegun Table 9.1 (to 9 places).
  it("match the tables", () => {
    const cases: [number, number, number, number][] = [
      [1, 0.765197687, 0.440050586, 0.114903485],
      [2.5, -0.048383776, 0.497094103, 0.446059058],
      [5, -0.177596771, -0.327579138, 0.046565117],
      [10, -0.245935765, 0.043472746, 0.254630314],
    ];
    for (const [x, j0, j1, j2] of cases) {
      expect(Math.abs(besselJ0(x) - j0)).toBeLessThan(2e-7);
      expect(Math.abs(besselJ1(x) - j1)).toBeLessThan(2e-7);
      expect(Math.abs(besselJ2(x) - j2)).toBeLessThan(3e-7);
    }
  });

  // Independent check: Bessel's integral Jn(x) = (1/π)∫₀^π cos(nτ − x sin τ) dτ (A&S 9.1.21), by a
  // fine trapezoid rule (spectrally accurate for this periodic integrand).
  it("agree with Bessel's integral over a range of arguments", () => {
    const bessel = (n: number, x: number) => {
      const m = 400;
      let s = 0;
      for (let i = 0; i < m; i++) {
        const t = (Math.PI * (i + 0.5)) / m;
        s += Math.cos(n * t - x * Math.sin(t));
      }
      return s / m;
    };
    for (let x = 0; x < 40; x += 0.37) {
      expect(Math.abs(besselJ0(x) - bessel(0, x))).toBeLessThan(2e-7);
      expect(Math.abs(besselJ1(x) - bessel(1, x))).toBeLessThan(2e-7);
      expect(Math.abs(besselJ2(x) - bessel(2, x))).toBeLessThan(3e-7);
    }
  });
});
