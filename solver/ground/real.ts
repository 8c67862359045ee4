/**
 * Real (lossy) ground behind the engine's ground interface (kernel.ts): the "reflection" and
 * "sommerfeld" near-interaction methods, "auto" choosing between them, and the ground connections of
 * wire ends at z = 0.
 *
 * - reflection: perfect-image integrals weighted by Fresnel coefficients at the specular angle of each
 *   segment pair (reflection.ts).
 * - sommerfeld: the quasi-static image κ × (perfect image), κ = (ε_c − 1)/(ε_c + 1), through the same
 *   image integrals (so every singular part is integrated as carefully as the free-space kernel), plus
 *   the Sommerfeld remainder from a per-frequency table (sommerfeld-table.ts) at Gauss points on both
 *   segments — the remainder is at most ~1/R′ at the image point, and small, so a few points suffice.
 * - auto: sommerfeld when any wire comes within 0.1 λ of the ground (at the lowest frequency of the
 *   model) or touches it, reflection otherwise.
 * - connections: a z = 0 end carries a half triangle closed by its image (an ideal connection point);
 *   nodeImpedance adds the series impedance of the connection model (connection.ts): 0 for "ideal",
 *   the rod estimate, a stated resistance. The default bare "contact" is solved rigorously under
 *   "sommerfeld" (soilContact → solver/mom/soil-contact.ts: the current enters the soil as a point
 *   source at the surface); under "reflection" it falls back to the hemisphere spreading estimate.
 *   Estimates are labelled so (connectionLabel).
 */

import { EPS0 } from "../model/constants";
import { ModelError } from "../model/errors";
import type { GroundMethod } from "../model/types";
import { findRuns, PairCache } from "../mom/pair-cache";
import { pairIntegrals } from "../mom/pair-integrals";
import { gaussRule, type Rule } from "../mom/quadrature";
import { connectionImpedance, connectionResistance, formatOhms, hemisphereImpedance } from "./connection";
import type { GroundFrequency, GroundKernel, GroundSetup } from "./kernel";
import type { ResolvedRealGround } from "./presets";
import { type ReflectionWeights, reflectionPairTerms } from "./reflection";
import type { HalfSpaceParams } from "./sommerfeld-integrals";
import {
  contractRemainder,
  lookupRemainder,
  type SommerfeldTable,
  sharedSommerfeldTable,
} from "./sommerfeld-table";

const C0 = 299_792_458;

/** Height (in wavelengths) below which "auto" runs the rigorous method. */
export const AUTO_HEIGHT_WAVELENGTHS = 0.1;

/** The ground setup; its lowestFrequencyHz drives "auto" (absent → reflection unless a wire touches z = 0). */
export type RealGroundSetup = GroundSetup;

/** Lowest z over all segment end points, metres. */
export function lowestPoint(setup: GroundSetup): number {
  const S = setup.segments;
  let zmin = Number.POSITIVE_INFINITY;
  for (let i = 0; i < S.n; i++) {
    const z0 = S.start[3 * i + 2];
    const z1 = z0 + S.dir[3 * i + 2] * S.len[i];
    zmin = Math.min(zmin, z0, z1);
  }
  return zmin;
}

/**
 * Largest |ε_c| the Sommerfeld tabulation accepts. Its cost grows with |k1| = |ε_c|^½ k0 (the integrals
 * must resolve the Bessel oscillation out to a few |k1|); 1e4 covers every land ground and fresh water at
 * HF, and sea water above about 9 MHz. Beyond it the ground is so good a conductor that the reflection
 * method's plane-wave weighting errs only at O(|ε_c|^−½).
 */
export const SOMMERFELD_MAX_EPS = 1e4;

/** |ε_c| of a ground at frequency f (Hz). */
export function complexPermittivityMagnitude(
  g: { permittivity: number; conductivity: number },
  f: number,
): number {
  return Math.hypot(g.permittivity, g.conductivity / (2 * Math.PI * f * EPS0));
}

/** The method "auto" resolves to for this geometry and ground. */
export function chooseMethod(
  method: GroundMethod,
  setup: RealGroundSetup,
  ground?: { permittivity: number; conductivity: number },
): "reflection" | "sommerfeld" {
  if (method !== "auto") return method;
  if (
    ground &&
    setup.lowestFrequencyHz &&
    complexPermittivityMagnitude(ground, setup.lowestFrequencyHz) > SOMMERFELD_MAX_EPS
  ) {
    return "reflection";
  }
  const zmin = lowestPoint(setup);
  if (zmin <= 1e-9) return "sommerfeld";
  if (setup.lowestFrequencyHz && zmin < (AUTO_HEIGHT_WAVELENGTHS * C0) / setup.lowestFrequencyHz)
    return "sommerfeld";
  return "reflection";
}

