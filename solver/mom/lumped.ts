/**
 * Circuit-like additions to Z: lumped loads, the ground-node hook, and conductor loss.
 *
 * A port (feed, load) sits at one end of one segment. The current through it, positive along the
 * segment, is Σ sign·I over the pieces on that segment peaking at that end. A series impedance Z_L there
 * adds Z_L·s_m·s_n to Z_mn for every pair of those pieces (at an interior node: simply Z_L to Z_mm),
 * and a delta-gap voltage V puts V·s_m into the right-hand side of each.
 *
 * Conductor loss (skin effect, radius ≫ skin depth): Z_s = (1 + j)·sqrt(ωμ0 / 2σ) per unit surface;
 * per unit length of a round wire Z_s / (2πa); Galerkin adds (Z_s/2πa)∫Λ_m Λ_n dl, whose overlaps on one
 * segment are ℓ/3 (same end) and ℓ/6 (opposite ends) (Balanis, Antenna Theory, 4th ed., §2.14 for R_s;
 * Harrington 1968 for the Galerkin form).
 */
import type { Mesh, Port } from "../geometry/types";
import { MU0 } from "../model/constants";
import type { LoadInput } from "../model/types";

/** Bases and signs of the pieces at a port. */
export function portPieces(mesh: Mesh, port: Port): { basis: number[]; sign: number[] } {
  const basis: number[] = [];
  const sign: number[] = [];
  for (let i = mesh.segPieceStart[port.segment]; i < mesh.segPieceStart[port.segment + 1]; i++) {
    const pc = mesh.segPieces[i];
    if ((mesh.pieceAtEnd[pc] === 1) === port.atEnd) {
      basis.push(mesh.pieceBasis[pc]);
      sign.push(mesh.pieceSign[pc]);
    }
  }
  return { basis, sign };
}

export function addPortImpedance(
  pp: { basis: number[]; sign: number[] },
  zlr: number,
  zli: number,
  n: number,
  zr: Float64Array,
  zi: Float64Array,
): void {
  for (let a = 0; a < pp.basis.length; a++) {
    for (let b = 0; b < pp.basis.length; b++) {
      const s = pp.sign[a] * pp.sign[b];
      zr[pp.basis[a] * n + pp.basis[b]] += s * zlr;
      zi[pp.basis[a] * n + pp.basis[b]] += s * zli;
    }
  }
}

/** Current through a port, positive along its segment. */
export function portCurrent(
  pp: { basis: number[]; sign: number[] },
  xr: Float64Array,
  xi: Float64Array,
): [number, number] {
  let r = 0;
  let i = 0;
  for (let a = 0; a < pp.basis.length; a++) {
    r += pp.sign[a] * xr[pp.basis[a]];
    i += pp.sign[a] * xi[pp.basis[a]];
  }
  return [r, i];
}

/** Impedance of a lumped R/L/C load at angular frequency ω, series or parallel. */
/**
 * A component given as 0 (or left out) is absent, in either arrangement: a series "farads: 0" is no
 * capacitor rather than an open circuit, a parallel "ohms: 0" no resistor rather than a short. That is
 * how the CLI's documented example writes a plain coil ({ ohms: 0, henries: 1e-5, farads: 0 }).
 */
export function loadImpedance(load: LoadInput, omega: number): [number, number] {
  const R = load.ohms || undefined;
  const L = load.henries || undefined;
  const C = load.farads || undefined;
  if ((load.arrangement ?? "series") === "series") {
    const re = R ?? 0;
    let im = 0;
    if (L !== undefined) im += omega * L;
    if (C !== undefined) im -= 1 / (omega * C);
    return [re, im];
  }
  // Parallel: Y = 1/R + 1/(jωL) + jωC.
  let yr = 0;
  let yi = 0;
  if (R !== undefined) yr += 1 / R;
  if (L !== undefined) yi -= 1 / (omega * L);
  if (C !== undefined) yi += omega * C;
  const d = yr * yr + yi * yi;
  if (d === 0) return [Number.POSITIVE_INFINITY, 0];
  return [yr / d, -yi / d];
}

/** Surface impedance of a good conductor, Z_s = (1 + j)·sqrt(ωμ0/2σ): returns R_s (= X_s). */
export function surfaceResistance(omega: number, sigma: number): number {
  return Math.sqrt((omega * MU0) / (2 * sigma));
}

/** Add (Z_s/2πa)∫Λ_m Λ_n dl for every lossy segment. */
export function addConductorLoss(
  mesh: Mesh,
  omega: number,
  n: number,
  zr: Float64Array,
  zi: Float64Array,
): void {
  const S = mesh.segs;
  for (let s = 0; s < S.n; s++) {
    const sigma = mesh.conductivity[s];
    if (!Number.isFinite(sigma)) continue;
    const rs = surfaceResistance(omega, sigma) / (2 * Math.PI * S.radius[s]);
    const l = S.len[s];
    for (let ia = mesh.segPieceStart[s]; ia < mesh.segPieceStart[s + 1]; ia++) {
      const a = mesh.segPieces[ia];
      for (let ib = mesh.segPieceStart[s]; ib < mesh.segPieceStart[s + 1]; ib++) {
        const b = mesh.segPieces[ib];
        const overlap = mesh.pieceAtEnd[a] === mesh.pieceAtEnd[b] ? l / 3 : l / 6;
        const v = rs * overlap * mesh.pieceSign[a] * mesh.pieceSign[b];
        const idx = mesh.pieceBasis[a] * n + mesh.pieceBasis[b];
        zr[idx] += v;
        zi[idx] += v;
      }
    }
  }
}
