import type { ReactNode } from "react";
import { describeKind, displayName, type ElementRef, findElement } from "../plan/elements";
import { useApp, useAppStore } from "../store/react";

/** Every element in the plan, grouped; the keyboard-reachable way to select anything. */
export function Outline() {
  const store = useAppStore();
  const plan = useApp((s) => s.plan);
  const selectedId = useApp((s) => s.selectedId);
  const failureId = useApp((s) =>
    s.failure?.revision === s.revision ? s.failure.failure.elementId : undefined,
  );
  const row = (id: string, depth = 0): ReactNode => {
    const ref = findElement(plan, id) as ElementRef;
    return (
      <li key={id}>
        <button
          type="button"
          className={`outline-row depth-${depth} ${selectedId === id ? "selected" : ""} ${failureId === id ? "has-problem" : ""}`}
          aria-pressed={selectedId === id}
          data-testid={`outline-${id}`}
          onClick={() => store.getState().select(id)}
          onMouseEnter={() => store.getState().hover(id)}
          onMouseLeave={() => store.getState().hover(null)}
        >
          <span className="outline-name">{displayName(ref)}</span>
          <span className="outline-kind">{describeKind(ref)}</span>
        </button>
      </li>
    );
  };
  return (
    <nav className="panel outline" aria-label="Yard items" data-testid="outline">
      <h2>Yard items</h2>
      <ul>
        <li>
          {/* The yard's own settings (soil, bands, region) show in the inspector when nothing is selected. */}
          <button
            type="button"
            className={`outline-row depth-0 ${selectedId === null ? "selected" : ""}`}
            aria-pressed={selectedId === null}
            data-testid="outline-yard"
            onClick={() => store.getState().select(null)}
          >
            <span className="outline-name">The yard</span>
            <span className="outline-kind">Soil, bands, ITU region</span>
          </button>
        </li>
      </ul>
      <h3>Supports</h3>
      <ul>{plan.supports.map((s) => row(s.id))}</ul>
      <h3>Wire runs</h3>
      <ul>
        {plan.wireRuns.map((r) => (
          <li key={r.id}>
            <ul>
              {row(r.id)}
              {r.anchors.map((a) => row(a.id, 1))}
              {r.droops?.map((d) => row(d.id, 1))}
              {r.loads?.map((l) => row(l.id, 1))}
            </ul>
          </li>
        ))}
      </ul>
      {(plan.walkways.length > 0 || plan.keepOuts.length > 0 || plan.powerLines.length > 0) && (
        <>
          <h3>Paths and hazards</h3>
          <ul>
            {plan.walkways.map((w) => row(w.id))}
            {plan.keepOuts.map((k) => row(k.id))}
            {plan.powerLines.map((p) => row(p.id))}
          </ul>
        </>
      )}
    </nav>
  );
}
