/**
 * Speed benchmarks (not tests: nothing here asserts a time).
 *
 *   npm run bench                     readable table of medians
 *   npm run --silent bench -- --json  {"cases":[{name, unknowns, frequencies, medianMs, ...}]} on stdout
 *   npm run bench -- --only=lu-400    run one case (comma-separated list allowed)
 *
 * Cases: lu-400 (target ≥ 8 GFlop/s, counting 8/3·n³), lu-400-naive (the plain triple loop, for scale),
 * ldlt-400, zlu-200 / zsym-200 (the real yard-200 matrix, pivoted LU vs factorSymmetric), yard-200
 * (< 20 ms), sweep-41 (< 250 ms), yard-200-real (no target yet), plan-quick (the live quick pass on the
 * demo plan while a support is dragged, < 30 ms). Model cases skip, with a note, when the engine cannot
 * run them.
 *
 * Each case is warmed up (so the JIT has compiled the hot loops) and then repeated. lu-400 warms up
 * longest: V8 first runs the WebAssembly kernel in its baseline tier and moves it to the optimising tier
 * only after some dozens of 400×400 factorisations (measured: ~25 ms per solve before, ~17 ms after). We report the median
 * wall time, robust to the odd slow run; the minimum, the machine's best; and the median CPU time of this
 * process, which waiting for a core on a loaded machine does not inflate (sharing caches still does).
 * Notes (skipped cases, sanity warnings) go to stderr so the JSON on stdout stays clean.
 */

import { readFileSync } from "node:fs";
import type { SolveOptions, SolveResult, WireModel } from "../../solver/model/types";
import { factorSymmetric, ldltFactor, ldltSolve, luFactor, luSolve } from "../../solver/mom/lu";
import { randomSystem, relResidual } from "../unit/linalg/reference";
import { AVERAGE_GROUND, PERFECT_GROUND, yardModel } from "./models";
import { naiveLuFactor } from "./naive-lu";

interface CaseResult extends Facts {
  name: string;
  medianMs: number;
  minMs: number;
  /** Median CPU time of this process per run (user + system), ms. */
  medianCpuMs: number;
  runs: number;
  gflops?: number;
}

/** What a case reports about itself besides the timings. */
interface Facts {
  unknowns: number;
  frequencies: number;
  targetMs?: number;
  [extra: string]: unknown;
}

interface BenchCase {
  name: string;
  warmup: number;
  runs: number;
  /** Builds the inputs once; run() is timed per repetition, describe() reports on the last run. */
  prepare(): Promise<{
    run: () => void;
    describe: () => Facts;
  }>;
}

const args = process.argv.slice(2);
const json = args.includes("--json");
const only = args
  .find((a) => a.startsWith("--only="))
  ?.slice(7)
  .split(",");
const note = (msg: string) => process.stderr.write(`${msg}\n`);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** 8/3·n³ real flops: complex LU costs n³/3 complex multiply-adds, each 8 real flops (solve is O(n²)). */
const luFlops = (n: number) => (8 / 3) * n ** 3;

type FactorSolve = (
  n: number,
  re: Float64Array,
  im: Float64Array,
  piv: Int32Array,
  bRe: Float64Array,
  bIm: Float64Array,
) => void;

const luPair: FactorSolve = (n, re, im, piv, br, bi) => {
  luFactor(n, re, im, piv);
  luSolve(n, re, im, piv, br, bi);
};
const naivePair: FactorSolve = (n, re, im, piv, br, bi) => {
  naiveLuFactor(n, re, im, piv);
  luSolve(n, re, im, piv, br, bi);
};
const ldltPair: FactorSolve = (n, re, im, _piv, br, bi) => {
  ldltFactor(n, re, im);
  ldltSolve(n, re, im, br, bi);
};

