import { prepareModel } from "../index";
import { bandCentre, bandEdges } from "./bands";
import { compilePlan } from "./compile";
import { handbookDipoleM } from "./ideal-dipole";
import type { Anchor, BandName, Plan, Point2, Point3, WireGauge, WireRun } from "./schema";
import { PlanError } from "./schema";
import { type TrimResult, trimByFrequency, trimToResonance } from "./trim";
import { nearestOnPolyline, polygonCentroid, roofHeightAt } from "./yard-geometry";

/**
 * Resonant starting layouts for a chosen band between two chosen supports. Each template is a layout
 * as a function of one length (the total conductor length, or for a few the part that can grow); it
 * starts from the handbook length and is trimmed with the solver until the feed reactance at the band
 * centre is zero (secant steps on X, solving the whole plan so nearby metal counts).
 *
 * Handbook lengths (common practice, no published source): half-wave dipole 468/f(MHz) ft, quarter-wave
 * vertical 234/f ft.
 */

export type TemplateKind =
  | "straight-dipole"
  | "inverted-v"
  | "drooped-dipole"
  | "l-dipole"
  | "z-dipole"
  | "ocf-dipole"
  | "end-fed-half-wave"
  | "vertical";

export const TEMPLATE_KINDS: readonly TemplateKind[] = [
  "straight-dipole",
  "inverted-v",
  "drooped-dipole",
  "l-dipole",
  "z-dipole",
  "ocf-dipole",
  "end-fed-half-wave",
  "vertical",
];

export interface TemplateRequest {
  kind: TemplateKind;
  band: BandName;
  /** First support (the apex support of an inverted V, the base support of a vertical). */
  from: string;
  /** Second support (sets the direction for the inverted V and the vertical). */
  to: string;
  /** Attach height (m); default the lower of the two supports' usable heights. */
  height?: number;
  wire?: WireGauge;
  id?: string;
  name?: string;
  /** Trim to resonance with the solver (default true). */
  trim?: boolean;
}

export interface TemplateResult {
  run: WireRun;
  /** The plan with the run added (replacing any run of the same id), set as the analysed run. */
  plan: Plan;
  handbookLengthM: number;
  /** Value of the template's length parameter after trimming (total conductor for most). */
  lengthM: number;
  trim: TrimResult | undefined;
  /** Set when trimming could not reach resonance (the layout is returned as trimmed so far). */
  warning?: string;
}

/** End rope kept at each support, metres (so the wire end clears the trunk or pole). */
const MIN_ROPE = 0.5;
/** Half-angle below horizontal of inverted-V legs: 120° included angle (common practice). */
const INVERTED_V_DROP_DEG = 30;
const OCF_FRACTION = 1 / 3;
/** End-fed half-wave counterpoise, as a fraction of the wavelength (common practice, no source). */
const EFHW_COUNTERPOISE = 0.05;
const VERTICAL_RADIALS = 8;

interface Site {
  p: Point2;
  height: number;
  anchor: (id: string, height: number, rope: number) => Anchor;
}

function site(plan: Plan, supportId: string, toward: Point2 | undefined, field: string): Site {
  const s = plan.supports.find((x) => x.id === supportId);
  if (!s) throw new PlanError(field, `no support with id "${supportId}"`, supportId);
  if (s.type === "building") {
    // Attach at the footprint vertex nearest the other support, on the roofline there.
    const target = toward ?? polygonCentroid(s.footprint);
    const corner = [...s.footprint].sort(
      (a, b) =>
        Math.hypot(a[0] - target[0], a[1] - target[1]) - Math.hypot(b[0] - target[0], b[1] - target[1]),
    )[0];
    // Step 1 cm inside so the point is on the roof.
    const c = polygonCentroid(s.footprint);
    const at: Point2 = [corner[0] + (c[0] - corner[0]) * 0.01, corner[1] + (c[1] - corner[1]) * 0.01];
    const h = roofHeightAt(s, at) ?? s.eaveHeight;
    return {
      p: at,
      height: h,
      anchor: (id, _height, rope) => ({ kind: "roof", id, name: "", support: s.id, at, rope }),
    };
  }
  const p: Point2 =
    s.type === "fence" ? nearestOnPolyline(toward ?? s.path[0], s.path).point : ([...s.position] as Point2);
  return {
    p,
    height: s.height,
    anchor: (id, height, rope) => ({
      kind: "support",
      id,
      name: "",
      support: s.id,
      height,
      ...(s.type === "fence" ? { at: p } : {}),
      rope,
    }),
  };
}

const free = (id: string, position: Point3): Anchor => ({ kind: "free", id, name: "", position });

