import { z } from "zod";
import { ModelError } from "./errors";
import type { WireModel } from "./types";

/**
 * The validating door to the solver: turns untrusted JSON into a `WireModel`, or throws a `ModelError`
 * naming the first bad field (`wires[1].points[0]: expected three numbers`). Nothing physical is
 * computed here; geometric checks that need the whole model (zero-length runs, points below ground)
 * live with the geometry.
 */

const finite = (what: string) =>
  z
    .number({
      error: (issue) =>
        typeof issue.input === "number"
          ? `expected a finite ${what}, got ${issue.input}`
          : `expected ${what}`,
    })
    .refine(Number.isFinite, { message: `expected a finite ${what}` });
const positive = (what: string) =>
  finite(what).refine((v) => v > 0, { message: `expected a positive ${what}` });
const nonNegative = (what: string) =>
  finite(what).refine((v) => v >= 0, { message: `expected a non-negative ${what}` });

const point = z.tuple([finite("number"), finite("number"), finite("number")], {
  error: "expected three numbers [x, y, z] in metres",
});

const material = z.union(
  [
    z.enum(["copper", "aluminium", "aluminum", "copper-clad steel", "stainless steel"]),
    positive("conductivity (S/m)"),
  ],
  {
    error: 'expected "copper", "aluminium", "copper-clad steel", "stainless steel" or a conductivity in S/m',
  },
);

const groundConnection = z.union(
  [
    z.literal("contact"),
    z.literal("ideal"),
    z
      .object({ rod: z.object({ length: positive("rod length (m)"), radius: positive("rod radius (m)") }) })
      .strict(),
    z.object({ ohms: nonNegative("resistance (ohms)") }).strict(),
  ],
  { error: 'expected "contact", "ideal", { "rod": { "length", "radius" } } or { "ohms": R }' },
);

const wire = z
  .object({
    id: z
      .string({ error: "expected a wire id (a string)" })
      .min(1, { message: "expected a non-empty wire id" }),
    points: z
      .array(point, { error: "expected a list of points" })
      .min(2, { message: "expected at least two points" }),
    radius: positive("radius in metres"),
    material: material.optional(),
    segments: z
      .number({ error: "expected a whole number of segments" })
      .int({ message: "expected a whole number of segments" })
      .min(1, { message: "expected at least one segment" })
      .max(5000, { message: "more than 5000 segments on one wire is beyond this solver" })
      .optional(),
    groundConnection: groundConnection.optional(),
  })
  .strict();

const fraction = finite("fraction").refine((v) => v >= 0 && v <= 1, {
  message: "expected a fraction of the wire's length between 0 and 1",
});

const pointOnWire = { wire: z.string({ error: "expected the id of a wire" }), at: fraction };

const load = z
  .object({
    ...pointOnWire,
    ohms: nonNegative("resistance (ohms)").optional(),
    henries: nonNegative("inductance (H)").optional(),
    farads: nonNegative("capacitance (F)").optional(),
    arrangement: z.enum(["series", "parallel"], { error: 'expected "series" or "parallel"' }).optional(),
  })
  .strict();

// HF work is the product's aim, but the engine is general: anything from VLF to low microwave is accepted.
const mhz = finite("frequency in MHz").refine((v) => v >= 0.001 && v <= 3000, {
  message: "expected a frequency between 0.001 and 3000 MHz",
});

const frequencies = z.union(
  [
    z
      .array(mhz)
      .min(1, { message: "expected at least one frequency" })
      .max(2001, { message: "at most 2001 frequencies" }),
    z
      .object({
        from: mhz,
        to: mhz,
        count: z.number().int().min(1, { message: "expected at least one frequency" }).max(2001),
      })
      .strict()
      .refine((r) => r.to >= r.from, { message: "expected to ≥ from" }),
  ],
  { error: 'expected a list of MHz values or { "from", "to", "count" }' },
);

const ground = z.discriminatedUnion(
  "kind",
  [
    z.object({ kind: z.literal("free") }).strict(),
    z.object({ kind: z.literal("perfect") }).strict(),
    z
      .object({
        kind: z.literal("real"),
        conductivity: positive("conductivity (S/m)").optional(),
        permittivity: finite("relative permittivity")
          .refine((v) => v >= 1, { message: "expected a relative permittivity of at least 1" })
          .optional(),
        preset: z.string().optional(),
        method: z.enum(["auto", "reflection", "sommerfeld"]).optional(),
      })
      .strict(),
  ],
  { error: 'expected { "kind": "free" }, { "kind": "perfect" } or { "kind": "real", ... }' },
);

export const wireModelSchema = z
  .object(
    {
      wires: z
        .array(wire, { error: "expected a list of wires" })
        .min(1, { message: "expected at least one wire" }),
      feed: z.object(pointOnWire, { error: 'expected a feed { "wire", "at" }' }).strict(),
      loads: z.array(load).optional(),
      ground: ground,
      frequenciesMHz: frequencies,
      referenceOhms: positive("reference impedance (ohms)").optional(),
    },
    { error: "expected a JSON object with wires, feed, ground and frequenciesMHz" },
  )
  .strict()
  .superRefine((m, ctx) => {
    const seen = new Map<string, number>();
    m.wires.forEach((w, i) => {
      if (seen.has(w.id)) {
        ctx.addIssue({ code: "custom", path: ["wires", i, "id"], message: `duplicate wire id "${w.id}"` });
      }
      seen.set(w.id, i);
    });
    if (!seen.has(m.feed.wire)) {
      ctx.addIssue({ code: "custom", path: ["feed", "wire"], message: `no wire with id "${m.feed.wire}"` });
    }
    m.loads?.forEach((l, i) => {
      if (!seen.has(l.wire)) {
        ctx.addIssue({ code: "custom", path: ["loads", i, "wire"], message: `no wire with id "${l.wire}"` });
      }
    });
  });

/** `["wires", 1, "points", 0]` → `wires[1].points[0]`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const part of path) {
    if (typeof part === "number") out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out;
}

/** Validate untrusted JSON as a wire model; throws ModelError naming the first bad field. */
export function parseWireModel(json: unknown): WireModel {
  const parsed = wireModelSchema.safeParse(json);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    // zod reports unknown keys on the parent object; name the key itself.
    const keys = (first as { keys?: string[] }).keys;
    const path = keys?.length ? [...first.path, keys[0]] : first.path;
    const message = first.code === "unrecognized_keys" ? "unknown field" : first.message;
    throw new ModelError(formatPath(path) || "model", message);
  }
  return parsed.data as WireModel;
}

/** The frequency list in MHz, whatever form the model gave it in. */
export function frequencyList(f: WireModel["frequenciesMHz"]): number[] {
  if (Array.isArray(f)) return [...f];
  if (f.count === 1) return [f.from];
  const step = (f.to - f.from) / (f.count - 1);
  return Array.from({ length: f.count }, (_, i) => f.from + i * step);
}
