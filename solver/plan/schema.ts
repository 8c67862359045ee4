import { z } from "zod";
import { ModelError } from "../model/errors";

/**
 * The yard plan: what the user sketches (trees, poles, buildings, paths, wire runs) as a versioned JSON
 * document. It is compiled into the solver's wire model by `compile.ts`.
 *
 * Conventions (so the app and the solver agree without conversions in between):
 * - Lengths are metres everywhere in the document; `units` only says how the user wants them shown.
 * - Plan frame: x and y on the ground in metres, z up from the ground (z = 0). The compiled wire model uses
 *   the same frame unrotated; `lot.northDeg` says where true north is, so bearings can be reported to the user.
 * - Every element has a stable string `id` (unique within the plan) that results point back at, and a `name`.
 * - Angles are degrees. `northDeg` and `ridgeDeg` are measured clockwise from the plan's +y axis.
 */

export const PLAN_VERSION = 1 as const;

/** Plan-specific input error: a ModelError that also carries the id of the element it points at. */
export class PlanError extends ModelError {
  readonly elementId: string | undefined;
  constructor(path: string, message: string, elementId?: string) {
    super(path, message);
    this.name = "PlanError";
    this.elementId = elementId;
  }
}

// ---------- field helpers (messages say what was expected, in words) ----------

const finite = (what = "number") =>
  z
    .number({
      error: (issue) =>
        typeof issue.input === "number"
          ? `expected a finite ${what}, got ${issue.input}`
          : `expected a ${what}`,
    })
    .refine(Number.isFinite, { message: `expected a finite ${what}` });
const positive = (what = "number") =>
  finite(what).refine((v) => v > 0, { message: `expected a positive ${what}` });
const nonNegative = (what = "number") =>
  finite(what).refine((v) => v >= 0, { message: `expected a non-negative ${what}` });
const fraction = (what = "fraction") =>
  finite(what).refine((v) => v >= 0 && v <= 1, { message: `expected a ${what} between 0 and 1` });

const id = z.string({ error: "expected an id (a string)" }).min(1, { message: "expected a non-empty id" });
const name = z.string({ error: "expected a name (a string)" }).default("");

/** A point on the ground, [x, y] metres. */
export const Point2Schema = z.tuple([finite(), finite()], { error: "expected two numbers [x, y] in metres" });
/** A point in space, [x, y, z] metres, z up from the ground. */
export const Point3Schema = z.tuple([finite(), finite(), finite()], {
  error: "expected three numbers [x, y, z] in metres",
});
const polyline = (min: number, what: string) =>
  z.array(Point2Schema, { error: `expected a list of [x, y] points (${what})` }).min(min, {
    message: `expected at least ${min} points (${what})`,
  });

// ---------- ground ties (shared by grounded masts and ground-fed wire runs) ----------

/**
 * How a conductor touching the ground is tied to it. Over perfect ground every tie is ideal.
 * - contact: set in concrete or standing on the soil (the solver's "contact" connection)
 * - rod: a driven ground rod
 * - radials: a radial field; compiled as radial wires just above the ground
 * - ideal: a perfect connection (for comparisons)
 */
export const GroundTieSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("contact") }).strict(),
    z.object({ kind: z.literal("ideal") }).strict(),
    z
      .object({
        kind: z.literal("rod"),
        length: positive("rod length (m)"),
        diameter: positive("rod diameter (m)"),
      })
      .strict(),
    z
      .object({
        kind: z.literal("radials"),
        count: z
          .number({ error: "expected a whole number of radials" })
          .int({ message: "expected a whole number of radials" })
          .min(1, { message: "expected at least one radial" })
          .max(64, { message: "at most 64 radials" }),
        length: positive("radial length (m)"),
        /** Wire diameter of the radials (m); default 1.63 mm (AWG 14). */
        diameter: positive("radial wire diameter (m)").optional(),
        /** Height of the radial field above the ground (m). The thin-wire model cannot bury wires. */
        height: positive("radial height (m)").optional(),
      })
      .strict(),
  ],
  { error: 'expected { "kind": "contact" | "ideal" | "rod" | "radials", ... }' },
);

// ---------- supports ----------