function luCase(
  name: string,
  n: number,
  factorSolve: FactorSolve,
  symmetric: boolean,
  warmup: number,
  runs: number,
): BenchCase {
  return {
    name,
    warmup,
    runs,
    async prepare() {
      // LU: a plain random matrix (no diagonal shift), so partial pivoting really swaps rows.
      // LDLᵀ (no pivoting): complex symmetric with a strong diagonal, the kind it is meant for.
      const sys = symmetric
        ? randomSystem(n, 20240601, { symmetric: true })
        : randomSystem(n, 20240601, { diagonalShift: 0 });
      const re = new Float64Array(n * n);
      const im = new Float64Array(n * n);
      const piv = new Int32Array(n);
      const xr = new Float64Array(n);
      const xi = new Float64Array(n);
      return {
        run() {
          re.set(sys.aRe);
          im.set(sys.aIm);
          xr.set(sys.bRe);
          xi.set(sys.bIm);
          factorSolve(n, re, im, piv, xr, xi);
        },
        describe() {
          const residual = relResidual(n, sys.aRe, sys.aIm, xr, xi, sys.bRe, sys.bIm);
          if (!(residual < 1e-9))
            note(`WARNING ${name}: relative residual ${residual} — the result is wrong`);
          return { unknowns: n, frequencies: 1, residual };
        },
      };
    },
  };
}

type Solve = (model: WireModel, options?: SolveOptions) => SolveResult;
let solveModelCache: Solve | null | undefined;

/** The engine is written in parallel with this harness: load it lazily and report when it is missing. */
async function loadSolveModel(): Promise<Solve | null> {
  if (solveModelCache !== undefined) return solveModelCache;
  try {
    const mod = (await import("../../solver/index")) as { solveModel?: Solve };
    solveModelCache = typeof mod.solveModel === "function" ? mod.solveModel : null;
    if (!solveModelCache) note("solver/index.ts has no solveModel export: not available yet");
  } catch (e) {
    note(`solveModel not available yet (${(e as Error).message.split("\n")[0]})`);
    solveModelCache = null;
  }
  return solveModelCache;
}

class Skip extends Error {}

type Internals = (
  model: WireModel,
  options?: SolveOptions,
) => { internals: { solver: { matrixAt(hz: number): { re: Float64Array; im: Float64Array; n: number } } } };

/**
 * Factor + solve the real yard-200 impedance matrix (not a random one): the pivoted LU against
 * factorSymmetric (LDLᵀ when safe), to show what the symmetric path saves on the matrices we have.
 */
function zMatrixCase(name: string, symmetric: boolean): BenchCase {
  return {
    name,
    warmup: 10,
    runs: 31,
    async prepare() {
      let prep: Internals | undefined;
      try {
        prep = ((await import("../../solver/index")) as { prepareInternal?: Internals }).prepareInternal;
      } catch {
        prep = undefined;
      }
      if (!prep) throw new Skip("prepareInternal not available");
      const z = prep(yardModel(PERFECT_GROUND, [14.15]), { patternStepDeg: 0 }).internals.solver.matrixAt(
        14.15e6,
      );
      const n = z.n;
      const aRe = z.re.slice(0, n * n);
      const aIm = z.im.slice(0, n * n);
      const re = new Float64Array(n * n);
      const im = new Float64Array(n * n);
      const piv = new Int32Array(n);
      const xr = new Float64Array(n);
      const xi = new Float64Array(n);
      let used = "lu";
      return {
        run() {
          re.set(aRe);
          im.set(aIm);
          xr.fill(0);
          xi.fill(0);
          xr[n >> 1] = 1;
          if (symmetric) used = factorSymmetric(n, re, im, piv);
          else luFactor(n, re, im, piv);
          luSolve(n, re, im, piv, xr, xi);
        },
        describe() {
          return { unknowns: n, frequencies: 1, factorisation: used };
        },
      };
    },
  };
}

