/**
 * Far field of the segment currents: radiation intensity on a direction grid, radiated power, directivity,
 * gain, the peak and two cuts. e^{jωt}; angles as in grid.ts (elevation above the horizon, bearing from
 * north clockwise).
 *
 *   E_θ,φ = −jωμ0 e^{−jkr}/(4πr) N_θ,φ,   U = r²|E|²/(2η0) = η0 k² (|N_θ|² + |N_φ|²) / (32π²)
 * (Balanis, Antenna Theory, 4th ed., §12.3 / eq. 2-12 for U; the vector potential form of §4.2).
 *
 * Ground (the image at elevation e is the direct field at −e: see imageTerms below):
 *   free     direct field only, whole sphere;
 *   perfect  direct + image, upper hemisphere;
 *   real     direct + image with its θ-part weighted by R_v(e) and its φ-part by −R_h(e) (Fresnel,
 *            solver/ground/fresnel.ts). Space wave only: the surface wave, which matters only within a
 *            few degrees of the horizon, is not modelled, and the power integral covers the space wave.
 *            On grids of 5° and coarser the power integral upsamples the field first (hemisphere-power.ts).
 * Cuts: the elevation cut runs over the great circle through the peak bearing, angle a measured as
 * elevation toward the peak bearing and continuing over the top: a = 0..180 over ground (0 = horizon
 * toward the peak bearing, 90 = zenith, 180 = horizon behind); −90..270 in free space (−90 and 270 are
 * both the nadir, so the curve closes). The azimuth cut is at the peak elevation, bearings 0..360−step.
 * Gains below 1e-30 (−300 dBi: nulls) are reported as −300 dBi so every number stays finite.
 */

import { fresnel } from "../ground/fresnel";
import { C0, ETA0 } from "../model/constants";
import { ModelError } from "../model/errors";
import { directionGrid } from "./grid";
import { realGroundPower } from "./hemisphere-power";
import { radiationGrid } from "./radiation";
import { buildRuns } from "./runs";
import type { FarFieldFn, FarFieldRequest, FarFieldSummary } from "./types";
import { checkPositive } from "./validate";

const FLOOR = 1e-30;
/** From this step up, the real-ground power integral upsamples the field (hemisphere-power.ts). */
const COARSE_REAL_STEP = 5;
const FLOOR_DB = -300;

export function toDb(ratio: number): number {
  return ratio > FLOOR ? 10 * Math.log10(ratio) : FLOOR_DB;
}

let uScratch = new Float64Array(0);

function checkRequest(req: FarFieldRequest): void {
  checkPositive("frequencyHz", req.frequencyHz, "frequency");
  checkPositive("acceptedWatts", req.acceptedWatts, "accepted power");
  const g = req.ground;
  const kind: string | undefined = (g as { kind?: string } | undefined)?.kind;
  if (kind !== "free" && kind !== "perfect" && kind !== "real") {
    throw new ModelError("ground.kind", `must be "free", "perfect" or "real", got ${JSON.stringify(kind)}`);
  }
  if (g.kind === "real") {
    if (!Number.isFinite(g.permittivity) || g.permittivity < 1) {
      throw new ModelError("ground.permittivity", `relative permittivity must be ≥ 1, got ${g.permittivity}`);
    }
    if (!Number.isFinite(g.conductivity) || g.conductivity < 0) {
      throw new ModelError("ground.conductivity", `conductivity must be ≥ 0 S/m, got ${g.conductivity}`);
    }
  }
}