export const TreeSchema = z
  .object({
    type: z.literal("tree"),
    id,
    name,
    position: Point2Schema,
    /** Highest point a rope can be got over, metres above ground: anchors may not be higher. */
    height: positive("attach height (m)").describe("Highest usable attach point, metres above ground"),
    /** Overall tree height for the picture; defaults to the attach height plus a little. */
    totalHeight: positive("tree height (m)").optional(),
    trunkDiameter: positive("trunk diameter (m)").optional(),
    canopyRadius: positive("canopy radius (m)").optional(),
  })
  .strict();

export const GuySchema = z
  .object({
    id,
    name,
    /** Ground anchor of the guy, [x, y]. */
    anchor: Point2Schema,
    attachHeight: positive("guy attach height (m)"),
  })
  .strict();

/** A pole or mast. Conductive ones (aluminium, steel) are part of the antenna system and are modelled. */
export const MastSchema = z
  .object({
    type: z.literal("mast"),
    id,
    name,
    position: Point2Schema,
    height: positive("height (m)"),
    diameter: positive("diameter (m)"),
    material: z.enum(["aluminium", "steel", "wood", "fibreglass"], {
      error: 'expected "aluminium", "steel", "wood" or "fibreglass"',
    }),
    /** Grounded: touches z = 0 through the given tie. Insulated: stands on an insulator, a small gap up. */
    base: z.discriminatedUnion(
      "kind",
      [
        z.object({ kind: z.literal("grounded"), tie: GroundTieSchema }).strict(),
        z
          .object({
            kind: z.literal("insulated"),
            /** Gap between the ground and the bottom of the metal (m); default 0.05. */
            gap: positive("base gap (m)").optional(),
          })
          .strict(),
      ],
      { error: 'expected { "kind": "grounded", "tie": {...} } or { "kind": "insulated" }' },
    ),
    /** Guy lines are rope or broken-up with insulators: drawn, not modelled. */
    guys: z.array(GuySchema).optional(),
  })
  .strict();

/** A building with a gable roof over its footprint (flat when ridge height = eave height). */
export const BuildingSchema = z
  .object({
    type: z.literal("building"),
    id,
    name,
    footprint: polyline(3, "footprint polygon"),
    eaveHeight: positive("eave height (m)"),
    ridgeHeight: positive("ridge height (m)"),
    /** Direction of the ridge line, degrees clockwise from the plan's +y axis. The ridge passes through
     *  the footprint's centroid. */
    ridgeDeg: finite("ridge direction (degrees)")
      .default(0)
      .describe(
        "Ridge direction, degrees clockwise from the plan +y axis; the ridge passes through the centroid",
      ),
  })
  .strict();

export const FenceSchema = z
  .object({
    type: z.literal("fence"),
    id,
    name,
    path: polyline(2, "fence line"),
    height: positive("height (m)"),
    /** Metal fences are drawn and warned about, not yet modelled. */
    material: z.enum(["wood", "metal", "vinyl", "hedge"], {
      error: 'expected "wood", "metal", "vinyl" or "hedge"',
    }),
  })
  .strict();

export const SupportSchema = z.discriminatedUnion(
  "type",
  [TreeSchema, MastSchema, BuildingSchema, FenceSchema],
  {
    error: 'expected a support with "type": "tree" | "mast" | "building" | "fence"',
  },
);

// ---------- hazards and people ----------

export const WalkwaySchema = z
  .object({ id, name, path: polyline(2, "walkway centre line"), width: positive("width (m)") })
  .strict();

export const KeepOutSchema = z
  .object({ id, name, outline: polyline(3, "keep-out outline"), reason: z.string().optional() })
  .strict();

export const PowerLineSchema = z
  .object({
    id,
    name,
    /** Poles or attachment points along the line, [x, y, z] metres. */
    points: z.array(Point3Schema).min(2, { message: "expected at least 2 points (power line)" }),
    /** Free text for the picture and the cautions, e.g. "service drop 240 V". */
    voltage: z.string().optional(),
  })
  .strict();

// ---------- antennas ----------

/**
 * One point a wire run passes through.
 * - support: on a tree, mast or fence at `height` (a fence also needs `at`, the point along it)
 * - roof: on a building at the roofline point `at` [x, y]; z is the roof height there plus `above`
 * - free: a point in space
 * `rope` (end anchors only): rope and insulator from the support toward the wire, metres; the wire's end
 * sits that far from the support along the run. `sagToNext`: mid-span sag of the span to the next anchor.
 */
