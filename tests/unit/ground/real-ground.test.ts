/**
 * Whole-solver checks of real ground (solveModel with the real-ground kernel). Small models, one
 * frequency each, coarse pattern grids where only the peak or the integral matters.
 */
import { describe, expect, it } from "vitest";
import { groundLossWatts } from "../../../solver/ground/ground-loss";
import { realGroundKernel } from "../../../solver/ground/real";
import { prepareModel, solveModel } from "../../../solver/index";
import type { GroundConnection, GroundInput, WireModel } from "../../../solver/model/types";

const hooks = { realGround: realGroundKernel };
const MHZ = 14.2;
const LAMBDA = 299.792458 / MHZ;
const AVERAGE: GroundInput = { kind: "real", conductivity: 0.005, permittivity: 13 };

function dipole(heightWl: number, ground: GroundInput): WireModel {
  const L = 0.48 * LAMBDA;
  const h = heightWl * LAMBDA;
  return {
    wires: [
      {
        id: "d",
        points: [
          [-L / 2, 0, h],
          [L / 2, 0, h],
        ],
        radius: 0.001,
        segments: 21,
      },
    ],
    feed: { wire: "d", at: 0.5 },
    ground,
    frequenciesMHz: [MHZ],
  };
}
const solve1 = (m: WireModel, step = 3) => {
  const r = solveModel(m, { patternStepDeg: step }, hooks);
  return { ...r.results[0], method: r.groundMethod, mesh: r.mesh };
};
const rel = (a: [number, number], b: [number, number]) =>
  Math.hypot(a[0] - b[0], a[1] - b[1]) / Math.hypot(b[0], b[1]);

