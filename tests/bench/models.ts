/**
 * Benchmark models. Invented geometry, sized for the benchmark (about 200 unknowns), not taken from any
 * published model: a 20 m-band dipole with drooped ends strung about 10 m up, and two aluminium masts
 * standing a few metres away that couple to it.
 */
import type { GroundInput, WireModel } from "../../solver/model/types";

/**
 * Half-wave at 14.15 MHz is c/(2f) ≈ 10.6 m. The flat top (6.52 m) was trimmed with this solver so the
 * dipole, with its two 2.0 m droops (10.55 m of wire in all) and the masts beside it, resonates near
 * 14.15 MHz; the benchmark then times a realistic near-resonant case.
 * Segment counts are fixed so that the unknown count does not depend on the default segmentation:
 * dipole 121 segments → 120 interior nodes; each mast 40 segments from the ground node → 40 unknowns
 * over ground (the base node carries a half triangle with its image); 200 in all.
 */
export function yardModel(ground: GroundInput, frequenciesMHz: WireModel["frequenciesMHz"]): WireModel {
  return {
    wires: [
      {
        id: "dipole",
        points: [
          [-4.16, 0, 8.2],
          [-3.26, 0, 10],
          [3.26, 0, 10],
          [4.16, 0, 8.2],
        ],
        radius: 0.001, // about AWG 12 (2.05 mm diameter, from memory)
        material: "copper",
        segments: 121,
      },
      {
        id: "mast-west",
        points: [
          [-5.5, 3, 0],
          [-5.5, 3, 5],
        ],
        radius: 0.015,
        material: "aluminium",
        segments: 40,
        groundConnection: "ideal",
      },
      {
        id: "mast-east",
        points: [
          [5.0, -3.5, 0],
          [5.0, -3.5, 5.2],
        ],
        radius: 0.015,
        material: "aluminium",
        segments: 40,
        groundConnection: "ideal",
      },
    ],
    feed: { wire: "dipole", at: 0.5 },
    ground,
    frequenciesMHz,
  };
}

export const PERFECT_GROUND: GroundInput = { kind: "perfect" };
/** "Average ground" in the usual HF sense: σ = 5 mS/m, ε_r = 13 (ITU-R P.527 class, from memory). */
export const AVERAGE_GROUND: GroundInput = { kind: "real", conductivity: 0.005, permittivity: 13 };