function modelCase(
  name: string,
  model: WireModel,
  options: SolveOptions,
  targetMs: number | undefined,
  warmup: number,
  runs: number,
): BenchCase {
  return {
    name,
    warmup,
    runs,
    async prepare() {
      const solve = await loadSolveModel();
      if (!solve) throw new Skip("solveModel not available yet");
      let last: SolveResult | undefined;
      try {
        last = solve(model, options);
      } catch (e) {
        throw new Skip(`solveModel threw: ${(e as Error).message.split("\n")[0]}`);
      }
      return {
        run() {
          last = solve(model, options);
        },
        describe() {
          const r = last!;
          const mid = r.results[r.results.length >> 1];
          // Fast garbage is worthless: a sweep (possibly interpolated) must agree with a plain solve.
          // Check a quarter-band point: the band centre and edges may be the interpolation's own samples.
          let sweepCheck: number | undefined;
          if (r.results.length > 1) {
            const q = r.results[r.results.length >> 2];
            const single = solve({ ...model, frequenciesMHz: [q.mhz] }, { patternStepDeg: 0 }).results[0];
            const dz = Math.hypot(q.impedance[0] - single.impedance[0], q.impedance[1] - single.impedance[1]);
            sweepCheck = dz / Math.hypot(single.impedance[0], single.impedance[1]);
            if (!(sweepCheck < 1e-2)) {
              note(
                `WARNING ${name}: Z at ${q.mhz} MHz is ${q.impedance} in the sweep but ${single.impedance} alone`,
              );
            }
          }
          return {
            ...(sweepCheck !== undefined ? { sweepVsSingleRelErr: sweepCheck } : {}),
            unknowns: r.unknowns,
            frequencies: r.results.length,
            ...(targetMs !== undefined ? { targetMs } : {}),
            mhz: mid.mhz,
            impedance: mid.impedance,
            swr: mid.swr,
            ...(options.patternStepDeg ? { peakGainDbi: mid.peakGainDbi } : {}),
            groundMethod: r.groundMethod,
          };
        },
      };
    },
  };
}

/**
 * The live quick pass the editor runs on every drag event: the demo plan with its oak moved a little
 * further east on every run, as a drag does (new geometry, and a slightly different mean wire height,
 * each call — nothing is revisited, so no per-geometry cache can hide the work).
 */
function planQuickCase(): BenchCase {
  return {
    name: "plan-quick",
    warmup: 5,
    runs: 31,
    async prepare() {
      const { analyzePlan } = await import("../../solver/plan/analyze");
      const { parsePlan } = await import("../../solver/plan/schema");
      const url = new URL("../../public/demo-plan.json", import.meta.url);
      const plan = parsePlan(JSON.parse(readFileSync(url, "utf8")));
      const oak = plan.supports.findIndex((s) => s.id === "oak");
      const at = plan.supports[oak];
      if (at.type !== "tree") throw new Skip("demo plan: the oak is not a tree any more");
      let step = 0;
      let last: ReturnType<typeof analyzePlan> | undefined;
      return {
        run() {
          step++;
          const supports = [...plan.supports];
          supports[oak] = { ...at, position: [at.position[0] + 0.02 * step, at.position[1] - 0.01 * step] };
          last = analyzePlan({ ...plan, supports }, { quick: true });
        },
        describe() {
          const a = last!;
          const b = a.bands[0];
          return {
            unknowns: a.unknowns,
            frequencies: b.sweep.length, // the band centre (pattern solve) is the middle sweep point
            targetMs: 30,
            mhz: b.centreMHz,
            impedance: b.feedImpedance,
            swr: b.sweep[b.sweep.length >> 1].swr,
            peakGainDbi: b.peakGainDbi,
            vsIdealDipoleDb: b.vsIdealDipoleDb,
            groundMethod: a.groundMethod,
          };
        },
      };
    },
  };
}

