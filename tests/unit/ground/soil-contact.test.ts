/**
 * A bare wire end on lossy soil, solved rigorously (solver/mom/soil-contact.ts): the current entering
 * the soil as a point source at the surface, with the Sommerfeld ground.
 */
import { describe, expect, it } from "vitest";
import { prepareInternal, prepareModel, solveModel } from "../../../solver/index";
import { EPS0 } from "../../../solver/model/constants";
import type { GroundInput, WireModel } from "../../../solver/model/types";
import { contactSelfImpedance, type SoilContactNode } from "../../../solver/mom/soil-contact";

const C0 = 299_792_458;
const AVERAGE: GroundInput = { kind: "real", conductivity: 0.005, permittivity: 13 };

/** Hemisphere of radius a at the surface of a half-space, the air side included: 1/(2πa(σ + jωε₀(1 + ε_r))). */
function hemisphere(a: number, sigma: number, epsR: number, f: number): [number, number] {
  const g = 2 * Math.PI * a * sigma;
  const b = 2 * Math.PI * a * 2 * Math.PI * f * EPS0 * (1 + epsR);
  const d = g * g + b * b;
  return [g / d, -b / d];
}

function vertical(
  f: number,
  radius: number,
  ground: GroundInput,
  conn: "contact" | "ideal",
  segs = 15,
): WireModel {
  const H = (0.25 * C0) / (f * 1e6);
  return {
    wires: [
      {
        id: "v",
        points: [
          [0, 0, 0],
          [0, 0, H],
        ],
        radius,
        segments: segs,
        groundConnection: conn,
      },
    ],
    feed: { wire: "v", at: 0 },
    ground,
    frequenciesMHz: [f],
  };
}

