/**
 * A model prepared for solving: the mesh, the ground kernel and every buffer, built once; then one
 * `solveAt(f)` per frequency fills Z, adds loads, loss and ground-node impedances, factors, solves and
 * assembles the FrequencyResult (normalised to 1 W accepted at the feed).
 */
import type { FarFieldFn, FarFieldGround } from "../fields/types";
import type { Mesh } from "../geometry/types";
import type { GroundKernel } from "../ground/kernel";
import { C0, ETA0 } from "../model/constants";
import { ModelError } from "../model/errors";
import type { FrequencyResult, SegmentCurrents, WireCurrentSummary } from "../model/types";
import { makeSolveWork, solveSymmetric } from "./factor-solve";
import { fillMatrix, makeFillScratch } from "./fill";
import { BandInterpolator } from "./interpolate";
import {
  addConductorLoss,
  addPortImpedance,
  loadImpedance,
  portCurrent,
  portPieces,
  surfaceResistance,
} from "./lumped";
import { contactSpreadingLoss, soilContactNodes } from "./soil-contact";

export interface MomSetup {
  mesh: Mesh;
  ground: GroundKernel;
  /** What the far field needs to know of the ground. */
  farFieldGround: FarFieldGround;
  referenceOhms: number;
  /** Far-field routine; absent = no pattern (radiated power then follows from the power balance). */
  farField?: FarFieldFn;
}

export interface FrequencySolveOptions {
  patternStepDeg?: number;
  keepPattern?: boolean;
  /** Sweeps: allow band interpolation of Z (default true where the ground permits). */
  interpolate?: boolean;
}

export interface MomSolver {
  readonly unknowns: number;
  /** Fill only (for tests of the matrix itself): returns views of the internal Z buffers. */
  matrixAt(frequencyHz: number): { re: Float64Array; im: Float64Array; n: number };
  solveAt(frequencyHz: number, opts?: FrequencySolveOptions): FrequencyResult;
  /** Many frequencies (Hz), results in the same order; reuses fills across bands (interpolate.ts). */
  solveSweep(frequenciesHz: number[], opts?: FrequencySolveOptions): FrequencyResult[];
}