export function buildTemplate(plan: Plan, req: TemplateRequest): TemplateResult {
  const a0 = plan.supports.find((s) => s.id === req.from);
  const b0 = plan.supports.find((s) => s.id === req.to);
  if (!a0) throw new PlanError("template.from", `no support with id "${req.from}"`);
  if (!b0) throw new PlanError("template.to", `no support with id "${req.to}"`);
  const pos = (s: typeof a0): Point2 =>
    s.type === "building" ? polygonCentroid(s.footprint) : s.type === "fence" ? s.path[0] : s.position;
  const A = site(plan, req.from, pos(b0), "template.from");
  const B = site(plan, req.to, A.p, "template.to");
  const band = bandEdges(req.band, plan.ituRegion);
  const mhz = bandCentre(band);
  const lambda = 299.792458 / mhz;
  const id = req.id ?? `${req.kind}-${req.band.replace(" ", "")}`;
  const height = req.height ?? Math.min(A.height, B.height);
  const wire: WireGauge = req.wire ?? { awg: 14 };
  const span = Math.hypot(B.p[0] - A.p[0], B.p[1] - A.p[1]);
  const ux = (B.p[0] - A.p[0]) / span;
  const uy = (B.p[1] - A.p[1]) / span;
  const at = (d: number, side: number, z: number): Point3 => [
    A.p[0] + ux * d - uy * side,
    A.p[1] + uy * d + ux * side,
    z,
  ];
  const base: Omit<WireRun, "anchors"> = {
    id,
    name: req.name ?? `${req.band} ${req.kind.replace(/-/g, " ")}`,
    wire,
    material: "copper",
  };
  const feed = (at: number, ratio = 1): WireRun["feed"] => ({ at, system: { kind: "transformer", ratio } });
  const fits = (L: number, what: string) => {
    if (L > span - 2 * MIN_ROPE) {
      throw new PlanError(
        "template",
        `a ${L.toFixed(1)} m ${what} with ${MIN_ROPE} m of rope at each end does not fit the ${span.toFixed(1)} m between "${req.from}" and "${req.to}": try drooped ends or a bent dipole`,
      );
    }
  };

  let layout: (L: number) => WireRun;
  let start = handbookDipoleM(mhz);
  let bounds: { min: number; max: number } | undefined;
  switch (req.kind) {
    case "straight-dipole":
    case "ocf-dipole":
    case "end-fed-half-wave": {
      const efhw = req.kind === "end-fed-half-wave";
      const cp = efhw ? EFHW_COUNTERPOISE * lambda : 0;
      // The EFHW radiator is a touch longer than a centre-fed half wave (its end is not a gap).
      if (efhw) start = 0.49 * lambda;
      layout = (L) => {
        fits(L, "wire");
        const rope = (span - L) / 2;
        return {
          ...base,
          anchors: [A.anchor(`${id}-a`, height, rope), B.anchor(`${id}-b`, height, rope)],
          ...(efhw
            ? {
                droops: [
                  { id: `${id}-counterpoise`, name: "counterpoise", end: "start" as const, length: cp },
                ],
              }
            : {}),
          feed: efhw
            ? feed(cp / (cp + L), 49)
            : req.kind === "ocf-dipole"
              ? feed(OCF_FRACTION, 4)
              : feed(0.5),
        };
      };
      break;
    }
    case "drooped-dipole":
    case "z-dipole": {
      const flat = span - 2 * MIN_ROPE;
      // A trimmed dipole runs up to ~5 % longer than the handbook length: only when even that fits
      // is there nothing to droop or bend.
      if (flat >= 1.05 * start) {
        throw new PlanError(
          "template",
          `the ${span.toFixed(1)} m between "${req.from}" and "${req.to}" already takes a whole ${start.toFixed(1)} m dipole: use a straight dipole`,
        );
      }
      start = Math.max(start, flat + 0.2);
      bounds = { min: flat + 0.3, max: start * 1.5 };
      layout = (L) => {
        const leg = (L - flat) / 2;
        const run: WireRun = {
          ...base,
          anchors: [A.anchor(`${id}-a`, height, MIN_ROPE), B.anchor(`${id}-b`, height, MIN_ROPE)],
          feed: feed(0.5),
        };
        if (req.kind === "drooped-dipole") {
          if (leg > height - 0.3)
            throw new PlanError("template", `the droops (${leg.toFixed(1)} m) would reach the ground`);
          run.droops = [
            { id: `${id}-droop-a`, name: "droop", end: "start", length: leg },
            { id: `${id}-droop-b`, name: "droop", end: "end", length: leg },
          ];
        } else {
          // Ends turn 90° in opposite directions, level with the span: a Z seen from above.
          const e0 = at(MIN_ROPE, leg, height);
          const e1 = at(span - MIN_ROPE, -leg, height);
          run.anchors = [
            free(`${id}-end-a`, e0),
            free(`${id}-bend-a`, at(MIN_ROPE, 0, height)),
            free(`${id}-bend-b`, at(span - MIN_ROPE, 0, height)),
            free(`${id}-end-b`, e1),
          ];
        }
        return run;
      };
      break;
    }
    case "l-dipole": {
      // One leg from A to B (the corner, roped to B), the other turning 90° there, level.
      const leg1 = span - 2 * MIN_ROPE;
      if (leg1 >= 1.05 * start) {
        throw new PlanError(
          "template",
          `the ${span.toFixed(1)} m between "${req.from}" and "${req.to}" already takes a whole ${start.toFixed(1)} m dipole: use a straight dipole`,
        );
      }
      start = Math.max(start, leg1 + 0.5);
      bounds = { min: leg1 + 0.1, max: start * 1.5 };
      layout = (L) => {
        const leg2 = L - leg1;
        return {
          ...base,
          anchors: [
            A.anchor(`${id}-a`, height, MIN_ROPE),
            free(`${id}-corner`, at(span - MIN_ROPE, 0, height)),
            free(`${id}-end`, at(span - MIN_ROPE, leg2, height)),
          ],
          feed: feed(0.5),
        };
      };
      break;
    }
    case "inverted-v": {
      const s = Math.sin((INVERTED_V_DROP_DEG * Math.PI) / 180);
      const c = Math.cos((INVERTED_V_DROP_DEG * Math.PI) / 180);
      layout = (L) => {
        const leg = L / 2;
        const endZ = height - leg * s;
        if (endZ < 0.3)
          throw new PlanError(
            "template",
            `the legs would reach the ground from ${height.toFixed(1)} m: use a taller support or a bent dipole`,
          );
        return {
          ...base,
          anchors: [
            free(`${id}-end-a`, at(-leg * c, 0, endZ)),
            A.anchor(`${id}-apex`, height, 0),
            free(`${id}-end-b`, at(leg * c, 0, endZ)),
          ],
          feed: feed(0.5),
        };
      };
      break;
    }
    case "vertical": {
      // A quarter-wave wire beside support A (1 m toward B, clear of the trunk), fed at its base against
      // a radial field; the top is roped to the support (rope not modelled).
      start = (234 / mhz) * 0.3048;
      const radial = lambda / 4;
      layout = (L) => {
        if (L > height + 0.5)
          throw new PlanError("template", `a ${L.toFixed(1)} m vertical is taller than "${req.from}"`);
        return {
          ...base,
          anchors: [free(`${id}-base`, at(1, 0, 0)), free(`${id}-top`, at(1, 0, L))],
          groundStart: { kind: "radials", count: VERTICAL_RADIALS, length: radial },
          // Just above the base node, which is the radial hub (a junction).
          feed: feed(0.02),
        };
      };
      break;
    }
  }

  const withRun = (run: WireRun): Plan => ({
    ...plan,
    wireRuns: [...plan.wireRuns.filter((r) => r.id !== run.id), run],
    analysis: { ...(plan.analysis ?? {}), activeRun: run.id },
  });
  // Trim in the plan as it will be analysed: other runs stay (parasitic, or terminated at their feeds).
  const trimPlan = withRun;
  // Compiled for the band edges, as the analysis compiles it: the same mesh and ground method.
  const build = (L: number) =>
    compilePlan(trimPlan(layout(L)), { frequenciesMHz: [band.lowMHz, band.highMHz] }).model;
  let trim: TrimResult | undefined;
  let L = start;
  if (req.trim !== false) {
    // The end-fed half wave with a short counterpoise stays capacitive through its high-impedance peak
    // (X has no zero there): it is trimmed to put its SWR minimum against the 49:1 reference at the centre.
    trim =
      req.kind === "end-fed-half-wave"
        ? trimByFrequency(build, start, mhz, "swr-min")
        : trimToResonance(build, start, mhz, bounds);
    L = trim.lengthM;
  }
  const run = layout(L);
  const out: TemplateResult = { run, plan: withRun(run), handbookLengthM: start, lengthM: L, trim };
  if (trim && !trim.converged) {
    out.warning = `could not trim "${run.name}" to resonance at ${mhz.toFixed(3)} MHz: ${trim.residualOhms.toFixed(0)} Ω of reactance is left (nearby wires couple to it, or the layout runs out of room)`;
  }
  return out;
}

