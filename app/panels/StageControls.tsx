import { useApp, useAppStore } from "../store/react";
import { formatLength, type LengthUnit, METRES_PER_FOOT, toDisplay } from "../units";

/** Snap steps offered, in metres (the store's unit), chosen to be round numbers in the user's unit. */
const SNAP_STEPS: Record<LengthUnit, number[]> = {
  m: [0.1, 0.5, 1],
  ft: [0.5 * METRES_PER_FOOT, 1 * METRES_PER_FOOT, 5 * METRES_PER_FOOT],
};

const sameStep = (a: number, b: number) => Math.abs(a - b) < 1e-9;

/** Camera views, overlays, snap and units: floating over the top right of the yard. */
export function StageControls() {
  const store = useAppStore();
  const units = useApp((s) => s.plan.units);
  const showLobe = useApp((s) => s.showLobe);
  const showCurrents = useApp((s) => s.showCurrents);
  const snapStep = useApp((s) => s.snapStep);
  const s = store.getState();
  const steps = SNAP_STEPS[units];
  // A step from the other unit (after undo or opening a file) stays selectable, shown in this unit.
  const extra = snapStep !== null && !steps.some((m) => sameStep(m, snapStep)) ? snapStep : null;
  const stepLabel = (m: number) => {
    const v = toDisplay(m, units);
    const whole = (k: number) => Math.abs(v * k - Math.round(v * k)) < 1e-6;
    return formatLength(m, units, whole(1) ? 0 : whole(10) ? 1 : 2);
  };
  return (
    <div className="stage-controls">
      <fieldset className="stage-group" aria-label="View">
        <span className="group-label">View</span>
        <button type="button" onClick={() => s.requestView("orbit")} data-testid="view-3d">
          3D
        </button>
        <button type="button" onClick={() => s.requestView("top")} data-testid="view-top">
          Top
        </button>
        <button type="button" onClick={() => s.requestView("side")} data-testid="view-side">
          Side
        </button>
        <label className="check">
          <input type="checkbox" checked={showCurrents} onChange={() => s.toggleCurrents()} /> Currents
        </label>
        <label className="check">
          <input
            type="checkbox"
            checked={showLobe}
            onChange={() => s.toggleLobe()}
            data-testid="toggle-lobe"
          />{" "}
          Pattern lobe
        </label>
      </fieldset>
      <fieldset className="stage-group" aria-label="Settings">
        <label className="inline">
          Snap
          <select
            value={snapStep === null ? "off" : String(snapStep)}
            onChange={(e) => s.setSnap(e.target.value === "off" ? null : Number(e.target.value))}
            aria-label="Snap step"
          >
            <option value="off">off</option>
            {(extra === null ? steps : [...steps, extra].sort((a, b) => a - b)).map((m) => (
              <option key={m} value={String(m)}>
                {stepLabel(m)}
              </option>
            ))}
          </select>
        </label>
        <label className="inline">
          Units
          <select
            value={units}
            aria-label="Display units"
            onChange={(e) => {
              const u = e.target.value === "ft" ? "ft" : "m";
              s.applyEdit((p) => (p.units === u ? p : { ...p, units: u }), "immediately");
              // Keep the snap a round step in the new unit: the one in the same place on its list.
              const step = store.getState().snapStep;
              const i = step === null ? -1 : SNAP_STEPS[units].findIndex((m) => sameStep(m, step));
              if (i >= 0) s.setSnap(SNAP_STEPS[u][i]);
            }}
          >
            <option value="m">metres</option>
            <option value="ft">feet</option>
          </select>
        </label>
      </fieldset>
    </div>
  );
}
