import { prepareModel } from "../index";
import type { FrequencyResult, GroundInput, MaterialInput, WireModel } from "../model/types";
import { resonancesNear, trimToResonance } from "./trim";

/**
 * The ideal straight dipole each band is measured against: the plan's wire (radius, material), straight,
 * horizontal, centre-fed, at the given height over the plan's ground, trimmed to resonance at the band
 * centre. It depends only on those inputs, so results are cached (a live drag that keeps the mean height
 * reuses it; one that changes it costs a handful of solves of a ~15-unknown model).
 */

export interface IdealDipoleInput {
  centreMHz: number;
  heightM: number;
  radius: number;
  material: MaterialInput;
  ground: GroundInput;
  patternStepDeg: number;
}

export interface IdealDipoleResult {
  lengthM: number;
  resonanceMHz: number;
  peakGainDbi: number;
  takeoffDeg: number;
  efficiency: number;
  elevationCut: { anglesDeg: number[]; gainDbi: number[] } | undefined;
  result: FrequencyResult;
}

/** Handbook starting length of a half-wave dipole: 468 / f(MHz) feet (common practice, no published source). */
export function handbookDipoleM(mhz: number): number {
  return (468 / mhz) * 0.3048;
}

export function straightDipoleModel(
  lengthM: number,
  input: Omit<IdealDipoleInput, "patternStepDeg">,
): WireModel {
  const h = lengthM / 2;
  return {
    wires: [
      {
        id: "ideal-dipole",
        points: [
          [-h, 0, input.heightM],
          [h, 0, input.heightM],
        ],
        radius: input.radius,
        material: input.material,
      },
    ],
    feed: { wire: "ideal-dipole", at: 0.5 },
    ground: input.ground,
    frequenciesMHz: [input.centreMHz],
  };
}

const cache = new Map<string, IdealDipoleResult>();
const CACHE_LIMIT = 64;

export function idealDipole(input: IdealDipoleInput): IdealDipoleResult {
  const key = JSON.stringify({ ...input, heightM: Math.round(input.heightM * 1000) / 1000 });
  const hit = cache.get(key);
  if (hit) return hit;
  const trim = trimToResonance(
    (L) => straightDipoleModel(L, input),
    handbookDipoleM(input.centreMHz),
    input.centreMHz,
  );
  const model = straightDipoleModel(trim.lengthM, input);
  const prepared = prepareModel(model, { patternStepDeg: input.patternStepDeg });
  const result = prepared.solveAt(input.centreMHz * 1e6, {
    patternStepDeg: input.patternStepDeg,
  });
  // The same prepared model serves the resonance search (impedance only): one mesh, not two.
  const near = resonancesNear(model, input.centreMHz, undefined, undefined, prepared);
  const out: IdealDipoleResult = {
    lengthM: trim.lengthM,
    resonanceMHz: near.length
      ? near.reduce((a, b) => (Math.abs(b - input.centreMHz) < Math.abs(a - input.centreMHz) ? b : a))
      : Number.NaN,
    peakGainDbi: result.peakGainDbi,
    takeoffDeg: result.peakElevationDeg,
    efficiency: result.efficiency,
    elevationCut: result.elevationCut,
    result,
  };
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  cache.set(key, out);
  return out;
}