export function makeMomSolver(setup: MomSetup): MomSolver {
  const { mesh, ground } = setup;
  const n = mesh.nBasis;
  if (n === 0)
    throw new ModelError(
      "wires",
      "no wire carries current: every wire end is free and no wire has an interior node",
    );
  const zr = new Float64Array(n * n);
  const zi = new Float64Array(n * n);
  const work = makeSolveWork(n);
  const br = new Float64Array(n);
  const bi = new Float64Array(n);
  const scratch = makeFillScratch(mesh);
  const feedPort = portPieces(mesh, mesh.feed);
  const loadPorts = mesh.loads.map((l) => ({ pp: portPieces(mesh, l.port), load: l.load, index: l.index }));
  const groundPorts = mesh.groundPorts.map((g) => ({ pp: portPieces(mesh, g.port), wire: g.wire }));
  const contacts = soilContactNodes(mesh);
  const tmp = new Float64Array(2);
  const groundZ: ([number, number] | null)[] = groundPorts.map(() => null);
  const loadZ: [number, number][] = loadPorts.map(() => [0, 0]);

  let band: BandInterpolator | null = null;
  let interp: BandInterpolator | null = null;
  const assemble = (frequencyHz: number) => {
    if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) {
      throw new ModelError(
        "frequenciesMHz",
        `frequency must be positive and finite (got ${frequencyHz / 1e6} MHz)`,
      );
    }
    const omega = 2 * Math.PI * frequencyHz;
    const k = omega / C0;
    const f = { frequencyHz, omega, k, eta: ETA0 };
    ground.beginFrequency(f);
    if (band && frequencyHz >= band.fLo * (1 - 1e-12) && frequencyHz <= band.fHi * (1 + 1e-12)) {
      band.matrixAt(frequencyHz, zr, zi);
    } else {
      fillMatrix(mesh, ground, f, zr, zi, scratch);
    }
    loadPorts.forEach((l, i) => {
      const z = loadImpedance(l.load, omega);
      if (!Number.isFinite(z[0]) || !Number.isFinite(z[1])) {
        throw new ModelError(`loads[${l.index}]`, "the load has no element (give ohms, henries or farads)");
      }
      loadZ[i] = z;
      addPortImpedance(l.pp, z[0], z[1], n, zr, zi);
    });
    groundPorts.forEach((g, i) => {
      groundZ[i] = null;
      if (ground.nodeImpedance(g.wire, tmp)) {
        groundZ[i] = [tmp[0], tmp[1]];
        addPortImpedance(g.pp, tmp[0], tmp[1], n, zr, zi);
      }
    });
    addConductorLoss(mesh, omega, n, zr, zi);
    return omega;
  };

  const solveAt = (frequencyHz: number, opts: FrequencySolveOptions = {}): FrequencyResult => {
    const omega = assemble(frequencyHz);
    br.fill(0);
    bi.fill(0);
    for (let a = 0; a < feedPort.basis.length; a++) br[feedPort.basis[a]] = feedPort.sign[a];
    try {
      solveSymmetric(work, zr, zi, br, bi);
    } catch (e) {
      throw new ModelError(
        "wires",
        `the impedance matrix is singular at ${frequencyHz / 1e6} MHz (overlapping wires or a degenerate geometry?): ${(e as Error).message}`,
      );
    }
    const [ir, ii] = portCurrent(feedPort, br, bi);
    // 1 V applied: P = ½ Re(V I*) = ½ Re(I).
    const p1 = 0.5 * ir;
    if (!(p1 > 0)) {
      throw new ModelError(
        "feed",
        `the feed accepts no power at ${frequencyHz / 1e6} MHz (numerical breakdown)`,
      );
    }
    const scale = 1 / Math.sqrt(p1);
    const den = ir * ir + ii * ii;
    const zin: [number, number] = [ir / den, -ii / den];
    for (let m = 0; m < n; m++) {
      br[m] *= scale;
      bi[m] *= scale;
    }
    const currents = segmentCurrents(mesh, br, bi);
    const wireLoss = conductorLossWatts(mesh, omega, currents);
    let loadLoss = 0;
    loadPorts.forEach((l, i) => {
      const [cr, ci] = portCurrent(l.pp, br, bi);
      loadLoss += 0.5 * loadZ[i][0] * (cr * cr + ci * ci);
    });
    let groundLoss = 0;
    groundPorts.forEach((g, i) => {
      const z = groundZ[i];
      if (!z) return;
      const [cr, ci] = portCurrent(g.pp, br, bi);
      groundLoss += 0.5 * z[0] * (cr * cr + ci * ci);
    });
    // Rigorous soil contacts: their spreading dissipation (hemisphere terms, quasi-static) is what the
    // budget books without a far field. With one (below), the ground loss is the balance's remainder,
    // which also counts the power the contacts' charges exchange with the rest of the antenna.
    const rigorous = contacts.filter((c) => ground.soilContact?.(c.wire, tmp));
    if (rigorous.length > 0) {
      const fq = { frequencyHz, omega, k: omega / C0, eta: ETA0 };
      // Each contact's charge × jω: its point divergence times the half triangle's coefficient.
      groundLoss += contactSpreadingLoss(rigorous, tmp, fq, (c) => [
        c.divergence * br[c.basis],
        c.divergence * bi[c.basis],
      ]);
    }
    const accepted = 1;
    const step = opts.patternStepDeg ?? 2;
    const result: FrequencyResult = {
      mhz: frequencyHz / 1e6,
      impedance: zin,
      swr: swr(zin, setup.referenceOhms),
      peakGainDbi: Number.NaN,
      peakElevationDeg: Number.NaN,
      peakBearingDeg: Number.NaN,
      directivityDbi: Number.NaN,
      efficiency: (accepted - wireLoss - loadLoss - groundLoss) / accepted,
      power: {
        accepted,
        radiated: accepted - wireLoss - loadLoss - groundLoss,
        wireLoss,
        loadLoss,
        groundLoss,
      },
      currents: wirePeaks(mesh, currents),
      segmentCurrents: currents,
      feedCurrent: [ir * scale, ii * scale],
      feedVoltage: [scale, 0],
    };
    if (step > 0 && setup.farField) {
      const ff = setup.farField({
        mesh: mesh.view,
        currents,
        frequencyHz,
        ground: setup.farFieldGround,
        acceptedWatts: accepted,
        stepDeg: step,
        keepPattern: opts.keepPattern ?? false,
      });
      result.power.radiated = ff.radiatedWatts;
      result.efficiency = ff.radiatedWatts / accepted;
      if (setup.farFieldGround.kind === "real") {
        // Over lossy ground the space-wave integral misses what the soil absorbs (and the surface
        // wave): by Poynting's theorem that is the rest of the accepted power, connection loss included.
        result.power.groundLoss = Math.max(0, accepted - ff.radiatedWatts - wireLoss - loadLoss);
      }
      result.peakGainDbi = ff.peakGainDbi;
      result.peakElevationDeg = ff.peakElevationDeg;
      result.peakBearingDeg = ff.peakBearingDeg;
      result.directivityDbi = ff.directivityDbi;
      if (ff.pattern) result.pattern = ff.pattern;
      result.elevationCut = ff.elevationCut;
      result.azimuthCut = ff.azimuthCut;
    }
    return result;
  };

  return {
    unknowns: n,
    matrixAt(frequencyHz) {
      assemble(frequencyHz);
      return { re: zr, im: zi, n };
    },
    solveAt,
    solveSweep(frequenciesHz, opts = {}) {
      const out: FrequencyResult[] = new Array(frequenciesHz.length);
      const canInterpolate = ground.interpolable === true && opts.interpolate !== false;
      for (const group of bandGroups(frequenciesHz, canInterpolate ? BAND_RATIO : 0)) {
        band = null;
        if (group.length >= MIN_BAND_POINTS) {
          interp ??= new BandInterpolator(mesh, ground);
          interp.fit(frequenciesHz[group[0]], frequenciesHz[group[group.length - 1]], scratch, zr, zi);
          band = interp;
        }
        try {
          for (const i of group) out[i] = solveAt(frequenciesHz[i], opts);
        } finally {
          band = null;
        }
      }
      return out;
    },
  };
}

