import { useId } from "react";
import { GROUND_PRESETS } from "../../solver/ground/presets";
import type { GroundMethod } from "../../solver/model/types";
import { BAND_NAMES, type ItuRegion } from "../../solver/plan/bands";
import type { BandName, Plan } from "../../solver/plan/schema";
import {
  type EditResult,
  groundChoice,
  setGround,
  setGroundMethod,
  setItuRegion,
  toggleBand,
} from "../plan/commands";
import { useApp, useAppStore } from "../store/react";
import { NumberField } from "./NumberField";

/**
 * The plan-level settings, shown in the inspector when nothing is selected: the soil under the yard,
 * the near-ground method, the bands of interest and the ITU region. Every change is one undoable edit
 * through the store, like any other; a refused one (the last band, an impossible σ) changes nothing and
 * says why.
 */

// Typical sites for each named soil, to help a user pick one by what the yard is like. Common practice,
// no published source: P.527 names the classes, not the places.
const SOIL_HINTS: Record<string, string> = {
  "sea water": "coast, salt water",
  "fresh water": "lakes and rivers",
  "wet ground": "marsh, wet clay, farmland",
  "medium dry ground": "dry loam, hills",
  "very dry ground": "dry sand, desert, rock",
  "average ground": "ordinary garden soil",
};

/** σ in S/m and εr as a person writes them: 0.005, 0.0001, 5 (no trailing zeros, no exponent). */
export function formatConstant(v: number): string {
  return String(Number(v.toPrecision(4)));
}

// Short enough to read in the closed select (the sidebar is narrow); the note under it repeats the
// values of the soil in force with their source.
const soilLabel = (name: string) => {
  const p = GROUND_PRESETS[name];
  const what = name === "average ground" ? "average ground (common practice)" : name;
  return `${what}: σ ${formatConstant(p.conductivity)}, εr ${formatConstant(p.permittivity)}`;
};

// "average ground" first among the real soils: it is the usual starting point and the demo's soil.
const PRESET_ORDER = ["average ground", ...Object.keys(GROUND_PRESETS).filter((n) => n !== "average ground")];

const METHODS: { value: GroundMethod; label: string }[] = [
  { value: "auto", label: "Auto (default): rigorous near soil" },
  { value: "reflection", label: "Reflection: fast, approximate near soil" },
  { value: "sommerfeld", label: "Sommerfeld: rigorous" },
];

const bandTestId = (b: BandName) => `band-${b.replace(/\s+/g, "")}`;