describe("bare contact on lossy soil (rigorous)", () => {
  // The self term of the contact's charge is the spreading impedance of a hemisphere of the wire's
  // radius. At d.c. that is ρ/(2πa) (Tagg, Earth Resistances, 1964; the textbook hemisphere electrode);
  // at HF the displacement current of soil and air adds in parallel: a point charge on the boundary of
  // two dielectrics has the potential q/(2π(ε₁ + ε₂)R) (method of images, Jackson, Classical
  // Electrodynamics, 3rd ed., §4.4 — from memory), here with ε₂ = ε₀ε_c.
  it("its own term is the hemisphere's spreading impedance, ρ/(2πa) at low frequency", () => {
    for (const [fHz, sigma, epsR, a] of [
      [1e4, 0.01, 10, 0.01],
      [7.1e6, 0.005, 13, 0.001],
      [14.2e6, 0.002, 5, 0.025],
    ]) {
      const omega = 2 * Math.PI * fHz;
      const k = omega / C0;
      const epsIm = -sigma / (omega * EPS0);
      // 1 − κ = 2/(ε_c + 1)
      const dr = epsR + 1;
      const den = dr * dr + epsIm * epsIm;
      const factor = [(2 * dr) / den, (-2 * epsIm) / den];
      const node: SoilContactNode = { wire: 0, basis: 0, divergence: 1, x: 0, y: 0, z: 0, radius: a };
      const out = new Float64Array(2);
      contactSelfImpedance(node, factor, { frequencyHz: fHz, omega, k, eta: 376.730313 }, out);
      const want = hemisphere(a, sigma, epsR, fHz);
      // The point charge's own term carries the retardation e^{−jka} across the radius; the
      // quasi-static formula does not: they differ by O(ka).
      const ka = k * a;
      expect(Math.hypot(out[0] - want[0], out[1] - want[1]) / Math.hypot(...want)).toBeLessThan(
        1e-4 + 1.1 * ka,
      );
      if (fHz < 1e5) expect(out[0]).toBeCloseTo(1 / (sigma * 2 * Math.PI * a), -1); // ρ/(2πa) = 1591.5 Ω
    }
  });

  // A λ/4 vertical fed against its bare contact: the feed sees the antenna (as with an ideal connection)
  // plus, in series, about the hemisphere impedance — the charge the current leaves in the soil also
  // acts on the wire's own nearby charge, a correction of order (a/ℓ)·ln(ℓ/a) for segment length ℓ.
  it("puts about the hemisphere impedance in series with the antenna", () => {
    for (const a of [0.001, 0.01]) {
      const f = 7.1;
      const contact = solveModel(vertical(f, a, AVERAGE, "contact"), { patternStepDeg: 0 });
      const ideal = solveModel(vertical(f, a, AVERAGE, "ideal"), { patternStepDeg: 0 });
      expect(contact.groundMethod).toBe("sommerfeld");
      const dz: [number, number] = [
        contact.results[0].impedance[0] - ideal.results[0].impedance[0],
        contact.results[0].impedance[1] - ideal.results[0].impedance[1],
      ];
      const want = hemisphere(a, 0.005, 13, f * 1e6);
      expect(Math.hypot(dz[0] - want[0], dz[1] - want[1]) / Math.hypot(...want)).toBeLessThan(0.05);
    }
  });

  // Convergence (a numerical property, no outside source): the contact's terms are integrals of the
  // same charges the fill already carries, so doubling the segments moves the answer little.
  it("converges with segmentation", () => {
    const z = (segs: number) =>
      solveModel(vertical(7.1, 0.01, AVERAGE, "contact", segs), { patternStepDeg: 0 }).results[0].impedance;
    const a = z(15);
    const b = z(31);
    expect(Math.hypot(a[0] - b[0], a[1] - b[1]) / Math.hypot(...b)).toBeLessThan(0.01);
  });

  // Image theory: over a perfect conductor every connection is ideal (Balanis, Antenna Theory, 4th ed.,
  // §4.7). As σ grows, 1 − κ → 0 and the contact must approach the perfect-ground monopole.
  it("approaches the perfect-ground monopole as σ grows", () => {
    const f = 14.2;
    const perfect = solveModel(vertical(f, 0.005, { kind: "perfect" }, "contact"), { patternStepDeg: 0 })
      .results[0].impedance;
    let last = Number.POSITIVE_INFINITY;
    for (const sigma of [0.05, 0.5, 5]) {
      const z = solveModel(
        vertical(
          f,
          0.005,
          { kind: "real", conductivity: sigma, permittivity: 13, method: "sommerfeld" },
          "contact",
        ),
        { patternStepDeg: 0 },
      ).results[0].impedance;
      const err = Math.hypot(z[0] - perfect[0], z[1] - perfect[1]) / Math.hypot(...perfect);
      expect(err).toBeLessThan(last);
      last = err;
    }
    // At σ = 5 S/m the 5 mm contact is still ρ/(2πa) ≈ 6.4 Ω in series, and the ideal point itself sits
    // ~5 % from perfect ground (the soil's near-field loss).
    expect(last).toBeLessThan(0.25);
  }, 60_000);

  // Reciprocity (Harrington, Field Computation by Moment Methods, 1968: Galerkin on a reciprocal
  // medium gives a symmetric matrix) holds with the contact terms; and Newman band interpolation
  // (IEEE Trans. AP-36, 1988) still reproduces full fills with them.
  it("keeps the matrix symmetric and band sweeps interpolable", () => {
    const m = vertical(7.1, 0.01, AVERAGE, "contact");
    m.wires.push({
      id: "d",
      points: [
        [-3, 4, 6],
        [3, 4, 6],
      ],
      radius: 0.001,
      segments: 7,
    });
    // The contact's terms alone: the contact matrix minus the same model with an ideal connection
    // (the rest of the Sommerfeld fill has its own, table-rounding-level asymmetry, ~1e-9).
    const matrix = (model: WireModel) => {
      const z = prepareInternal(model, { patternStepDeg: 0 }).internals.solver.matrixAt(7.1e6);
      return { re: Float64Array.from(z.re), im: Float64Array.from(z.im), n: z.n };
    };
    const withContact = matrix(m);
    const ideal = matrix({ ...m, wires: [{ ...m.wires[0], groundConnection: "ideal" }, m.wires[1]] });
    const { n } = ideal;
    const dre = withContact.re.map((v, i) => v - ideal.re[i]);
    const dim = withContact.im.map((v, i) => v - ideal.im[i]);
    let worst = 0;
    let scale = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        worst = Math.max(
          worst,
          Math.abs(dre[i * n + j] - dre[j * n + i]),
          Math.abs(dim[i * n + j] - dim[j * n + i]),
        );
        scale = Math.max(scale, Math.abs(dre[i * n + j]), Math.abs(dim[i * n + j]));
      }
    }
    expect(scale).toBeGreaterThan(100); // the hemisphere term of a 1 cm contact: ~2 kΩ
    expect(worst / scale).toBeLessThan(1e-12);
    const p = prepareModel(m, { patternStepDeg: 0 });
    const fs = Array.from({ length: 9 }, (_, i) => (6.9 + 0.05 * i) * 1e6);
    const a = p.solveSweep(fs);
    const b = p.solveSweep(fs, { interpolate: false });
    for (let i = 0; i < fs.length; i++) {
      const e = Math.hypot(a[i].impedance[0] - b[i].impedance[0], a[i].impedance[1] - b[i].impedance[1]);
      expect(e / Math.hypot(...b[i].impedance)).toBeLessThan(1e-3);
    }
  });

  // Without a far field the budget books the contact's own dissipation as ground loss, so a vertical
  // on a bare contact is not reported as efficient when only impedances are asked for.
  it("books the contact's dissipation without a pattern", () => {
    const r = solveModel(vertical(7.1, 0.01, AVERAGE, "contact"), { patternStepDeg: 0 }).results[0];
    const withPattern = solveModel(vertical(7.1, 0.01, AVERAGE, "contact"), { patternStepDeg: 3 }).results[0];
    expect(r.power.groundLoss).toBeGreaterThan(0.9);
    // The far-field budget (everything not radiated) is larger still: it adds the soil's near-field loss.
    expect(withPattern.power.groundLoss).toBeGreaterThanOrEqual(r.power.groundLoss - 0.01);
  });

  it("says how the contact was solved", () => {
    const { internals } = prepareInternal(vertical(7.1, 0.01, AVERAGE, "contact"), { patternStepDeg: 0 });
    expect(internals.ground.connectionLabel?.(0)).toMatch(/Sommerfeld/);
    const refl = prepareInternal(
      vertical(7.1, 0.01, { ...AVERAGE, method: "reflection" } as GroundInput, "contact"),
      { patternStepDeg: 0 },
    );
    expect(refl.internals.ground.connectionLabel?.(0)).toMatch(/low-frequency estimate/);
  });
});
