/**
 * Named grounds and the resolver from the model's `ground` input to concrete electrical constants.
 *
 * Source of the named values: ITU-R Recommendation P.527, "Electrical characteristics of the surface of
 * the Earth" — the curves of the 1992 edition (P.527-3, Figures 1 and 2, conductivity and relative
 * permittivity against frequency for each ground type), read at HF where they are flat below roughly
 * 10 MHz. Values transcribed from memory, not from a copy of the Recommendation at hand; later editions
 * (P.527-4 onward) replace the curves by a model computed from soil composition and water content, which
 * gives similar values at HF for these classes. Treat them as typical, not exact: real soils vary by a
 * factor of several with moisture and season.
 *
 * "Average ground" (σ = 0.005 S/m, εr = 13) is not in the Recommendation; it is the value amateurs
 * commonly use (common practice, no published source).
 */
import { ModelError } from "../model/errors";
import type { GroundInput, GroundMethod } from "../model/types";

export interface GroundConstants {
  /** Conductivity, S/m. */
  conductivity: number;
  /** Relative permittivity (real part). */
  permittivity: number;
}

export interface GroundPreset extends GroundConstants {
  name: string;
  /** Where the numbers come from, for display beside them. */
  source: string;
}

const P527 = "ITU-R P.527-3 (1992), Figs. 1–2, HF values, from memory";

/** The named grounds, keyed by lower-case name. */
export const GROUND_PRESETS: Readonly<Record<string, GroundPreset>> = {
  "sea water": { name: "sea water", conductivity: 5, permittivity: 70, source: P527 },
  "fresh water": { name: "fresh water", conductivity: 3e-3, permittivity: 80, source: P527 },
  "wet ground": { name: "wet ground", conductivity: 1e-2, permittivity: 30, source: P527 },
  "medium dry ground": { name: "medium dry ground", conductivity: 1e-3, permittivity: 15, source: P527 },
  "very dry ground": { name: "very dry ground", conductivity: 1e-4, permittivity: 3, source: P527 },
  "average ground": {
    name: "average ground",
    conductivity: 5e-3,
    permittivity: 13,
    source: "common practice, no published source",
  },
};

export const GROUND_PRESET_NAMES: readonly string[] = Object.keys(GROUND_PRESETS);

export interface ResolvedRealGround extends GroundConstants {
  /** The preset the values started from, if any. */
  preset?: string;
  method: GroundMethod;
}

/** Lower-case, single spaces, and "-" or "_" read as spaces, so "Wet_Ground" finds "wet ground". */
function normaliseName(name: string): string {
  return name
    .trim()
    .toLowerCase()
    .replace(/[-_\s]+/g, " ");
}

function checkConductivity(value: number, path: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new ModelError(
      path,
      `ground conductivity must be a finite positive number of S/m (got ${value}); a perfect ground is { "kind": "perfect" }`,
    );
  }
}

function checkPermittivity(value: number, path: string): void {
  if (!Number.isFinite(value) || value < 1) {
    throw new ModelError(path, `relative permittivity must be a finite number of at least 1 (got ${value})`);
  }
}

/**
 * Concrete σ and εr for a real ground. A preset supplies both; an explicit conductivity or permittivity
 * overrides the preset's value. Without a preset both numbers are required.
 * `path` is where the ground sits in the input (for messages), normally "ground".
 */
export function resolveRealGround(
  input: Extract<GroundInput, { kind: "real" }>,
  path = "ground",
): ResolvedRealGround {
  let base: GroundPreset | undefined;
  if (input.preset !== undefined) {
    base = GROUND_PRESETS[normaliseName(input.preset)];
    if (!base) {
      throw new ModelError(
        `${path}.preset`,
        `unknown ground preset "${input.preset}"; known: ${GROUND_PRESET_NAMES.map((n) => `"${n}"`).join(", ")}`,
      );
    }
  }
  const conductivity = input.conductivity ?? base?.conductivity;
  const permittivity = input.permittivity ?? base?.permittivity;
  if (conductivity === undefined) {
    throw new ModelError(`${path}.conductivity`, "a real ground needs a conductivity (S/m) or a preset");
  }
  if (permittivity === undefined) {
    throw new ModelError(`${path}.permittivity`, "a real ground needs a relative permittivity or a preset");
  }
  checkConductivity(conductivity, `${path}.conductivity`);
  checkPermittivity(permittivity, `${path}.permittivity`);
  const method = input.method ?? "auto";
  if (method !== "auto" && method !== "reflection" && method !== "sommerfeld") {
    throw new ModelError(
      `${path}.method`,
      `unknown ground method "${method}"; expected "auto", "reflection" or "sommerfeld"`,
    );
  }
  const out: ResolvedRealGround = { conductivity, permittivity, method };
  if (base) out.preset = base.name;
  return out;
}