export function YardSettings() {
  const store = useAppStore();
  // Narrow selections: a drag step changes the plan but none of these, so the panel does not re-render.
  const ground = useApp((s) => s.plan.ground);
  const bands = useApp((s) => s.plan.bands);
  const region = useApp((s) => s.plan.ituRegion);
  const soilId = useId();
  const methodId = useId();
  const regionId = useId();
  const choice = groundChoice(ground);

  const apply = (r: EditResult) => {
    const s = store.getState();
    if (r.refused) return s.notify(r.refused, "error");
    s.applyEdit(() => r.plan, "immediately");
  };
  // Each command runs on the store's current plan, so an edit never overwrites one made in between.
  const edit = (f: (plan: Plan) => EditResult) => apply(f(store.getState().plan));

  const soilValue =
    choice === null
      ? "unknown"
      : choice.kind === "perfect"
        ? "perfect"
        : choice.kind === "preset"
          ? `preset:${choice.preset}`
          : "custom";
  const onSoil = (value: string) => {
    if (value === "perfect") return edit((p) => setGround(p, { kind: "perfect" }));
    if (value === "custom") {
      // Start custom from the values in force (average ground's over perfect ground), so choosing
      // "Custom…" changes nothing until a value is typed.
      const base =
        choice && choice.kind !== "perfect"
          ? choice
          : (GROUND_PRESETS["average ground"] as { conductivity: number; permittivity: number });
      return edit((p) =>
        setGround(p, {
          kind: "custom",
          conductivity: base.conductivity,
          permittivity: base.permittivity,
        }),
      );
    }
    if (value.startsWith("preset:")) {
      edit((p) => setGround(p, { kind: "preset", preset: value.slice("preset:".length) }));
    }
  };
  const custom = choice?.kind === "custom" ? choice : null;
  const preset = choice?.kind === "preset" ? GROUND_PRESETS[choice.preset] : undefined;

  return (
    <div className="yard-settings" data-testid="yard-settings">
      <h3>Yard settings</h3>
      <div className="field field-wide">
        <label htmlFor={soilId}>Soil under the yard</label>
        <select
          id={soilId}
          value={soilValue}
          data-testid="ground-soil"
          onChange={(e) => onSoil(e.target.value)}
        >
          {choice === null && (
            <option value="unknown" disabled>
              As in the file (not understood)
            </option>
          )}
          <option value="perfect">Perfect ground (idealisation)</option>
          <optgroup label="Real soil">
            {PRESET_ORDER.map((n) => (
              <option key={n} value={`preset:${n}`}>
                {soilLabel(n)}
              </option>
            ))}
          </optgroup>
          <option value="custom">Custom…</option>
        </select>
      </div>
      {choice === null && (
        <p className="settings-note settings-bad">
          The plan file names a soil this program does not know; pick one here.
        </p>
      )}
      {choice?.kind === "perfect" && (
        <p className="settings-note">
          A perfectly conducting ground plane: no ground loss. Good for comparisons, optimistic for a real
          yard.
        </p>
      )}
      {preset && (
        <p className="settings-note" data-testid="ground-note">
          σ {formatConstant(preset.conductivity)} S/m, εr {formatConstant(preset.permittivity)}
          {SOIL_HINTS[preset.name] ? `: ${SOIL_HINTS[preset.name]}` : ""}.
          <span className="settings-source">
            {" "}
            Values: {preset.source}. Soil varies several times over with moisture and season.
          </span>
        </p>
      )}
      {custom && (
        <div className="fields settings-custom">
          <NumberField
            label="Conductivity σ"
            unit="S/m"
            value={custom.conductivity}
            format={formatConstant}
            testId="ground-conductivity"
            check={(v) => (v > 0 ? null : "σ must be above 0 S/m")}
            onCommit={(v) =>
              edit((p) => {
                const now = groundChoice(p.ground);
                const permittivity = now && now.kind !== "perfect" ? now.permittivity : custom.permittivity;
                return setGround(p, { kind: "custom", conductivity: v, permittivity });
              })
            }
          />
          <NumberField
            label="Permittivity εr"
            value={custom.permittivity}
            format={formatConstant}
            testId="ground-permittivity"
            check={(v) => (v >= 1 ? null : "εr must be at least 1")}
            onCommit={(v) =>
              edit((p) => {
                const now = groundChoice(p.ground);
                const conductivity = now && now.kind !== "perfect" ? now.conductivity : custom.conductivity;
                return setGround(p, { kind: "custom", conductivity, permittivity: v });
              })
            }
          />
        </div>
      )}
      {choice && choice.kind !== "perfect" && (
        <div className="field field-wide">
          <label htmlFor={methodId}>Near-ground method</label>
          <select
            id={methodId}
            value={choice.method}
            data-testid="ground-method"
            onChange={(e) => edit((p) => ({ plan: setGroundMethod(p, e.target.value as GroundMethod) }))}
          >
            {METHODS.map((m) => (
              <option key={m.value} value={m.value}>
                {m.label}
              </option>
            ))}
          </select>
        </div>
      )}
      <fieldset className="bands" data-testid="bands">
        <legend>Bands of interest</legend>
        {BAND_NAMES.map((b) => (
          <label key={b} className="band">
            <input
              type="checkbox"
              checked={bands.includes(b)}
              data-testid={bandTestId(b)}
              onChange={(e) => edit((p) => toggleBand(p, b, e.target.checked))}
            />
            {b}
          </label>
        ))}
      </fieldset>
      <div className="field field-wide">
        <label htmlFor={regionId}>ITU region (sets the band edges)</label>
        <select
          id={regionId}
          value={String(region)}
          data-testid="itu-region"
          onChange={(e) => edit((p) => ({ plan: setItuRegion(p, Number(e.target.value) as ItuRegion) }))}
        >
          <option value="1">1: Europe, Africa, Middle East</option>
          <option value="2">2: the Americas</option>
          <option value="3">3: Asia, Pacific</option>
        </select>
      </div>
    </div>
  );
}
