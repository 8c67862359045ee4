import { BAND_NAMES, bandEdges } from "../../solver/plan/bands";
import type { GroundTie, Mast, Plan } from "../../solver/plan/schema";
import * as cmd from "./commands";
import type { ElementRef } from "./elements";

/**
 * The inspector's fields per element kind: a label, how to read the value from the element (in SI),
 * and the command that writes it. The inspector converts lengths to the user's unit; nothing here knows
 * about the DOM, so the field table itself is testable.
 */
export type FieldKind = "length" | "number" | "degrees" | "percent" | "text" | "select";

export interface FieldDef {
  key: string;
  label: string;
  kind: FieldKind;
  /** For "number": the unit shown after the value. */
  unit?: string;
  min?: number;
  max?: number;
  /** Arrow-key step in display units. */
  step?: number;
  options?: { value: string; label: string }[];
  get: (ref: ElementRef) => number | string | undefined;
  set: (plan: Plan, ref: ElementRef, value: number | string) => Plan;
}

/**
 * The radial field a mast gets when the user picks "Grounded: radial field": 8 radials a quarter wave
 * long at the lower edge of the plan's lowest band. A quarter wave is the textbook length (Brown, Lewis
 * and Epstein, "Ground systems as a factor in antenna efficiency", Proc. IRE 25 (1937), measured fields
 * of up to 113 radials 0.14–0.41 λ long; the broadcast standard of 120 × λ/4 grew from it — from
 * memory); 8 is the usual amateur minimum for a radial field (common practice, no published source). The length is worked
 * out once, when the option is chosen: changing the bands later does not resize an existing field.
 * A fixed length was the alternative, but no single length suits both 160 m (40 m radials) and 10 m.
 */
export const DEFAULT_RADIAL_COUNT = 8;
export function defaultRadials(plan: Plan): Extract<GroundTie, { kind: "radials" }> {
  const lowest = BAND_NAMES.find((b) => plan.bands.includes(b)) ?? "20 m";
  const lowMHz = bandEdges(lowest, plan.ituRegion).lowMHz;
  // λ/4 in metres = c / (4 f); c = 299.792458 m·MHz (SI definition of the metre).
  const length = Math.round((299.792458 / (4 * lowMHz)) * 100) / 100;
  return { kind: "radials", count: DEFAULT_RADIAL_COUNT, length };
}

const baseValue = (m: Mast) => (m.base.kind === "insulated" ? "insulated" : `grounded:${m.base.tie.kind}`);

const num = (v: number | string) => (typeof v === "number" ? v : Number.parseFloat(v));
const field = (key: string) => (plan: Plan, ref: ElementRef, v: number | string) =>
  cmd.setField(plan, ref.id, key, v);
const nameField: FieldDef = {
  key: "name",
  label: "Name",
  kind: "text",
  get: (r) => elementName(r),
  set: (p, r, v) => cmd.setField(p, r.id, "name", String(v)),
};

function elementName(r: ElementRef): string {
  switch (r.kind) {
    case "support":
      return r.support.name;
    case "wireRun":
      return r.run.name;
    case "anchor":
      return r.anchor.name;
    case "droop":
      return r.droop.name;
    case "load":
      return r.load.name;
    case "guy":
      return r.guy.name;
    case "walkway":
      return r.walkway.name;
    case "keepOut":
      return r.keepOut.name;
    case "powerLine":
      return r.powerLine.name;
  }
}

function positionFields(): FieldDef[] {
  const axis = (i: 0 | 1, label: string): FieldDef => ({
    key: i === 0 ? "x" : "y",
    label,
    kind: "length",
    step: 0.5,
    get: (r) => (r.kind === "support" ? cmd.centreOf(r.support)[i] : undefined),
    set: (p, r, v) => {
      if (r.kind !== "support") return p;
      const c = cmd.centreOf(r.support);
      const to: [number, number] = i === 0 ? [num(v), c[1]] : [c[0], num(v)];
      return cmd.moveSupport(p, r.id, to);
    },
  });
  return [axis(0, "Position east (x)"), axis(1, "Position north (y)")];
}

const heightField = (label: string): FieldDef => ({
  key: "height",
  label,
  kind: "length",
  min: 0.1,
  step: 0.25,
  get: (r) => (r.kind === "support" && r.support.type !== "building" ? r.support.height : undefined),
  set: (p, r, v) => cmd.setSupportHeight(p, r.id, num(v)),
});

