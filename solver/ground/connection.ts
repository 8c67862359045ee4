/**
 * How a wire end at z = 0 joins a real (lossy) ground, reduced to a lumped series resistance between the
 * wire's end and an ideal connection point (where the perfect-image half triangle would close the current).
 *
 * - "ideal": 0 Ω — as if the soil were a perfect conductor at that point (a modelling idealisation).
 * - { ohms }: the stated resistance.
 * - { rod: { length, radius } }: at d.c. Dwight's resistance of a driven rod, R = ρ/(2πL)·(ln(4L/a) − 1)
 *   (H. B. Dwight, "Calculation of resistances to ground", AIEE Transactions 55, 1936). At HF a rod of a
 *   few metres is a sizeable fraction of the wavelength in the soil (a 2.4 m rod in average ground at
 *   7 MHz: about 0.2 of it), so the solver treats it as a lossy transmission line in the soil, open at
 *   its tip (E. D. Sunde, Earth Conduction Effects in Transmission Systems, 1949, the rod chapter —
 *   parameters from memory): per metre G′ + jωC′ = 2π(σ + jωε₀ε_r)/Λ and L′ = μ₀Λ/(2π), Λ = ln(4L/a) − 1,
 *   so that 1/(G′L) is Dwight's resistance and L′(G′ + jωC′) = jωμ₀(σ + jωε) puts the soil's own
 *   wavenumber on the line. Z_in = Z₀ coth(γL). Still an estimate (the rod's coupling to the wires'
 *   fields above is left out), and labelled so.
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
 * near 7 MHz), so `connectionImpedance` — what the solver uses — replaces σ by σ + jωε₀ε_r: in the
 * hemisphere's quasi-static formula, Z = R_dc · σ/(σ + jωε₀ε_r) (an electrode small against the
 * wavelength in the soil), and in the rod's line parameters above. Hence "estimate" on every label.
 */

import { EPS0, MU0 } from "../model/constants";
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

/**
 * Quasi-static impedance [re, im] of a hemisphere of radius a on a half-space of conductivity σ, with the
 * displacement current of relative permittivity εEff in parallel: 1/(2πa(σ + jωε₀εEff)). εEff = ε_r is the
 * soil alone (the lumped estimate); 1 + ε_r adds the air side (the rigorous contact's own term).
 */
export function hemisphereImpedance(
  radius: number,
  conductivity: number,
  epsEff: number,
  omega: number,
): [number, number] {
  const g = 2 * Math.PI * radius * conductivity;
  const b = 2 * Math.PI * radius * omega * EPS0 * epsEff;
  const d = g * g + b * b;
  return [g / d, -b / d];
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
      label: `${length} m rod, ≈${formatOhms(ohms)} at d.c. (Dwight 1936), at HF a lossy line in the soil (Sunde 1949): an estimate`,
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
  if (r.model === "dwight-rod" && typeof connection === "object" && "rod" in connection) {
    const { length, radius } = connection.rod;
    return { ohms: rodLineImpedance(length, radius, ground, omega), model: r.model, label: r.label };
  }
  // The bare contact: ρ/(2πa) with σ → σ + jωε₀ε_r.
  const ohms = hemisphereImpedance(wireRadius, ground.conductivity, ground.permittivity, omega);
  return { ohms, model: r.model, label: r.label };
}

/**
 * Input impedance [re, im] of a driven rod as a lossy line in the soil, open at its tip (see the header):
 * Z₀ coth(γL) with γ = √(jωμ₀(σ + jωε₀ε_r)) and Z₀ = (Λ/2π)√(jωμ₀/(σ + jωε₀ε_r)), Λ = ln(4L/a) − 1.
 * At ω → 0 it is 1/(G′L), Dwight's resistance.
 */
export function rodLineImpedance(
  length: number,
  radius: number,
  ground: { conductivity: number; permittivity: number },
  omega: number,
): [number, number] {
  const lam = Math.log((4 * length) / radius) - 1;
  const yr = ground.conductivity; // σ + jωε (per unit of 2π/Λ)
  const yi = omega * EPS0 * ground.permittivity;
  const zi = omega * MU0; // jωμ₀
  // γ² = jωμ₀ (σ + jωε) = −ωμ₀ωε + jωμ₀σ
  const [gr, gi] = csqrt(-zi * yi, zi * yr);
  // Z₀ = (Λ/2π) jωμ₀ / γ
  const s = lam / (2 * Math.PI);
  const d = gr * gr + gi * gi;
  const z0r = (s * zi * gi) / d;
  const z0i = (s * zi * gr) / d;
  // coth(x + jy) = (sinh 2x − j sin 2y)/(cosh 2x − cos 2y), x + jy = γL
  const x = 2 * gr * length;
  const y = 2 * gi * length;
  // |γL| (not its real part alone: over nearly lossless soil Re γ is tiny while the line is not short).
  if (Math.hypot(x, y) < 1e-6) {
    // γL → 0 (d.c.): Z₀ coth(γL) → Z₀/(γL) = 1/(G′L), written out to avoid 0/0.
    const g = (2 * Math.PI * yr) / lam;
    return [1 / (g * length), 0];
  }
  const den = Math.cosh(x) - Math.cos(y);
  const cr = Math.sinh(x) / den;
  const ci = -Math.sin(y) / den;
  return [z0r * cr - z0i * ci, z0r * ci + z0i * cr];
}

function csqrt(re: number, im: number): [number, number] {
  const m = Math.hypot(re, im);
  const r = Math.sqrt((m + re) / 2);
  const i = Math.sqrt(Math.max(0, (m - re) / 2));
  return [r, im < 0 ? -i : i];
}

export function formatOhms(ohms: number): string {
  if (ohms >= 1e3) return `${(ohms / 1e3).toPrecision(3)} kΩ`;
  return `${ohms.toPrecision(3)} Ω`;
}
