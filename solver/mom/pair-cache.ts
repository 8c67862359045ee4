/**
 * Reuse of segment-pair integrals along straight, evenly cut runs.
 *
 * On a straight run of equal segments, the pair (i, j) is the pair (i + 1, j + 1) translated, so its
 * integrals depend on j − i only (Toeplitz). The same holds between two runs whose segments are equal
 * vectors ℓ·t̂ and radii (parallel wires cut alike, a horizontal run and its ground image). When the
 * segment vectors are opposite (a vertical run and its image), the pair depends on i + j (Hankel).
 * A dipole of N segments then needs N pair integrals instead of N²/2. Results are identical up to
 * rounding (the geometry is the same, only translated).
 *
 * The same classes serve any pair quantity that depends only on the relative geometry of p and q: the
 * reflected field of a flat ground (perfect or lossy) depends on the observer and the source's image
 * only through their difference (ρ, z + z′), so a ground's whole pair term may be cached here against
 * the mirrored set, with its own `compute` and `width` (real.ts does this for the Sommerfeld terms).
 */
import { pairIntegrals } from "./pair-integrals";
import type { SegmentSet } from "./segments";

/** Pool limit (doubles) so that pathological models (many identical parallel runs) cannot blow memory. */
const MAX_POOL = 4_000_000;

export interface Runs {
  /** Run index of each segment, runs numbered in segment order. */
  runOf: Int32Array;
  /** Position of each segment within its run. */
  index: Int32Array;
  /** Segment count of each run. */
  length: Int32Array;
  /** First segment of each run. */
  first: Int32Array;
}

/** Maximal sequences of consecutive segments on one wire with equal direction, length and radius. */
export function findRuns(S: SegmentSet, wireOfSegment: Int32Array): Runs {
  const runOf = new Int32Array(S.n);
  const index = new Int32Array(S.n);
  const lengths: number[] = [];
  const firsts: number[] = [];
  for (let s = 0; s < S.n; s++) {
    const t = s - 1;
    const same =
      s > 0 &&
      wireOfSegment[s] === wireOfSegment[t] &&
      Math.abs(S.len[s] - S.len[t]) <= 1e-12 * S.len[s] &&
      S.radius[s] === S.radius[t] &&
      Math.abs(S.dir[3 * s] - S.dir[3 * t]) <= 1e-12 &&
      Math.abs(S.dir[3 * s + 1] - S.dir[3 * t + 1]) <= 1e-12 &&
      Math.abs(S.dir[3 * s + 2] - S.dir[3 * t + 2]) <= 1e-12;
    if (same) {
      runOf[s] = runOf[t];
      index[s] = index[t] + 1;
      lengths[lengths.length - 1]++;
    } else {
      runOf[s] = lengths.length;
      index[s] = 0;
      lengths.push(1);
      firsts.push(s);
    }
  }
  return { runOf, index, length: Int32Array.from(lengths), first: Int32Array.from(firsts) };
}

/** A pair quantity to cache instead of pairIntegrals: writes `width` numbers for (p, q) into out. */
export interface PairQuantity {
  width: number;
  compute(p: number, q: number, out: Float64Array): void;
}

export class PairCache {
  private readonly nRuns: number;
  private readonly width: number;
  private readonly compute: (p: number, q: number, out: Float64Array) => void;
  /** Per run pair (A·nRuns + B): slot base in the pool, −1 when the pair is not translation-equivalent. */
  private readonly base: Int32Array;
  /** 1: key j − i (Toeplitz), 2: key i + j (Hankel). */
  private readonly mode: Uint8Array;
  private readonly pool: Float64Array;
  private readonly stamp: Uint32Array;
  private epoch = 0;
  private k = Number.NaN;

  constructor(
    private readonly P: SegmentSet,
    private readonly Q: SegmentSet,
    private readonly runs: Runs,
    enabled = true,
    quantity?: PairQuantity,
  ) {
    this.width = quantity?.width ?? 8;
    this.compute = quantity
      ? quantity.compute
      : (p: number, q: number, out: Float64Array) => pairIntegrals(this.P, p, this.Q, q, this.k, out);
    const width = this.width;
    const nR = runs.length.length;
    this.nRuns = nR;
    this.base = new Int32Array(nR * nR).fill(-1);
    this.mode = new Uint8Array(nR * nR);
    let size = 0;
    for (let A = 0; A < nR; A++) {
      const sa = runs.first[A];
      if (runs.length[A] < 2) continue;
      for (let B = 0; B < nR; B++) {
        const sb = runs.first[B];
        if (runs.length[B] < 2 || P.radius[sa] !== Q.radius[sb]) continue;
        const la = P.len[sa];
        const lb = Q.len[sb];
        let plus = 0;
        let minus = 0;
        for (let c = 0; c < 3; c++) {
          const va = la * P.dir[3 * sa + c];
          const vb = lb * Q.dir[3 * sb + c];
          plus = Math.max(plus, Math.abs(va - vb));
          minus = Math.max(minus, Math.abs(va + vb));
        }
        const m = plus <= 1e-12 * la ? 1 : minus <= 1e-12 * la ? 2 : 0;
        if (m === 0 || !enabled) continue;
        const slots = runs.length[A] + runs.length[B] - 1;
        if ((size + slots) * width > MAX_POOL) continue;
        this.base[A * nR + B] = size;
        this.mode[A * nR + B] = m;
        size += slots;
      }
    }
    this.pool = new Float64Array(width * size);
    this.stamp = new Uint32Array(size);
  }

  /** Start a new fill at wavenumber k (invalidates what was cached). */
  begin(k: number): void {
    this.k = k;
    this.epoch++;
  }

  /** pairIntegrals(P, p, Q, q, k) (or the given quantity) into out, computed once per translation class. */
  get(p: number, q: number, out: Float64Array): void {
    const r = this.runs;
    const A = r.runOf[p];
    const B = r.runOf[q];
    const key = A * this.nRuns + B;
    const b = this.base[key];
    if (b < 0) {
      this.compute(p, q, out);
      return;
    }
    const slot =
      b + (this.mode[key] === 1 ? r.index[q] - r.index[p] + r.length[A] - 1 : r.index[q] + r.index[p]);
    const wd = this.width;
    const o = wd * slot;
    if (this.stamp[slot] === this.epoch) {
      for (let i = 0; i < wd; i++) out[i] = this.pool[o + i];
      return;
    }
    this.compute(p, q, out);
    for (let i = 0; i < wd; i++) this.pool[o + i] = out[i];
    this.stamp[slot] = this.epoch;
  }
}