describe("real ground in the solver", () => {
  // Energy conservation in the upper half-space: accepted = space-wave power through a large hemisphere
  // (far field, solver/fields) + power through the plane z = 0 (spectral Poynting flux of the solved
  // currents, solver/ground/ground-loss.ts) — two computations that share nothing with the Sommerfeld fill.
  // Issue requirement: within 1 %.
  it("closes the power balance for a low dipole over average ground (Sommerfeld)", () => {
    const r = solve1(dipole(0.1, { ...AVERAGE, method: "sommerfeld" }), 2);
    expect(r.method).toBe("sommerfeld");
    const ground = groundLossWatts(r.mesh, r.segmentCurrents, MHZ * 1e6, {
      permittivity: 13,
      conductivity: 0.005,
    });
    const sum = r.power.radiated + ground + r.power.wireLoss;
    expect(Math.abs(sum - r.power.accepted)).toBeLessThan(0.01);
    expect(r.efficiency).toBeLessThan(0.9);
  }, 60_000);

  // The case the rigorous method exists for: a wire a few centimetres above the soil (image distance
  // far below the segment length). Balance and segmentation convergence both.
  it("closes the power balance for a wire 3 cm above the soil, and converges with segmentation", () => {
    const L = 0.48 * LAMBDA;
    const at = (segments: number) =>
      solve1(
        {
          wires: [
            {
              id: "d",
              points: [
                [-L / 2, 0, 0.03],
                [L / 2, 0, 0.03],
              ],
              radius: 0.001,
              segments,
            },
          ],
          feed: { wire: "d", at: 0.5 },
          ground: AVERAGE,
          frequenciesMHz: [MHZ],
        },
        2,
      );
    const r = at(21);
    expect(r.method).toBe("sommerfeld");
    const ground = groundLossWatts(r.mesh, r.segmentCurrents, MHZ * 1e6, {
      permittivity: 13,
      conductivity: 0.005,
    });
    expect(Math.abs(r.power.radiated + ground - r.power.accepted)).toBeLessThan(0.01);
    expect(rel(r.impedance, at(41).impedance)).toBeLessThan(0.02);
  }, 60_000);

  // Same balance for a wire slanted at 45°, low over the ground: exercises the vertical and the
  // horizontal–vertical cross terms of the reflected dyadic, which a horizontal dipole never touches.
  it("closes the power balance for a slanted wire (Sommerfeld)", () => {
    const L = 0.48 * LAMBDA;
    const z0 = 0.05 * LAMBDA;
    const r = solve1(
      {
        wires: [
          {
            id: "s",
            points: [
              [0, 0, z0],
              [L / Math.SQRT2, 0, z0 + L / Math.SQRT2],
            ],
            radius: 0.001,
            segments: 22,
          },
        ],
        feed: { wire: "s", at: 0.5 },
        ground: { ...AVERAGE, method: "sommerfeld" },
        frequenciesMHz: [MHZ],
      },
      2,
    );
    const ground = groundLossWatts(r.mesh, r.segmentCurrents, MHZ * 1e6, {
      permittivity: 13,
      conductivity: 0.005,
    });
    expect(Math.abs(r.power.radiated + ground + r.power.wireLoss - r.power.accepted)).toBeLessThan(0.01);
  }, 60_000);

  // Band sweeps interpolate the reflected terms from three full fills (Newman 1988, as the engine does
  // for free space); over real ground that must reproduce point-by-point fills (engine's bound: 1e-3).
  it("band-interpolated sweeps over real ground match full fills", () => {
    const p = prepareModel(dipole(0.07, { ...AVERAGE, method: "sommerfeld" }), { patternStepDeg: 0 }, hooks);
    const fs = [13.9, 14.0, 14.1, 14.2, 14.3, 14.4].map((m) => m * 1e6);
    const a = p.solveSweep(fs, { interpolate: true });
    const b = p.solveSweep(fs, { interpolate: false });
    for (let i = 0; i < fs.length; i++) expect(rel(a[i].impedance, b[i].impedance)).toBeLessThan(1e-3);
  }, 60_000);

  // Issue requirement: where both methods are valid (about 0.25 λ up) they agree — impedance within 3 %,
  // peak gain within 0.3 dB.
  it("reflection and Sommerfeld agree for a dipole a quarter wave up", () => {
    const a = solve1(dipole(0.25, { ...AVERAGE, method: "reflection" }));
    const b = solve1(dipole(0.25, { ...AVERAGE, method: "sommerfeld" }));
    expect(rel(a.impedance, b.impedance)).toBeLessThan(0.03);
    expect(Math.abs(a.peakGainDbi - b.peakGainDbi)).toBeLessThan(0.3);
  }, 60_000);

  // As σ grows, real ground must become the perfect ground (Fresnel limits R_v → 1, R_h → −1).
  it("reflection method over a near-perfect conductor reproduces perfect ground", () => {
    const p = solve1(dipole(0.2, { kind: "perfect" }));
    const r = solve1(dipole(0.2, { kind: "real", conductivity: 1e9, permittivity: 1, method: "reflection" }));
    expect(rel(r.impedance, p.impedance)).toBeLessThan(1e-4);
    expect(Math.abs(r.peakGainDbi - p.peakGainDbi)).toBeLessThan(0.01);
    expect(r.efficiency).toBeGreaterThan(0.999);
  });

  // The approach is slow — the loss of a good conductor under a low wire scales like its surface
  // resistance √(ωμ₀/2σ) — so the check is monotone convergence plus closeness at σ = 0.5 S/m, 0.2 λ up.
  it("Sommerfeld results approach perfect ground as σ grows", () => {
    const p = solve1(dipole(0.2, { kind: "perfect" }));
    const errs = [0.005, 0.05, 0.5].map((s) => {
      const r = solve1(
        dipole(0.2, { kind: "real", conductivity: s, permittivity: 10, method: "sommerfeld" }),
      );
      return { z: rel(r.impedance, p.impedance), loss: 1 - r.efficiency };
    });
    expect(errs[1].z).toBeLessThan(errs[0].z);
    expect(errs[2].z).toBeLessThan(errs[1].z);
    expect(errs[2].loss).toBeLessThan(errs[1].loss);
    expect(errs[1].loss).toBeLessThan(errs[0].loss);
    expect(errs[2].z).toBeLessThan(0.05);
  }, 60_000);

  // Trade fact (common practice, no published source): a half-wave dipole low over average ground has a
  // higher feed resistance than over perfect ground, and loses more to the ground the lower it is.
  it("a low dipole over average ground: higher feed resistance, more ground loss lower down", () => {
    const perfect = solve1(dipole(0.08, { kind: "perfect" }), 0);
    const low = solve1(dipole(0.08, AVERAGE));
    const higher = solve1(dipole(0.2, AVERAGE));
    expect(low.method).toBe("sommerfeld"); // "auto": a wire within 0.1 λ of the ground
    expect(low.impedance[0]).toBeGreaterThan(perfect.impedance[0]);
    expect(1 - low.efficiency).toBeGreaterThan(1 - higher.efficiency);
    expect(1 - higher.efficiency).toBeGreaterThan(0.2); // more than 1 dB lost at 0.2 λ
  }, 60_000);

  // Trade fact (common practice, no published source): a metal mast about λ/4 tall beside a dipole
  // carries strong currents when well grounded and far less when insulated or merely standing on the
  // soil. The mast stands near one end of the dipole (where the dipole's field has a vertical part).
  it("orders grounded-mast models: insulated < contact < rod < ideal in mast current and loss", () => {
    const f = 7.1;
    const lam = 299.792458 / f;
    const L = 0.48 * lam;
    const H = 0.25 * lam;
    const run = (z0: number, conn?: GroundConnection) => {
      const r = solveModel(
        {
          wires: [
            {
              id: "d",
              points: [
                [-L / 2, 0, 10],
                [L / 2, 0, 10],
              ],
              radius: 0.001,
              segments: 21,
            },
            {
              id: "mast",
              points: [
                [L / 2 - 1.5, 2, z0],
                [L / 2 - 1.5, 2, H],
              ],
              radius: 0.02,
              segments: 11,
              ...(conn ? { groundConnection: conn } : {}),
            },
          ],
          feed: { wire: "d", at: 0.5 },
          ground: AVERAGE,
          frequenciesMHz: [f],
        },
        { patternStepDeg: 3 },
        hooks,
      );
      const x = r.results[0];
      return { current: x.currents.find((c) => c.wire === "mast")?.peakAmps ?? 0, loss: 1 - x.efficiency };
    };
    const insulated = run(0.1);
    const contact = run(0, "contact");
    const rod = run(0, { rod: { length: 2.4, radius: 0.008 } });
    const ideal = run(0, "ideal");
    expect(insulated.current).toBeLessThan(contact.current);
    expect(contact.current).toBeLessThan(rod.current);
    expect(rod.current).toBeLessThan(ideal.current);
    // Loss rises in the same order (measured: 24.1 / 25.4 / 33.3 / 34.2 %). Rod and ideal are close: a
    // series resistance in a resonant parasite dissipates most when it matches the mast's own
    // resistance, so a rod of ~10 Ω would lose slightly more than the ideal tie; the 2.4 m rod here is
    // ~46 Ω at 7.1 MHz (a line in the soil, connection.ts), past that peak.
    expect(insulated.loss).toBeLessThan(contact.loss);
    expect(contact.loss).toBeLessThan(rod.loss);
    expect(rod.loss).toBeLessThan(ideal.loss);
  }, 60_000);

  // A ground-mounted λ/4 vertical with no radials, fed at its base against its ground connection.
  // Over perfect ground it is the textbook monopole: by image theory half the half-wave dipole's
  // 73 + j42.5 Ω, so R ≈ 36.5 Ω (Balanis, Antenna Theory, 4th ed., §4.7 on images and §4.6 for the
  // dipole; section numbers from memory), with its peak on the horizon. Over lossy ground the space wave
  // vanishes along the horizon (R_v → −1 at grazing, Balanis AEE §5.3), so the peak lifts off; fed against
  // a bare contact it is very inefficient (common practice, no published source: "a few per cent"; the
  // rigorous contact gives 0.07 % for this 1 mm wire, 0.75 % for 1 cm and 1.8 % for a 25 mm tube — the
  // hemisphere of the wire's radius sets it), better with a rod, best with an ideal connection.
  it("ground-mounted quarter-wave vertical: perfect, ideal, rod, bare contact", () => {
    const f = 7.1;
    const H = 0.25 * (299.792458 / f);
    const run = (ground: GroundInput, conn?: GroundConnection) => {
      const r = solveModel(
        {
          wires: [
            {
              id: "v",
              points: [
                [0, 0, 0],
                [0, 0, H],
              ],
              radius: 0.001,
              segments: 15,
              ...(conn ? { groundConnection: conn } : {}),
            },
          ],
          feed: { wire: "v", at: 0 },
          ground,
          frequenciesMHz: [f],
        },
        { patternStepDeg: 3 },
        hooks,
      );
      return { ...r.results[0], method: r.groundMethod };
    };
    const perfect = run({ kind: "perfect" });
    expect(perfect.impedance[0]).toBeGreaterThan(33);
    expect(perfect.impedance[0]).toBeLessThan(42); // finite radius and length: a few ohms above 36.5
    expect(perfect.peakElevationDeg).toBeLessThan(5);
    const ideal = run(AVERAGE, "ideal");
    const rod = run(AVERAGE, { rod: { length: 2.4, radius: 0.008 } });
    const contact = run(AVERAGE, "contact");
    expect(contact.method).toBe("sommerfeld"); // auto: the wire touches the ground
    expect(ideal.peakElevationDeg).toBeGreaterThan(10);
    expect(contact.efficiency).toBeLessThan(0.05);
    expect(contact.efficiency).toBeLessThan(rod.efficiency);
    expect(rod.efficiency).toBeLessThan(ideal.efficiency);
    expect(ideal.efficiency).toBeLessThan(perfect.efficiency);
    // The peak lifts off the ground as σ falls (same εr): the pseudo-Brewster angle rises.
    const good = run({ kind: "real", conductivity: 0.05, permittivity: 13 }, "ideal");
    const poor = run({ kind: "real", conductivity: 0.002, permittivity: 13 }, "ideal");
    expect(poor.peakElevationDeg).toBeGreaterThan(good.peakElevationDeg);
  }, 60_000);
});