/** Largest distance from any segment point to any mirrored segment point (bounding-box bound), metres. */
function maxImageDistance(setup: GroundSetup): number {
  const S = setup.segments;
  let x0 = Number.POSITIVE_INFINITY;
  let x1 = Number.NEGATIVE_INFINITY;
  let y0 = x0;
  let y1 = x1;
  let z1 = 0;
  for (let i = 0; i < S.n; i++) {
    for (const u of [0, 1]) {
      const x = S.start[3 * i] + u * S.dir[3 * i] * S.len[i];
      const y = S.start[3 * i + 1] + u * S.dir[3 * i + 1] * S.len[i];
      const z = S.start[3 * i + 2] + u * S.dir[3 * i + 2] * S.len[i];
      x0 = Math.min(x0, x);
      x1 = Math.max(x1, x);
      y0 = Math.min(y0, y);
      y1 = Math.max(y1, y);
      z1 = Math.max(z1, z);
    }
  }
  return Math.hypot(x1 - x0, y1 - y0, 2 * z1);
}

/**
 * Why "auto" ran reflection where the geometry alone called for Sommerfeld (a wire on or near the soil,
 * but a ground too good a conductor for the tables), in words; undefined otherwise.
 */
export function autoMethodNote(setup: RealGroundSetup, ground: ResolvedRealGround): string | undefined {
  if (ground.method !== "auto" || chooseMethod("auto", setup, ground) !== "reflection") return undefined;
  if (chooseMethod("auto", setup) !== "sommerfeld" || !setup.lowestFrequencyHz) return undefined;
  const mag = complexPermittivityMagnitude(ground, setup.lowestFrequencyHz);
  return `wires come within ${AUTO_HEIGHT_WAVELENGTHS} λ of the soil, but this ground's |ε_c| = ${mag.toPrecision(3)} at ${(setup.lowestFrequencyHz / 1e6).toPrecision(4)} MHz is beyond the rigorous method's tables (${SOMMERFELD_MAX_EPS}): the reflection method ran instead, accurate for so good a conductor (errors of order |ε_c|^−½), and bare contacts are the hemisphere estimate`;
}