export function fieldsFor(ref: ElementRef): FieldDef[] {
  switch (ref.kind) {
    case "support": {
      const s = ref.support;
      if (s.type === "tree") {
        return [
          nameField,
          ...positionFields(),
          heightField("Attach height"),
          {
            key: "totalHeight",
            label: "Tree height",
            kind: "length",
            min: 0.1,
            step: 0.5,
            get: () => s.totalHeight,
            set: field("totalHeight"),
          },
          {
            key: "canopyRadius",
            label: "Canopy radius",
            kind: "length",
            min: 0.1,
            step: 0.25,
            get: () => s.canopyRadius,
            set: field("canopyRadius"),
          },
        ];
      }
      if (s.type === "mast") {
        return [
          nameField,
          ...positionFields(),
          heightField("Height"),
          {
            key: "diameter",
            label: "Diameter",
            kind: "length",
            min: 0.001,
            step: 0.01,
            get: () => s.diameter,
            set: field("diameter"),
          },
          {
            key: "material",
            label: "Material",
            kind: "select",
            options: [
              { value: "aluminium", label: "Aluminium (conductive)" },
              { value: "steel", label: "Steel (conductive)" },
              { value: "wood", label: "Wood (non-conductive)" },
              { value: "fibreglass", label: "Fibreglass (non-conductive)" },
            ],
            get: () => s.material,
            set: field("material"),
          },
          {
            key: "base",
            label: "Base",
            kind: "select",
            options: [
              { value: "grounded:contact", label: "Grounded: set in the soil" },
              { value: "grounded:ideal", label: "Grounded: ideal (idealisation)" },
              { value: "grounded:rod", label: "Grounded: driven rod 2.4 m" },
              { value: "grounded:radials", label: "Grounded: radial field" },
              { value: "insulated", label: "Insulated base" },
            ],
            get: () => baseValue(s),
            set: (p, r, v) => {
              const value = String(v);
              // Choosing the option the mast already has keeps its tie (a radial field keeps its size).
              if (r.kind === "support" && r.support.type === "mast" && value === baseValue(r.support))
                return p;
              const base =
                value === "grounded:radials"
                  ? { kind: "grounded" as const, tie: defaultRadials(p) }
                  : value === "insulated"
                    ? { kind: "insulated" as const }
                    : value === "grounded:rod"
                      ? {
                          kind: "grounded" as const,
                          tie: { kind: "rod" as const, length: 2.4, diameter: 0.016 },
                        }
                      : value === "grounded:ideal"
                        ? { kind: "grounded" as const, tie: { kind: "ideal" as const } }
                        : { kind: "grounded" as const, tie: { kind: "contact" as const } };
              return cmd.setField(p, r.id, "base", base);
            },
          },
        ];
      }
      if (s.type === "building") {
        return [
          nameField,
          ...positionFields(),
          {
            key: "eaveHeight",
            label: "Eave height",
            kind: "length",
            min: 0.1,
            step: 0.25,
            get: () => s.eaveHeight,
            set: field("eaveHeight"),
          },
          {
            key: "ridgeHeight",
            label: "Ridge height",
            kind: "length",
            min: 0.1,
            step: 0.25,
            get: () => s.ridgeHeight,
            set: field("ridgeHeight"),
          },
          {
            key: "ridgeDeg",
            label: "Ridge direction",
            kind: "degrees",
            step: 15,
            get: () => s.ridgeDeg,
            set: field("ridgeDeg"),
          },
        ];
      }
      return [
        nameField,
        ...positionFields(),
        heightField("Height"),
        {
          key: "material",
          label: "Material",
          kind: "select",
          options: ["wood", "metal", "vinyl", "hedge"].map((m) => ({ value: m, label: m })),
          get: () => s.material,
          set: field("material"),
        },
      ];
    }
    case "wireRun": {
      const r = ref.run;
      const droop = (end: "start" | "end"): FieldDef => ({
        key: `droop-${end}`,
        label: `Droop at the ${end} (0 = none)`,
        kind: "length",
        min: 0,
        step: 0.25,
        get: () => {
          const d = r.droops?.find((x) => x.end === end);
          return d ? (d.length ?? 0) : 0;
        },
        set: (p, ref2, v) => {
          const length = num(v);
          const d = r.droops?.find((x) => x.end === end);
          if (length <= 0) return d ? cmd.deleteElement(p, d.id).plan : p;
          return cmd.setDroop(p, ref2.id, end, length)?.plan ?? p;
        },
      });
      return [
        nameField,
        {
          key: "awg",
          label: "Wire gauge",
          kind: "number",
          unit: "AWG",
          min: -3,
          max: 40,
          step: 1,
          get: () => ("awg" in r.wire ? r.wire.awg : undefined),
          set: (p, ref2, v) => cmd.setField(p, ref2.id, "wire", { awg: Math.round(num(v)) }),
        },
        {
          key: "material",
          label: "Conductor",
          kind: "select",
          options: ["copper", "aluminium", "copper-clad steel", "stainless steel"].map((m) => ({
            value: m,
            label: m,
          })),
          get: () => r.material,
          set: field("material"),
        },
        {
          key: "feed",
          label: "Feed position along the wire",
          kind: "percent",
          min: 0,
          max: 100,
          step: 1,
          get: () => (r.feed ? r.feed.at : undefined),
          set: (p, ref2, v) => cmd.setFeed(p, ref2.id, num(v)),
        },
        droop("start"),
        droop("end"),
        {
          key: "sag",
          label: "Sag at mid-span",
          kind: "length",
          min: 0,
          step: 0.1,
          get: () => r.anchors[0].sagToNext ?? 0,
          set: (p, _ref, v) => {
            const a = r.anchors[0];
            return cmd.setField(p, a.id, "sagToNext", Math.max(0, num(v)));
          },
        },
      ];
    }
    case "anchor": {
      const a = ref.anchor;
      const common: FieldDef[] = [nameField];
      if (a.kind === "support") {
        common.push(
          {
            key: "height",
            label: "Height on the support",
            kind: "length",
            min: 0.1,
            step: 0.25,
            get: () => a.height,
            set: (p, r, v) => cmd.setAnchorHeight(p, r.id, num(v)),
          },
          {
            key: "rope",
            label: "Rope to the insulator",
            kind: "length",
            min: 0,
            step: 0.25,
            get: () => a.rope ?? 0,
            set: field("rope"),
          },
        );
      } else if (a.kind === "free") {
        common.push({
          key: "height",
          label: "Height",
          kind: "length",
          min: 0,
          step: 0.25,
          get: () => a.position[2],
          set: (p, r, v) => cmd.setAnchorHeight(p, r.id, num(v)),
        });
      } else {
        common.push({
          key: "above",
          label: "Height above the roof",
          kind: "length",
          min: 0,
          step: 0.1,
          get: () => a.above ?? 0,
          set: field("above"),
        });
      }
      common.push({
        key: "sagToNext",
        label: "Sag to the next anchor",
        kind: "length",
        min: 0,
        step: 0.1,
        get: () => a.sagToNext ?? 0,
        set: field("sagToNext"),
      });
      return common;
    }
    case "droop":
      return [
        nameField,
        {
          key: "length",
          label: "Droop length",
          kind: "length",
          min: 0.05,
          step: 0.1,
          get: () => ref.droop.length,
          set: (p, r, v) => cmd.setDroopLength(p, r.id, num(v)),
        },
      ];
    case "load":
      return [
        nameField,
        {
          key: "at",
          label: "Position along the wire",
          kind: "percent",
          min: 0,
          max: 100,
          step: 1,
          get: () => ref.load.at,
          set: field("at"),
        },
      ];
    case "guy":
      return [
        nameField,
        {
          key: "attachHeight",
          label: "Attach height",
          kind: "length",
          min: 0.1,
          step: 0.25,
          get: () => ref.guy.attachHeight,
          set: field("attachHeight"),
        },
      ];
    case "walkway":
      return [
        nameField,
        {
          key: "width",
          label: "Width",
          kind: "length",
          min: 0.1,
          step: 0.1,
          get: () => ref.walkway.width,
          set: field("width"),
        },
      ];
    case "keepOut":
      return [
        nameField,
        {
          key: "reason",
          label: "Reason",
          kind: "text",
          get: () => ref.keepOut.reason ?? "",
          set: field("reason"),
        },
      ];
    case "powerLine":
      return [
        nameField,
        {
          key: "voltage",
          label: "Voltage / kind",
          kind: "text",
          get: () => ref.powerLine.voltage ?? "",
          set: field("voltage"),
        },
      ];
  }
}