export const AnchorSchema = z.discriminatedUnion(
  "kind",
  [
    z
      .object({
        kind: z.literal("support"),
        id,
        name,
        support: id,
        height: positive("height (m)"),
        at: Point2Schema.optional(),
        rope: nonNegative("rope length (m)")
          .optional()
          .describe("End anchors: rope and insulator from the support to the wire end, metres"),
        sagToNext: nonNegative("sag (m)")
          .optional()
          .describe("Mid-span sag of the span to the next anchor, metres"),
        /** Only on a conductive mast: the wire is bonded to the mast here instead of insulated from it. */
        bonded: z.boolean().optional(),
      })
      .strict(),
    z
      .object({
        kind: z.literal("roof"),
        id,
        name,
        support: id,
        at: Point2Schema,
        above: nonNegative("height above the roof (m)").optional(),
        rope: nonNegative("rope length (m)")
          .optional()
          .describe("End anchors: rope and insulator from the support to the wire end, metres"),
        sagToNext: nonNegative("sag (m)")
          .optional()
          .describe("Mid-span sag of the span to the next anchor, metres"),
      })
      .strict(),
    z
      .object({
        kind: z.literal("free"),
        id,
        name,
        position: Point3Schema,
        sagToNext: nonNegative("sag (m)")
          .optional()
          .describe("Mid-span sag of the span to the next anchor, metres"),
      })
      .strict(),
  ],
  { error: 'expected an anchor with "kind": "support" | "roof" | "free"' },
);

/** A leg hanging from one end of a run: straight down by `length`, or to a point. */
export const DroopSchema = z
  .object({
    id,
    name,
    end: z.enum(["start", "end"], { error: 'expected "start" or "end"' }),
    length: positive("droop length (m)").optional(),
    to: Point3Schema.optional(),
  })
  .strict()
  .refine((d) => (d.length === undefined) !== (d.to === undefined), {
    message: 'expected exactly one of "length" (straight down) or "to" (a point)',
  });

/** Wire size: an AWG gauge (ASTM B258; 0 = "1/0", −1 = "2/0", −2 = "3/0", −3 = "4/0") or a diameter. */
export const WireGaugeSchema = z.union(
  [
    z
      .object({
        awg: z
          .number({ error: "expected an AWG number" })
          .int({ message: "expected a whole AWG number" })
          .min(-3, { message: "AWG runs from -3 (4/0) to 40" })
          .max(40, { message: "AWG runs from -3 (4/0) to 40" }),
      })
      .strict(),
    z.object({ diameter: positive("wire diameter (m)") }).strict(),
  ],
  { error: 'expected { "awg": n } or { "diameter": metres }' },
);

/** The feed system sets the SWR reference: line impedance × transformer ratio, or a given value. */
export const FeedSystemSchema = z.discriminatedUnion(
  "kind",
  [
    z
      .object({
        kind: z.literal("transformer"),
        /** Impedance ratio n for an n:1 balun/unun (1, 4, 9, 49, ...). */
        ratio: positive("transformer ratio").describe("Impedance ratio n of an n:1 balun or unun"),
        /** Feed line impedance (ohms); default 50. */
        lineOhms: positive("line impedance (ohms)").optional(),
      })
      .strict(),
    z.object({ kind: z.literal("reference"), ohms: positive("reference impedance (ohms)") }).strict(),
  ],
  { error: 'expected { "kind": "transformer", "ratio" } or { "kind": "reference", "ohms" }' },
);

export const FeedSchema = z
  .object({
    /** Fraction of the run's whole conductor length (droops included) from its start end. */
    at: fraction("feed position (fraction of the run)").describe(
      "Fraction of the run's whole conductor (droops included) from its start end",
    ),
    system: FeedSystemSchema.default({ kind: "transformer", ratio: 1 }),
  })
  .strict();

/** A lumped load (loading coil, trap, resistor) at a fraction of the run's conductor length. */
export const PlanLoadSchema = z
  .object({
    id,
    name,
    at: fraction("load position (fraction of the run)"),
    ohms: nonNegative("resistance (ohms)").optional(),
    henries: nonNegative("inductance (H)").optional(),
    farads: nonNegative("capacitance (F)").optional(),
    arrangement: z.enum(["series", "parallel"], { error: 'expected "series" or "parallel"' }).optional(),
  })
  .strict();

