import { useId } from "react";
import { deleteElement, duplicateElement, runLength, setDroop, setFeed } from "../plan/commands";
import { describeKind, displayName, findElement } from "../plan/elements";
import { type FieldDef, fieldsFor } from "../plan/fields";
import { useApp, useAppStore } from "../store/react";
import { formatLength, fromDisplay, toDisplay } from "../units";
import { NumberField } from "./NumberField";
import { YardSettings } from "./YardSettings";

/** Edits the selected element: labelled fields in the user's unit, and its commands. */
export function Inspector() {
  const store = useAppStore();
  const plan = useApp((s) => s.plan);
  const selectedId = useApp((s) => s.selectedId);
  const ref = findElement(plan, selectedId);
  const unit = plan.units;
  const textId = useId();
  if (!ref) {
    return (
      <section className="panel inspector" data-testid="inspector" aria-label="Inspector">
        <h2>Inspector</h2>
        <p className="muted">
          Select something in the yard or in the list to edit it. Drag supports to move them; the diamond over
          a selected tree or pole sets its height.
        </p>
        <YardSettings />
      </section>
    );
  }
  const edit = (def: FieldDef, value: number | string) =>
    store.getState().applyEdit((p) => {
      const current = findElement(p, ref.id);
      return current ? def.set(p, current, value) : p;
    }, "immediately");

  const render = (def: FieldDef) => {
    const raw = def.get(ref);
    const testId = `field-${def.key}`;
    if (def.kind === "text") {
      return (
        <div className="field" key={def.key}>
          <label htmlFor={`${textId}-${def.key}`}>{def.label}</label>
          <input
            id={`${textId}-${def.key}`}
            type="text"
            defaultValue={String(raw ?? "")}
            key={`${ref.id}:${String(raw)}`}
            data-testid={testId}
            onBlur={(e) => e.target.value !== raw && edit(def, e.target.value)}
            onKeyDown={(e) => e.key === "Enter" && (e.target as HTMLInputElement).blur()}
          />
        </div>
      );
    }
    if (def.kind === "select") {
      return (
        <div className="field" key={def.key}>
          <label htmlFor={`${textId}-${def.key}`}>{def.label}</label>
          <select
            id={`${textId}-${def.key}`}
            value={String(raw)}
            data-testid={testId}
            onChange={(e) => edit(def, e.target.value)}
          >
            {def.options?.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
      );
    }
    const n = typeof raw === "number" ? raw : undefined;
    if (def.kind === "length") {
      return (
        <NumberField
          key={def.key}
          label={def.label}
          unit={unit}
          value={n === undefined ? undefined : toDisplay(n, unit)}
          // Small things (wire and pole diameters) need more places than heights do.
          digits={n !== undefined && n > 0 && n < 0.3 ? 3 : unit === "ft" ? 1 : 2}
          step={def.step ? toDisplay(def.step, unit) : 0.1}
          min={def.min !== undefined ? toDisplay(def.min, unit) : undefined}
          testId={testId}
          onCommit={(v) => edit(def, fromDisplay(v, unit))}
        />
      );
    }
    if (def.kind === "percent") {
      return (
        <NumberField
          key={def.key}
          label={def.label}
          unit="%"
          value={n === undefined ? undefined : n * 100}
          digits={1}
          step={def.step ?? 1}
          min={0}
          max={100}
          testId={testId}
          onCommit={(v) => edit(def, v / 100)}
        />
      );
    }
    return (
      <NumberField
        key={def.key}
        label={def.label}
        unit={def.kind === "degrees" ? "°" : def.unit}
        value={n}
        digits={def.kind === "degrees" ? 0 : 0}
        step={def.step ?? 1}
        min={def.min}
        max={def.max}
        testId={testId}
        onCommit={(v) => edit(def, v)}
      />
    );
  };

  const s = store.getState();
  const onDelete = () => {
    const r = deleteElement(plan, ref.id);
    if (r.refused) return s.notify(r.refused, "error");
    s.applyEdit(() => r.plan, "immediately");
    s.select(null);
  };
  const onDuplicate = () => {
    const r = duplicateElement(plan, ref.id);
    if (!r) return s.notify("This kind of element cannot be duplicated.", "error");
    s.applyEdit(() => r.plan, "immediately");
    s.select(r.id);
  };
  const length = ref.kind === "wireRun" ? runLength(plan, ref.id) : null;
  const radials =
    ref.kind === "support" &&
    ref.support.type === "mast" &&
    ref.support.base.kind === "grounded" &&
    ref.support.base.tie.kind === "radials"
      ? ref.support.base.tie
      : null;
  return (
    <section className="panel inspector" data-testid="inspector" aria-label="Inspector">
      <h2>
        {displayName(ref)} <span className="kind">{describeKind(ref)}</span>
      </h2>
      <div className="fields">{fieldsFor(ref).map(render)}</div>
      {length !== null && <p className="readout">Conductor length as drawn: {formatLength(length, unit)}</p>}
      {radials && (
        <p className="readout" data-testid="radials-readout">
          Radial field: {radials.count} × {formatLength(radials.length, unit)}, just above the soil
          {plan.ground.kind === "perfect" ? " (over perfect ground the image plane stands in for it)" : ""}.
        </p>
      )}
      <div className="actions">
        {ref.kind === "wireRun" && !ref.run.feed && (
          <button type="button" onClick={() => s.applyEdit((p) => setFeed(p, ref.id, 0.5), "immediately")}>
            Feed at the centre
          </button>
        )}
        {ref.kind === "wireRun" && !ref.run.droops?.some((d) => d.end === "end") && (
          <button
            type="button"
            onClick={() => s.applyEdit((p) => setDroop(p, ref.id, "end", 1)?.plan ?? p, "immediately")}
          >
            Add a droop leg
          </button>
        )}
        <button type="button" onClick={onDuplicate} data-testid="duplicate" title="Duplicate (Ctrl+D)">
          Duplicate
        </button>
        <button type="button" className="danger" onClick={onDelete} data-testid="delete" title="Delete (Del)">
          Delete
        </button>
      </div>
    </section>
  );
}
