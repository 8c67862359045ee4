/**
 * How a wire end at z = 0 joins a real (lossy) ground, reduced to a lumped series resistance between the
 * wire's end and an ideal connection point (where the perfect-image half triangle would close the current).
 *
 * - "ideal": 0 Ω — as if the soil were a perfect conductor at that point (a modelling idealisation).
 * - { ohms }: the stated resistance.
 * - { rod: { length, radius } }: Dwight's resistance of a driven rod, R = ρ/(2πL)·(ln(4L/a) − 1)
 *   (H. B. Dwight, "Calculation of resistances to ground", AIEE Transactions 55, 1936). A d.c./low-frequency
 *   formula: at HF a rod of a few metres is a sizeable fraction of the wavelength in the soil and its
 *   impedance is complex; we label it a low-frequency estimate wherever it is shown.
 * - "contact": a bare wire end standing on the soil. Under the Sommerfeld method (the default wherever a
 *   wire touches the soil) it is solved in the fill instead (solver/mom/soil-contact.ts: the current
 *   enters the soil as a point source at the surface); what follows is the estimate the "reflection"
 *   method and the d.c. label use. Estimated as the spreading resistance of a
 *   hemispherical electrode of the wire's radius at the surface of a half-space, R = ρ/(2πa) (the
 *   textbook hemisphere result; e.g. Tagg, Earth Resistances, 1964). Also a low-frequency estimate, and a
 *   rough one: the true contact depends on how the end sits in the soil. It is large (tens of kΩ for a
 *   millimetre wire in average soil), which is the physics that matters: a mast merely standing on the soil
 *   behaves almost like an insulated one.
 *
 * ρ = 1/σ. `connectionResistance` gives these d.c. values (what the formulas state). At HF the
 * displacement current in the soil is comparable to the conduction current (σ ≈ ωε₀ε_r for average ground
 * near 7 MHz), so `connectionImpedance` — what the solver uses — replaces σ by σ + jωε₀ε_r in the same
 * quasi-static formulas: Z = R_dc · σ/(σ + jωε₀ε_r), the electrode in a lossy dielectric half-space. Still
 * quasi-static: valid while the electrode is small against the wavelength in the soil (a 2.4 m rod in
 * average ground at 7 MHz is about a quarter of it), hence "estimate" on every label.
 */

import { EPS0 } from "../model/constants";
import { ModelError } from "../model/errors";
import type { GroundConnection } from "../model/types";

export type ConnectionModel = "ideal" | "lumped" | "dwight-rod" | "contact-hemisphere";

export interface ConnectionResistance {
  /** Series resistance between the wire end and the ideal connection point, ohms. */
  ohms: number;
  model: ConnectionModel;
  /** Short human-readable label, including the caveat, for reports and the UI. */
  label: string;
}

/** Dwight's driven-rod resistance, ohms: R = ρ/(2πL)·(ln(4L/a) − 1), ρ in Ω·m, L and a in metres. */
export function dwightRodResistance(resistivity: number, length: number, radius: number): number {
  return (resistivity / (2 * Math.PI * length)) * (Math.log((4 * length) / radius) - 1);
}

/** Spreading resistance of a hemisphere of radius a at the surface of a half-space of resistivity ρ: ρ/(2πa). */
export function hemisphereResistance(resistivity: number, radius: number): number {
  return resistivity / (2 * Math.PI * radius);
}

/**
 * The lumped resistance for one wire end. `wireRadius` is used by "contact"; `conductivity` is the
 * ground's σ in S/m; `path` names the wire's groundConnection in the input, for messages.
 */
export function connectionResistance(
  connection: GroundConnection,
  conductivity: number,
  wireRadius: number,
  path: string,
): ConnectionResistance {
  if (!(conductivity > 0) || !Number.isFinite(conductivity)) {
    throw new ModelError(
      path,
      `a ground connection needs a finite positive ground conductivity (got ${conductivity})`,
    );
  }
  const rho = 1 / conductivity;
  if (connection === "ideal") {
    return { ohms: 0, model: "ideal", label: "ideal connection (soil treated as a perfect conductor here)" };
  }
  if (connection === "contact") {
    if (!(wireRadius > 0) || !Number.isFinite(wireRadius)) {
      throw new ModelError(path, `a bare contact needs a positive wire radius (got ${wireRadius})`);
    }
    const ohms = hemisphereResistance(rho, wireRadius);
    return {
      ohms,
      model: "contact-hemisphere",
      label: `bare contact, ≈${formatOhms(ohms)} (hemisphere spreading resistance, low-frequency estimate)`,
    };
  }
  if ("ohms" in connection) {
    const ohms = connection.ohms;
    if (!Number.isFinite(ohms) || ohms < 0) {
      throw new ModelError(`${path}.ohms`, `expected a finite resistance of at least 0 Ω (got ${ohms})`);
    }
    return { ohms, model: "lumped", label: `${formatOhms(ohms)} lumped connection resistance` };
  }
  if ("rod" in connection) {
    const { length, radius } = connection.rod;
    if (!Number.isFinite(length) || length <= 0) {
      throw new ModelError(`${path}.rod.length`, `expected a positive rod length in metres (got ${length})`);
    }
    if (!Number.isFinite(radius) || radius <= 0) {
      throw new ModelError(`${path}.rod.radius`, `expected a positive rod radius in metres (got ${radius})`);
    }
    if (length < 4 * radius) {
      // ln(4L/a) − 1 < ln 16 − 1 makes the slender-rod formula meaningless well before it turns negative.
      throw new ModelError(
        `${path}.rod`,
        `a rod must be much longer than its radius (length ${length} m, radius ${radius} m)`,
      );
    }
    const ohms = dwightRodResistance(rho, length, radius);
    return {
      ohms,
      model: "dwight-rod",
      label: `${length} m rod, ≈${formatOhms(ohms)} (Dwight 1936, low-frequency estimate)`,
    };
  }
  throw new ModelError(path, "unknown ground connection");
}

/**
 * Series impedance [re, im] (ohms) of a connection at angular frequency ω over ground (σ, ε_r): the d.c.
 * resistance of connectionResistance scaled by σ/(σ + jωε₀ε_r) for the electrode models ("contact", rod);
 * a stated resistance is taken as given; "ideal" is 0.
 */
export function connectionImpedance(
  connection: GroundConnection,
  ground: { conductivity: number; permittivity: number },
  omega: number,
  wireRadius: number,
  path: string,
): { ohms: [number, number]; model: ConnectionModel; label: string } {
  const r = connectionResistance(connection, ground.conductivity, wireRadius, path);
  if (r.model === "ideal" || r.model === "lumped")
    return { ohms: [r.ohms, 0], model: r.model, label: r.label };
  // R σ/(σ + jb) = R σ (σ − jb)/(σ² + b²), b = ωε₀ε_r
  const s = ground.conductivity;
  const b = omega * EPS0 * ground.permittivity;
  const d = s * s + b * b;
  return { ohms: [(r.ohms * s * s) / d, (-r.ohms * s * b) / d], model: r.model, label: r.label };
}

export function formatOhms(ohms: number): string {
  if (ohms >= 1e3) return `${(ohms / 1e3).toPrecision(3)} kΩ`;
  return `${ohms.toPrecision(3)} Ω`;
}