export const WireRunSchema = z
  .object({
    id,
    name,
    anchors: z.array(AnchorSchema, { error: "expected a list of anchors" }).min(2, {
      message: "expected at least two anchors (a run needs two ends)",
    }),
    droops: z.array(DroopSchema).optional(),
    wire: WireGaugeSchema,
    material: z
      .enum(["copper", "aluminium", "copper-clad steel", "stainless steel"], {
        error: 'expected "copper", "aluminium", "copper-clad steel" or "stainless steel"',
      })
      .default("copper"),
    /** Total conductor length (m) the user has on the reel; checked against the layout, not used to build it. */
    length: positive("wire length (m)").optional(),
    /** The run's start touches the ground (a ground-fed vertical): tie it to the ground like this. */
    groundStart: GroundTieSchema.optional(),
    feed: FeedSchema.optional(),
    loads: z.array(PlanLoadSchema).optional(),
  })
  .strict();

// ---------- the lot and the whole plan ----------

export const BandNameSchema = z.enum(
  ["160 m", "80 m", "60 m", "40 m", "30 m", "20 m", "17 m", "15 m", "12 m", "10 m"],
  {
    error: 'expected an HF band name such as "20 m"',
  },
);

export const PlanGroundSchema = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("perfect") }).strict(),
    z
      .object({
        kind: z.literal("real"),
        /** A named soil from solver/ground/presets.ts, e.g. "average". Explicit values override it. */
        preset: z.string().optional(),
        conductivity: positive("conductivity (S/m)").optional(),
        permittivity: finite("relative permittivity")
          .refine((v) => v >= 1, { message: "expected a relative permittivity of at least 1" })
          .optional(),
        /** Near-ground interaction method; default "auto" (rigorous when a wire is within 0.1 λ of the
         *  soil). Quick (live) analyses use "reflection" under "auto" while the fed antenna itself stays above
         *  0.1 λ (solver/plan/analyze.ts). */
        method: z
          .enum(["auto", "reflection", "sommerfeld"], {
            error: 'expected "auto", "reflection" or "sommerfeld"',
          })
          .optional(),
      })
      .strict(),
  ],
  { error: 'expected { "kind": "perfect" } or { "kind": "real", ... }' },
);

export const LotSchema = z
  .object({
    outline: polyline(3, "lot outline"),
    /** Where true north is, degrees clockwise from the plan's +y axis (0: +y is north). */
    northDeg: finite("north direction (degrees)")
      .default(0)
      .describe("Where true north is, degrees clockwise from the plan +y axis"),
  })
  .strict();

export const AnalysisSettingsSchema = z
  .object({
    /** Height of the ideal reference dipole (m); default: the plan's mean wire height. */
    referenceHeight: positive("reference dipole height (m)").optional(),
    /** Height a person can reach (m) for the wire-end warning; default 2.4. */
    reachHeight: positive("reach height (m)").optional(),
    /** Which fed run to analyse when several have feeds; default the first. */
    activeRun: z.string().optional(),
  })
  .strict();

export const PlanSchema = z
  .object(
    {
      version: z.literal(PLAN_VERSION, { error: "expected version 1" }),
      name,
      units: z
        .enum(["m", "ft"], { error: 'expected "m" or "ft"' })
        .default("m")
        .describe("Display unit only: every length in the document is metres"),
      lot: LotSchema,
      ituRegion: z.union([z.literal(1), z.literal(2), z.literal(3)], {
        error: "expected ITU region 1, 2 or 3",
      }),
      bands: z.array(BandNameSchema).min(1, { message: "expected at least one band of interest" }),
      ground: PlanGroundSchema,
      supports: z.array(SupportSchema).default([]),
      walkways: z.array(WalkwaySchema).default([]),
      keepOuts: z.array(KeepOutSchema).default([]),
      powerLines: z.array(PowerLineSchema).default([]),
      wireRuns: z.array(WireRunSchema).min(1, { message: "expected at least one wire run" }),
      analysis: AnalysisSettingsSchema.optional(),
    },
    { error: "expected a plan object" },
  )
  .strict();