export function realGroundKernel(setup: RealGroundSetup, ground: ResolvedRealGround): GroundKernel {
  const method = chooseMethod(ground.method, setup, ground);
  const methodNote = autoMethodNote(setup, ground);
  const P = setup.segments;
  const M = setup.mirrored;
  const { permittivity, conductivity } = ground;
  const j = new Float64Array(8);
  const w: ReflectionWeights = { vecRe: 0, vecIm: 0, chargeRe: 0, chargeIm: 0 };
  const I = new Float64Array(10);
  const c = new Float64Array(2);
  let k = 0;
  let omega = 0;
  let table: SommerfeldTable | undefined;
  let tableParams: HalfSpaceParams = { k0: 0, epsRe: 1, epsIm: 0 };
  let kapRe = 1;
  let kapIm = 0;
  const rMax = maxImageDistance(setup) * 1.02 + 1e-6;

  // Ground-connection resistance per wire (frequency independent estimates), from the wire's radius.
  const wireRadius = new Map<number, number>();
  for (let s = 0; s < P.n; s++) {
    const wi = setup.wireOfSegment[s];
    if (!wireRadius.has(wi)) wireRadius.set(wi, P.radius[s]);
  }
  // Validated once here (bad rods or resistances fail before any maths), evaluated per frequency.
  for (const [wi, conn] of setup.connections.entries()) {
    connectionResistance(
      conn ?? "contact",
      conductivity,
      wireRadius.get(wi) ?? 0,
      `wires[${wi}].groundConnection`,
    );
  }
  // A bare contact under the rigorous method: its current enters the soil as a point source at the
  // surface, carried by the fill (solver/mom/soil-contact.ts) instead of a lumped estimate. Under
  // "reflection" the plane-wave weights cannot represent a charge on the interface (at grazing they
  // cancel it), so the hemisphere estimate stays there.
  const rigorousContact = (wi: number) =>
    method === "sommerfeld" && (setup.connections[wi] ?? "contact") === "contact";
  const connectionZ = (wi: number) =>
    connectionImpedance(
      setup.connections[wi] ?? "contact",
      ground,
      omega,
      wireRadius.get(wi) ?? 0,
      `wires[${wi}].groundConnection`,
    );

  // The remainder is smooth on the scale of a segment except close to the image point (~1/R′), so the
  // order follows image distance over segment length: up to 10 points for a wire a few centimetres above
  // the soil, the midpoint beyond 8 lengths (error O((ℓ/d)²) of a term that is itself a fraction of the
  // reflected field).
  const remainderRule = (d: number, h: number): Rule =>
    d < 0.2 * h
      ? gaussRule(10)
      : d < 0.5 * h
        ? gaussRule(6)
        : d < 2 * h
          ? gaussRule(4)
          : d < 4 * h
            ? gaussRule(3)
            : d < 8 * h
              ? gaussRule(2)
              : gaussRule(1);

  // The Sommerfeld pair term (κ-image + remainder) written into out (overwritten, not added).
  const sommerfeldPairTerm = (p: number, q: number, out: Float64Array) => {
    for (let i = 0; i < 10; i++) out[i] = 0;
    // Quasi-static image: κ × the perfect-image terms (perfect adds −(t̂_p·M.dir)J and −J00).
    pairIntegrals(P, p, M, q, k, j);
    const dot =
      P.dir[3 * p] * M.dir[3 * q] + P.dir[3 * p + 1] * M.dir[3 * q + 1] + P.dir[3 * p + 2] * M.dir[3 * q + 2];
    for (let i = 0; i < 8; i += 2) {
      out[i] -= dot * (kapRe * j[i] - kapIm * j[i + 1]);
      out[i + 1] -= dot * (kapRe * j[i + 1] + kapIm * j[i]);
    }
    out[8] -= kapRe * j[0] - kapIm * j[1];
    out[9] -= kapRe * j[1] + kapIm * j[0];
    // Remainder at Gauss points.
    table ??= sharedSommerfeldTable(tableParams, { rMax });
    const t = table;
    const p3 = 3 * p;
    const q3 = 3 * q;
    const lp = P.len[p];
    const lq = P.len[q];
    const dmx = P.mid[p3] - M.mid[q3];
    const dmy = P.mid[p3 + 1] - M.mid[q3 + 1];
    const dmz = P.mid[p3 + 2] - M.mid[q3 + 2];
    const rule = remainderRule(Math.hypot(dmx, dmy, dmz), Math.max(lp, lq));
    for (let a = 0; a < rule.n; a++) {
      const u = rule.u[a];
      const ox = P.start[p3] + u * lp * P.dir[p3];
      const oy = P.start[p3 + 1] + u * lp * P.dir[p3 + 1];
      const oz = P.start[p3 + 2] + u * lp * P.dir[p3 + 2];
      for (let b = 0; b < rule.n; b++) {
        const v = rule.u[b];
        const sx = P.start[q3] + v * lq * P.dir[q3];
        const sy = P.start[q3 + 1] + v * lq * P.dir[q3 + 1];
        const sz = P.start[q3 + 2] + v * lq * P.dir[q3 + 2];
        const dx = ox - sx;
        const dy = oy - sy;
        // sqrt, not Math.hypot: this runs ~10⁴ times per fill and hypot is several times slower in V8
        // (no overflow risk at metre scales).
        lookupRemainder(t, Math.sqrt(dx * dx + dy * dy), Math.max(0, oz + sz), I);
        contractRemainder(I, k, dx, dy, P.dir, p3, P.dir, q3, c);
        const wt = rule.w[a] * rule.w[b] * lp * lq;
        const gr = wt * c[0];
        const gi = wt * c[1];
        out[0] += gr;
        out[1] += gi;
        out[2] += u * gr;
        out[3] += u * gi;
        out[4] += v * gr;
        out[5] += v * gi;
        out[6] += u * v * gr;
        out[7] += u * v * gi;
      }
    }
  };
  // The whole reflected term depends on observer and source only through the observer-to-image offset
  // (ρ and z + z′ of the half-space field, the κ-image's R̃, and the Gauss rule chosen from the
  // midpoint-to-image distance), so it repeats along straight evenly cut runs exactly like the perfect
  // image does: Toeplitz for horizontal runs (and a droop against its mirror-image droop), Hankel for
  // vertical ones (a mast against itself, where the near-ground pairs need up to 10 × 10 lookups).
  // Cached per translation class and frequency with the run cache the perfect ground uses; results are
  // the same up to rounding (only the absolute coordinates of the Gauss points differ), except that a
  // pair whose midpoint-to-image distance sits exactly on a Gauss-rule threshold (a mast: d is a whole
  // number of segment lengths) now takes its class's choice instead of its own rounding's — on the
  // yard benchmark model that moves the feed impedance by ~1e-6 relative.
  const pairTerm = new Float64Array(10);
  const sommerfeldCache = new PairCache(P, M, findRuns(P, setup.wireOfSegment), true, {
    width: 10,
    compute: sommerfeldPairTerm,
  });
  const sommerfeldPair = (p: number, q: number, out: Float64Array) => {
    sommerfeldCache.get(p, q, pairTerm);
    for (let i = 0; i < 10; i++) out[i] += pairTerm[i];
  };

  return {
    method,
    ...(methodNote ? { methodNote } : {}),
    connectsAtZ0: true,
    symmetric: true,
    hasPairTerms: true,
    // Reflected terms are image-like (e^{−jkR̃} times factors slow in frequency: Fresnel weights, κ, the
    // tabulated remainder), so band sweeps may interpolate them (solver/mom/interpolate.ts).
    interpolable: true,
    beginFrequency(f: GroundFrequency) {
      k = f.k;
      omega = f.omega;
      if (method === "sommerfeld") {
        const mag = complexPermittivityMagnitude(ground, f.frequencyHz);
        if (mag > SOMMERFELD_MAX_EPS) {
          throw new ModelError(
            "ground.method",
            `the Sommerfeld method handles grounds up to |ε_c| = ${SOMMERFELD_MAX_EPS}; this one has |ε_c| = ${mag.toPrecision(3)} at ${(f.frequencyHz / 1e6).toPrecision(4)} MHz — use "reflection" (accurate for so good a conductor) or "auto"`,
          );
        }
        const epsIm = -conductivity / (omega * EPS0);
        // κ = (ε_c − 1)/(ε_c + 1)
        const nr = permittivity - 1;
        const dr = permittivity + 1;
        const d = dr * dr + epsIm * epsIm;
        kapRe = (nr * dr + epsIm * epsIm) / d;
        kapIm = (epsIm * dr - nr * epsIm) / d;
        // Built on first use: a band sweep calls beginFrequency at every point but fills (and so needs
        // the table) only at the three frequencies it interpolates from.
        table = undefined;
        tableParams = { k0: k, epsRe: permittivity, epsIm };
        sommerfeldCache.begin(k);
      }
    },
    pairTerms(p: number, q: number, out: Float64Array) {
      if (method === "reflection") {
        reflectionPairTerms(P, p, M, q, k, permittivity, conductivity, omega, j, w, out);
      } else {
        sommerfeldPair(p, q, out);
      }
    },
    nodeImpedance(wireIndex: number, out: Float64Array) {
      if (rigorousContact(wireIndex)) return false; // the fill carries it (soilContact)
      const z = connectionZ(wireIndex);
      if (z.model === "ideal") return false;
      out[0] = z.ohms[0];
      out[1] = z.ohms[1];
      return true;
    },
    soilContact(wireIndex: number, out: Float64Array) {
      if (!rigorousContact(wireIndex)) return false;
      out[0] = 1 - kapRe;
      out[1] = -kapIm;
      return true;
    },
    tieImpedance(wireIndex: number, frequencyHz: number, out: Float64Array) {
      const w = 2 * Math.PI * frequencyHz;
      const conn = setup.connections[wireIndex] ?? "contact";
      const path = `wires[${wireIndex}].groundConnection`;
      const a = wireRadius.get(wireIndex) ?? 0;
      // A rigorous contact's own term (solver/mom/soil-contact.ts), quasi-static: soil and air
      // displacement in parallel; otherwise the lumped model's impedance.
      const z = rigorousContact(wireIndex)
        ? { model: "contact-hemisphere", ohms: hemisphereImpedance(a, conductivity, 1 + permittivity, w) }
        : connectionImpedance(conn, ground, w, a, path);
      if (z.model === "ideal") return false;
      out[0] = z.ohms[0];
      out[1] = z.ohms[1];
      return true;
    },
    connectionLabel(wireIndex: number) {
      const conn = setup.connections[wireIndex] ?? "contact";
      const path = `wires[${wireIndex}].groundConnection`;
      const r = connectionResistance(conn, conductivity, wireRadius.get(wireIndex) ?? 0, path);
      if (!rigorousContact(wireIndex)) return r.label;
      return `bare contact: the current enters the soil at the wire's end, solved with the Sommerfeld ground (a hemisphere of the wire's radius: ≈${formatOhms(r.ohms)} at d.c.)`;
    },
  };
}

/** Labels of the connection models per wire, for reports (index = model.wires index). */
export function connectionLabels(setup: GroundSetup, conductivity: number): string[] {
  const P = setup.segments;
  return setup.connections.map((conn, wi) => {
    let radius = 0;
    for (let s = 0; s < P.n; s++) if (setup.wireOfSegment[s] === wi) radius = P.radius[s];
    return connectionResistance(conn ?? "contact", conductivity, radius, `wires[${wi}].groundConnection`)
      .label;
  });
}
