import { useApp, useAppStore } from "../store/react";
import { formatStep, snapChoices, snapStepAfterUnitSwitch } from "../units";

/** Camera views, overlays, snap and units: floating over the top right of the yard. */
export function StageControls() {
  const store = useAppStore();
  const units = useApp((s) => s.plan.units);
  const showLobe = useApp((s) => s.showLobe);
  const showCurrents = useApp((s) => s.showCurrents);
  const snapStep = useApp((s) => s.snapStep);
  const s = store.getState();
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
            {/* A step from the other unit (after undo or opening a file) stays shown, in this unit. */}
            {snapChoices(units, snapStep).map((m) => (
              <option key={m} value={String(m)}>
                {formatStep(m, units)}
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
              s.setSnap(snapStepAfterUnitSwitch(store.getState().snapStep, units, u));
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