export type Point2 = z.infer<typeof Point2Schema>;
export type Point3 = z.infer<typeof Point3Schema>;
export type GroundTie = z.infer<typeof GroundTieSchema>;
export type Tree = z.infer<typeof TreeSchema>;
export type Guy = z.infer<typeof GuySchema>;
export type Mast = z.infer<typeof MastSchema>;
export type Building = z.infer<typeof BuildingSchema>;
export type Fence = z.infer<typeof FenceSchema>;
export type Support = z.infer<typeof SupportSchema>;
export type Walkway = z.infer<typeof WalkwaySchema>;
export type KeepOut = z.infer<typeof KeepOutSchema>;
export type PowerLine = z.infer<typeof PowerLineSchema>;
export type Anchor = z.infer<typeof AnchorSchema>;
export type Droop = z.infer<typeof DroopSchema>;
export type WireGauge = z.infer<typeof WireGaugeSchema>;
export type FeedSystem = z.infer<typeof FeedSystemSchema>;
export type Feed = z.infer<typeof FeedSchema>;
export type PlanLoad = z.infer<typeof PlanLoadSchema>;
export type WireRun = z.infer<typeof WireRunSchema>;
export type BandName = z.infer<typeof BandNameSchema>;
export type PlanGround = z.infer<typeof PlanGroundSchema>;
export type Lot = z.infer<typeof LotSchema>;
export type AnalysisSettings = z.infer<typeof AnalysisSettingsSchema>;
/** A validated plan (defaults filled in). */
export type Plan = z.infer<typeof PlanSchema>;
/** A plan as written in JSON (defaults may be missing). */
export type PlanInput = z.input<typeof PlanSchema>;

// ---------- parsing, with messages that name the element ----------

/** Collections whose items are elements with ids; their items are labelled `supports[2] "oak"`. */
function label(raw: unknown, path: readonly PropertyKey[]): { text: string; elementId?: string } {
  let text = "";
  let node: unknown = raw;
  let elementId: string | undefined;
  for (const part of path) {
    if (typeof part === "number") {
      text += `[${part}]`;
      node = Array.isArray(node) ? node[part] : undefined;
      const itemId = node && typeof node === "object" ? (node as { id?: unknown }).id : undefined;
      if (typeof itemId === "string" && itemId) {
        text += ` "${itemId}"`;
        elementId = itemId;
      }
    } else {
      const key = String(part);
      // After a labelled element use ": " so the message reads `supports[2] "oak": height`.
      text += text === "" ? key : text.endsWith('"') ? `: ${key}` : `.${key}`;
      node = node && typeof node === "object" ? (node as Record<string, unknown>)[key] : undefined;
    }
  }
  return elementId === undefined ? { text } : { text, elementId };
}

/** Bring an older plan document up to the current version. Version 1 is current; later versions add steps. */
export function migratePlan(json: unknown): unknown {
  if (!json || typeof json !== "object" || Array.isArray(json)) {
    throw new PlanError("plan", "expected a plan object");
  }
  const version = (json as { version?: unknown }).version;
  if (version === undefined) throw new PlanError("version", "missing: a plan needs a version key");
  if (typeof version !== "number" || !Number.isInteger(version) || version < 1) {
    throw new PlanError("version", `expected a whole version number ≥ 1, got ${JSON.stringify(version)}`);
  }
  if (version > PLAN_VERSION) {
    throw new PlanError(
      "version",
      `this plan is version ${version}, newer than this program understands (${PLAN_VERSION})`,
    );
  }
  // Each step takes a version-n document to version n + 1. None yet: 1 is the first version.
  const steps: Record<number, (doc: Record<string, unknown>) => Record<string, unknown>> = {};
  let doc = json as Record<string, unknown>;
  for (let v = version; v < PLAN_VERSION; v++) {
    const step = steps[v];
    if (!step) throw new PlanError("version", `no migration from version ${v}`);
    doc = step(doc);
  }
  return doc;
}

/** True for a JSON document that carries the plan version key (a wire model has none). */
export function isPlanDocument(json: unknown): boolean {
  return !!json && typeof json === "object" && !Array.isArray(json) && "version" in json;
}

/** Validate untrusted JSON as a plan: shape first (zod), then cross references and physical sense. */
export function parsePlan(json: unknown): Plan {
  const migrated = migratePlan(json);
  const parsed = PlanSchema.safeParse(migrated);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    const keys = (first as { keys?: string[] }).keys;
    const path = keys?.length ? [...first.path, keys[0]] : first.path;
    const message = first.code === "unrecognized_keys" ? "unknown field" : first.message;
    const where = label(migrated, path);
    throw new PlanError(where.text || "plan", message, where.elementId);
  }
  const plan = parsed.data;
  checkReferences(plan);
  return plan;
}

