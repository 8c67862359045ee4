import { describe, expect, it } from "vitest";
import { fresnel } from "../../../solver/ground/fresnel";

const omega = 2 * Math.PI * 14e6;
const mag = (re: number, im: number) => Math.hypot(re, im);

describe("Fresnel reflection coefficients", () => {
  // Limits from Balanis, Advanced Engineering Electromagnetics, 2nd ed., §5.3 (PEC: Γ_TE = −1, Γ_TM = +1).
  it("approach the perfect-conductor values as σ grows", () => {
    const r = fresnel(13, 1e9, omega, Math.PI / 6);
    expect(r.rhRe).toBeCloseTo(-1, 4);
    expect(r.rvRe).toBeCloseTo(1, 4);
    expect(Math.abs(r.rhIm) + Math.abs(r.rvIm)).toBeLessThan(1e-4);
  });

  // Same source: at grazing incidence both coefficients tend to −1 for any finite ground.
  it("tend to −1 at grazing incidence", () => {
    const r = fresnel(13, 0.005, omega, 1e-7);
    expect(r.rhRe).toBeCloseTo(-1, 5);
    expect(r.rvRe).toBeCloseTo(-1, 5);
  });

  // Lossless dielectric: R_v vanishes at the Brewster angle tanψ_B = 1/√ε_r (measured from the surface,
  // ψ_B = atan(1/√ε_r)); Balanis AEE §5.3.4. With loss the zero becomes a dip (pseudo-Brewster).
  it("R_v dips to zero at the Brewster angle of a lossless dielectric, and dips near it when lossy", () => {
    const er = 13;
    const psiB = Math.atan(1 / Math.sqrt(er));
    const lossless = fresnel(er, 0, omega, psiB);
    expect(mag(lossless.rvRe, lossless.rvIm)).toBeLessThan(1e-12);
    const at = (psi: number) => {
      const r = fresnel(er, 0.005, omega, psi);
      return mag(r.rvRe, r.rvIm);
    };
    let best = 0;
    let bestMag = Number.POSITIVE_INFINITY;
    for (let d = 0.1; d < 90; d += 0.1) {
      const m = at((d * Math.PI) / 180);
      if (m < bestMag) {
        bestMag = m;
        best = d;
      }
    }
    expect(bestMag).toBeLessThan(0.6);
    expect(best).toBeGreaterThan(5);
    expect(best).toBeLessThan(30);
  });

  // Normal incidence: R_h = (1 − √ε)/(1 + √ε) and R_v = −R_h (both from the formulas above with ψ = 90°).
  it("match the normal-incidence formula", () => {
    const r = fresnel(4, 0, omega, Math.PI / 2);
    expect(r.rhRe).toBeCloseTo((1 - 2) / (1 + 2), 12);
    expect(r.rvRe).toBeCloseTo(-(1 - 2) / (1 + 2), 12);
  });
});