/** Total conductor length of a run as compiled (droops included). */
export function runConductorLength(plan: Plan, runId: string): number {
  const c = compilePlan(plan);
  return c.parts
    .filter((p) => (p.kind === "span" && p.elementId === runId) || (p.kind === "droop" && p.part === runId))
    .reduce((s, p) => s + p.toM - p.fromM, 0);
}

/** Series resonance of the plan's active run nearest the band centre, from a small local sweep. */
export function planResonanceNear(plan: Plan, mhz: number): number | undefined {
  const edges = plan.bands.flatMap((b) => {
    const e = bandEdges(b, plan.ituRegion);
    return [e.lowMHz, e.highMHz];
  });
  const model = compilePlan(plan, { frequenciesMHz: edges }).model;
  const f = [0.97, 0.985, 1, 1.015, 1.03].map((k) => k * mhz);
  const p = prepareModel(model, { patternStepDeg: 0 });
  const x = f.map((m) => p.solveAt(m * 1e6, { patternStepDeg: 0 }).impedance[1]);
  for (let i = 1; i < f.length; i++) {
    if (x[i - 1] * x[i] <= 0) return f[i - 1] - (x[i - 1] * (f[i] - f[i - 1])) / (x[i] - x[i - 1]);
  }
  return undefined;
}