function fail(plan: Plan, path: PropertyKey[], message: string): never {
  const where = label(plan, path);
  throw new PlanError(where.text, message, where.elementId);
}

/** Ids unique, anchors name supports that exist and of the right kind, anchors no higher than allowed. */
function checkReferences(plan: Plan): void {
  const seen = new Map<string, string>();
  const claim = (elementId: string, path: PropertyKey[]) => {
    const before = seen.get(elementId);
    if (before !== undefined) fail(plan, path, `duplicate id "${elementId}" (also used by ${before})`);
    seen.set(elementId, label(plan, path.slice(0, -1)).text);
  };
  plan.supports.forEach((s, i) => {
    claim(s.id, ["supports", i, "id"]);
    if (s.type === "mast")
      s.guys?.forEach((g, j) => {
        claim(g.id, ["supports", i, "guys", j, "id"]);
      });
    if (s.type === "building" && s.ridgeHeight < s.eaveHeight) {
      fail(plan, ["supports", i, "ridgeHeight"], "expected a ridge no lower than the eaves");
    }
    if (s.type === "mast" && s.guys) {
      s.guys.forEach((g, j) => {
        if (g.attachHeight > s.height) {
          fail(plan, ["supports", i, "guys", j, "attachHeight"], `above the top of the mast (${s.height} m)`);
        }
      });
    }
  });
  plan.walkways.forEach((w, i) => {
    claim(w.id, ["walkways", i, "id"]);
  });
  plan.keepOuts.forEach((k, i) => {
    claim(k.id, ["keepOuts", i, "id"]);
  });
  plan.powerLines.forEach((p, i) => {
    claim(p.id, ["powerLines", i, "id"]);
  });
  const supports = new Map(plan.supports.map((s) => [s.id, s]));
  let feeds = 0;
  plan.wireRuns.forEach((run, r) => {
    claim(run.id, ["wireRuns", r, "id"]);
    if (run.feed) feeds++;
    run.anchors.forEach((a, i) => {
      const at = ["wireRuns", r, "anchors", i];
      claim(a.id, [...at, "id"]);
      if (a.kind === "free") {
        if (a.position[2] < 0) fail(plan, [...at, "position"], "below the ground (z < 0)");
        return;
      }
      const s = supports.get(a.support);
      if (!s) fail(plan, [...at, "support"], `no support with id "${a.support}"`);
      if (a.kind === "roof") {
        if (s.type !== "building") fail(plan, [...at, "support"], `"${s.id}" is a ${s.type}, not a building`);
        return;
      }
      if (s.type === "building") {
        fail(
          plan,
          [...at, "kind"],
          `"${s.id}" is a building: attach with "kind": "roof" and a roofline point`,
        );
      }
      if (s.type === "fence" && !a.at)
        fail(plan, [...at, "at"], "a fence anchor needs the point along the fence");
      if (a.height > s.height + 1e-9) {
        fail(plan, [...at, "height"], `${a.height} m is above the ${s.type} "${s.id}" (${s.height} m)`);
      }
      if (a.bonded && !(s.type === "mast" && (s.material === "aluminium" || s.material === "steel"))) {
        fail(plan, [...at, "bonded"], "only a metal mast can be bonded to the wire");
      }
    });
    run.droops?.forEach((d, j) => {
      claim(d.id, ["wireRuns", r, "droops", j, "id"]);
    });
    run.loads?.forEach((l, j) => {
      claim(l.id, ["wireRuns", r, "loads", j, "id"]);
      if (l.ohms === undefined && l.henries === undefined && l.farads === undefined) {
        fail(plan, ["wireRuns", r, "loads", j], "expected at least one of ohms, henries, farads");
      }
    });
    const ends = new Set<string>();
    run.droops?.forEach((d, j) => {
      if (ends.has(d.end)) fail(plan, ["wireRuns", r, "droops", j, "end"], `a second droop at the ${d.end}`);
      ends.add(d.end);
    });
  });
  if (feeds === 0) fail(plan, ["wireRuns"], "no run has a feed: give one run a feed position");
  const active = plan.analysis?.activeRun;
  if (active !== undefined && !plan.wireRuns.some((w) => w.id === active && w.feed)) {
    fail(plan, ["analysis", "activeRun"], `no fed wire run with id "${active}"`);
  }
}