export const computeFarField: FarFieldFn = (req) => {
  checkRequest(req);
  const grid = directionGrid(req.stepDeg);
  const runs = buildRuns(req.mesh, req.currents);
  const omega = 2 * Math.PI * req.frequencyHz;
  const k = omega / C0;
  const n = radiationGrid(grid, runs, k);

  const nE = grid.elevationsDeg.length;
  const nB = grid.bearingsDeg.length;
  const overGround = req.ground.kind !== "free";
  const first = overGround ? grid.horizon : 0;
  const rows = nE - first;
  if (uScratch.length < rows * nB) uScratch = new Float64Array(rows * nB);
  const u = uScratch;
  // The vertically polarised (θ) share of U, kept only when the caller wants the whole grid.
  const uV = req.keepPattern ? new Float64Array(rows * nB) : null;
  const scale = (ETA0 * k * k) / (32 * Math.PI * Math.PI);

  // Image weights per row: θ-part by wv, φ-part by wh (complex); the image's own components at e are
  // (+N_θ(−e), −N_φ(−e)) because mirroring z flips θ̂ and keeps φ̂ while the image current is negated.
  for (let i = first; i < nE; i++) {
    let wvRe = 0;
    let wvIm = 0;
    let whRe = 0;
    let whIm = 0;
    if (req.ground.kind === "perfect") {
      wvRe = 1;
      whRe = 1;
    } else if (req.ground.kind === "real") {
      const r = fresnel(
        req.ground.permittivity,
        req.ground.conductivity,
        omega,
        (grid.elevationsDeg[i] * Math.PI) / 180,
      );
      wvRe = r.rvRe;
      wvIm = r.rvIm;
      whRe = -r.rhRe;
      whIm = -r.rhIm;
    }
    const row = i * nB;
    const mirror = (2 * grid.horizon - i) * nB;
    const out = (i - first) * nB;
    for (let j = 0; j < nB; j++) {
      let aRe = n.thRe[row + j];
      let aIm = n.thIm[row + j];
      let bRe = n.phRe[row + j];
      let bIm = n.phIm[row + j];
      if (overGround) {
        const mtRe = n.thRe[mirror + j];
        const mtIm = n.thIm[mirror + j];
        const mpRe = -n.phRe[mirror + j];
        const mpIm = -n.phIm[mirror + j];
        aRe += wvRe * mtRe - wvIm * mtIm;
        aIm += wvRe * mtIm + wvIm * mtRe;
        bRe += whRe * mpRe - whIm * mpIm;
        bIm += whRe * mpIm + whIm * mpRe;
      }
      u[out + j] = scale * (aRe * aRe + aIm * aIm + bRe * bRe + bIm * bIm);
      if (uV) uV[out + j] = scale * (aRe * aRe + aIm * aIm);
    }
  }

  // ∫U dΩ: periodic trapezoid in bearing (spectral), Clenshaw–Curtis in sin e (sphere) or Gregory's
  // end-corrected trapezoid in e (hemisphere, cos e folded into the weights).
  const weights =
    req.ground.kind === "free"
      ? grid.sphereWeights
      : req.ground.kind === "perfect"
        ? grid.evenHemiWeights
        : grid.hemiWeights;
  let radiated = 0;
  let uMax = 0;
  let peak = 0;
  for (let r = 0; r < rows; r++) {
    let sum = 0;
    for (let j = 0; j < nB; j++) {
      const v = u[r * nB + j];
      sum += v;
      if (v > uMax) {
        uMax = v;
        peak = r * nB + j;
      }
    }
    radiated += weights[r] * (sum / nB);
  }
  radiated *= 2 * Math.PI;
  if (req.ground.kind === "real" && grid.stepDeg >= COARSE_REAL_STEP) {
    radiated = realGroundPower(
      grid,
      n,
      scale,
      req.ground.permittivity,
      req.ground.conductivity,
      omega,
      grid.stepDeg >= 9 ? 4 : 2,
    );
  }

  const gainOf = (4 * Math.PI) / req.acceptedWatts;
  // Ties (a horizontal dipole in free space peaks on a whole ring): take the direction within 1e-8 of the
  // maximum (above the ~1e-9 table-interpolation noise) nearest the horizon, then the smallest bearing.
  const tie = uMax * (1 - 1e-8);
  const horizonRow = grid.horizon - first;
  for (let d = 0; d < rows; d++) {
    const candidates = overGround || d === 0 ? [horizonRow + d] : [horizonRow + d, horizonRow - d];
    let found = -1;
    for (const row of candidates) {
      if (row < 0 || row >= rows) continue;
      for (let j = 0; j < nB; j++) {
        if (u[row * nB + j] >= tie && (found < 0 || j < found % nB)) {
          found = row * nB + j;
          break;
        }
      }
    }
    if (found >= 0) {
      peak = found;
      break;
    }
  }
  const peakRow = Math.floor(peak / nB);
  const peakCol = peak % nB;
  const gainAt = (row: number, col: number) => toDb(gainOf * u[row * nB + col]);

  const step = grid.stepDeg;
  const perHalf = nB / 2;
  const backCol = (peakCol + perHalf) % nB;
  const elevAngles: number[] = [];
  const elevGains: number[] = [];
  const lastA = overGround ? 180 : 270;
  const steps = Math.round((lastA - (overGround ? 0 : -90)) / step);
  for (let s = 0; s <= steps; s++) {
    const a = (overGround ? 0 : -90) + s * step;
    // a ≤ 90: elevation a toward the peak bearing; beyond the zenith: elevation 180 − a behind.
    const front = a <= 90;
    const el = front ? a : 180 - a;
    const row = horizonRow + Math.round(el / step);
    elevAngles.push(a);
    elevGains.push(gainAt(row, front ? peakCol : backCol));
  }
  const azAngles: number[] = [];
  const azGains: number[] = [];
  for (let j = 0; j < nB; j++) {
    azAngles.push(grid.bearingsDeg[j]);
    azGains.push(gainAt(peakRow, j));
  }

  const summary: FarFieldSummary = {
    radiatedWatts: radiated,
    directivityDbi: radiated > 0 ? toDb((4 * Math.PI * uMax) / radiated) : FLOOR_DB,
    peakGainDbi: toDb(gainOf * uMax),
    peakElevationDeg: grid.elevationsDeg[peakRow + first],
    peakBearingDeg: grid.bearingsDeg[peakCol],
    elevationCut: { anglesDeg: elevAngles, gainDbi: elevGains },
    azimuthCut: { anglesDeg: azAngles, gainDbi: azGains },
  };
  if (req.keepPattern) {
    const gainDbi = new Float64Array(rows * nB);
    const verticalDbi = new Float64Array(rows * nB);
    const horizontalDbi = new Float64Array(rows * nB);
    for (let q = 0; q < rows * nB; q++) {
      gainDbi[q] = toDb(gainOf * u[q]);
      verticalDbi[q] = toDb(gainOf * uV![q]);
      horizontalDbi[q] = toDb(gainOf * (u[q] - uV![q]));
    }
    summary.pattern = {
      elevationsDeg: Array.from(grid.elevationsDeg.subarray(first)),
      bearingsDeg: Array.from(grid.bearingsDeg),
      gainDbi,
      verticalDbi,
      horizontalDbi,
    };
  }
  return summary;
};