const cases: BenchCase[] = [
  luCase("lu-400", 400, luPair, false, 70, 31),
  luCase("lu-400-naive", 400, naivePair, false, 1, 5),
  luCase("ldlt-400", 400, ldltPair, true, 30, 31),
  zMatrixCase("zlu-200", false),
  zMatrixCase("zsym-200", true),
  modelCase("yard-200", yardModel(PERFECT_GROUND, [14.15]), { patternStepDeg: 2 }, 20, 10, 31),
  modelCase(
    "sweep-41",
    yardModel(PERFECT_GROUND, { from: 14.0, to: 14.35, count: 41 }),
    { patternStepDeg: 0 },
    250,
    1,
    5,
  ),
  // No target given for real ground yet: reported, not judged.
  modelCase("yard-200-real", yardModel(AVERAGE_GROUND, [14.15]), { patternStepDeg: 2 }, undefined, 5, 15),
  planQuickCase(),
];

async function main(): Promise<void> {
  const out: CaseResult[] = [];
  for (const c of cases) {
    if (only && !only.includes(c.name)) continue;
    let prepared: Awaited<ReturnType<BenchCase["prepare"]>>;
    try {
      prepared = await c.prepare();
    } catch (e) {
      if (e instanceof Skip) {
        note(`skip ${c.name}: ${e.message}`);
        continue;
      }
      throw e;
    }
    for (let i = 0; i < c.warmup; i++) prepared.run();
    const times: number[] = [];
    // CPU time of this process as well: on a loaded machine the wall time includes waiting for a core.
    const cpu: number[] = [];
    for (let i = 0; i < c.runs; i++) {
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      prepared.run();
      times.push(performance.now() - t0);
      const dc = process.cpuUsage(c0);
      cpu.push((dc.user + dc.system) / 1000);
    }
    const facts = prepared.describe();
    const res: CaseResult = {
      name: c.name,
      ...facts,
      medianMs: round(median(times), 2),
      minMs: round(Math.min(...times), 2),
      medianCpuMs: round(median(cpu), 2),
      runs: c.runs,
    };
    if (c.name.startsWith("lu-") || c.name.startsWith("ldlt-")) {
      // LDLᵀ does half the flops; its figure is "LU-equivalent" so the rows compare directly.
      res.gflops = round(luFlops(facts.unknowns) / (res.medianMs * 1e6), 2);
      if (c.name === "lu-400") res.targetGflops = 8;
    }
    out.push(res);
    if (!json) printRow(res);
  }
  if (json) process.stdout.write(`${JSON.stringify({ cases: out }, null, 2)}\n`);
}

const round = (x: number, d: number) => Math.round(x * 10 ** d) / 10 ** d;

let headerDone = false;
function printRow(r: CaseResult): void {
  if (!headerDone) {
    console.log(
      `${"case".padEnd(15)}${"unknowns".padStart(9)}${"freqs".padStart(7)}${"median ms".padStart(11)}${"min ms".padStart(9)}${"cpu ms".padStart(9)}${"target".padStart(9)}  notes`,
    );
    headerDone = true;
  }
  const target = r.targetMs !== undefined ? `<${r.targetMs}` : r.targetGflops ? `≥${r.targetGflops}GF` : "";
  const notes: string[] = [];
  if (r.gflops !== undefined) {
    notes.push(
      `${r.gflops} GFlop/s${r.name.startsWith("ldlt-") ? " (LU-equivalent: 8/3·n³ over the time)" : ""}`,
    );
  }
  if (typeof r.factorisation === "string") notes.push(`yard-200 Z, ${r.factorisation}`);
  if (Array.isArray(r.impedance)) {
    const [zr, zi] = r.impedance as number[];
    notes.push(
      `Z ${zr.toFixed(1)}${zi < 0 ? "−" : "+"}j${Math.abs(zi).toFixed(1)} Ω`,
      `SWR ${(r.swr as number).toFixed(2)}`,
    );
  }
  console.log(
    `${r.name.padEnd(15)}${String(r.unknowns).padStart(9)}${String(r.frequencies).padStart(7)}${r.medianMs.toFixed(2).padStart(11)}${r.minMs.toFixed(2).padStart(9)}${r.medianCpuMs.toFixed(2).padStart(9)}${target.padStart(9)}  ${notes.join(", ")}`,
  );
}

main().catch((e) => {
  note(`benchmark failed: ${(e as Error).stack ?? e}`);
  process.exitCode = 1;
});