/** Widest band (f_hi/f_lo − 1) one interpolator covers; measured error below 1e-3 in Z_in (see tests). */
export const BAND_RATIO = 0.12;
/** Fewer points than this in a band: fill each in full (three fills would not pay). */
export const MIN_BAND_POINTS = 6;

/** Indices of the frequencies grouped into bands (each sorted ascending), greedily from the lowest. */
export function bandGroups(freqs: number[], ratio: number): number[][] {
  const order = freqs.map((_, i) => i).sort((a, b) => freqs[a] - freqs[b]);
  const groups: number[][] = [];
  let cur: number[] = [];
  for (const i of order) {
    if (cur.length > 0 && freqs[i] > freqs[cur[0]] * (1 + ratio)) {
      groups.push(cur);
      cur = [];
    }
    cur.push(i);
  }
  if (cur.length > 0) groups.push(cur);
  return groups;
}

export function swr(z: [number, number], z0: number): number {
  const nr = z[0] - z0;
  const ni = z[1];
  const dr = z[0] + z0;
  const di = z[1];
  const g = Math.hypot(nr, ni) / Math.hypot(dr, di);
  return g >= 1 ? Number.POSITIVE_INFINITY : (1 + g) / (1 - g);
}

/** Per-segment start/end currents from the basis coefficients (positive along each segment). */
export function segmentCurrents(mesh: Mesh, xr: Float64Array, xi: Float64Array): SegmentCurrents {
  const ns = mesh.segs.n;
  const c: SegmentCurrents = {
    startRe: new Float64Array(ns),
    startIm: new Float64Array(ns),
    endRe: new Float64Array(ns),
    endIm: new Float64Array(ns),
  };
  for (let pc = 0; pc < mesh.pieceBasis.length; pc++) {
    const s = mesh.pieceSeg[pc];
    const m = mesh.pieceBasis[pc];
    const g = mesh.pieceSign[pc];
    if (mesh.pieceAtEnd[pc]) {
      c.endRe[s] += g * xr[m];
      c.endIm[s] += g * xi[m];
    } else {
      c.startRe[s] += g * xr[m];
      c.startIm[s] += g * xi[m];
    }
  }
  return c;
}

/** ½ Σ R_s/(2πa) ∫|I|² dl with I linear on each segment: ∫|I|² = ℓ(|I0|² + |I1|² + Re I0 I1*)/3. */
export function conductorLossWatts(mesh: Mesh, omega: number, c: SegmentCurrents): number {
  let p = 0;
  const S = mesh.segs;
  for (let s = 0; s < S.n; s++) {
    const sigma = mesh.conductivity[s];
    if (!Number.isFinite(sigma)) continue;
    const r = surfaceResistance(omega, sigma) / (2 * Math.PI * S.radius[s]);
    const a0 = c.startRe[s] * c.startRe[s] + c.startIm[s] * c.startIm[s];
    const a1 = c.endRe[s] * c.endRe[s] + c.endIm[s] * c.endIm[s];
    const x = c.startRe[s] * c.endRe[s] + c.startIm[s] * c.endIm[s];
    p += 0.5 * r * ((S.len[s] * (a0 + a1 + x)) / 3);
  }
  return p;
}

function wirePeaks(mesh: Mesh, c: SegmentCurrents): WireCurrentSummary[] {
  const peaks = mesh.wireIds.map((wire) => ({ wire, peakAmps: 0 }));
  const w = mesh.view.wireOfSegment;
  for (let s = 0; s < mesh.segs.n; s++) {
    const m = Math.max(Math.hypot(c.startRe[s], c.startIm[s]), Math.hypot(c.endRe[s], c.endIm[s]));
    if (m > peaks[w[s]].peakAmps) peaks[w[s]].peakAmps = m;
  }
  return peaks;
}
