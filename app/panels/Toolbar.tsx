import { useRef } from "react";
import { downloadPlan, readPlanText } from "../persistence";
import { useApp, useAppStore } from "../store/react";
import type { Tool } from "../store/selection-slice";
import { finishWire } from "../tools";

function ToolButton({ tool, label, title }: { tool: Tool; label: string; title: string }) {
  const store = useAppStore();
  const current = useApp((s) => s.tool);
  const active =
    current.kind === tool.kind &&
    (tool.kind !== "add-support" || (current.kind === "add-support" && current.support === tool.support));
  return (
    <button
      type="button"
      className={active ? "active" : ""}
      aria-pressed={active}
      title={title}
      onClick={() => store.getState().setTool(active ? { kind: "select" } : tool)}
    >
      {label}
    </button>
  );
}

export function Toolbar() {
  const store = useAppStore();
  const canUndo = useApp((s) => s.history.past.length > 0);
  const canRedo = useApp((s) => s.history.future.length > 0);
  const tool = useApp((s) => s.tool);
  const fileInput = useRef<HTMLInputElement>(null);
  const s = store.getState();

  const open = async (file: File | undefined) => {
    if (!file) return;
    const opened = readPlanText(await file.text());
    if (!opened.ok) {
      s.notify(`Could not open “${file.name}”: ${opened.message}. Your current plan is unchanged.`, "error");
      return;
    }
    s.replacePlan(opened.plan, "immediately");
    s.select(null);
    s.notify(`Opened “${file.name}”. Undo brings back the plan you had.`);
  };

  return (
    <header className="toolbar">
      <div className="brand">
        <span className="brand-mark" aria-hidden>
          ⌁
        </span>
        Yard Antenna Planner
      </div>
      <fieldset className="group" aria-label="File">
        <button type="button" onClick={() => fileInput.current?.click()} data-testid="open-plan">
          Open…
        </button>
        <input
          ref={fileInput}
          type="file"
          accept=".json,application/json"
          hidden
          data-testid="open-plan-input"
          onChange={(e) => {
            void open(e.target.files?.[0]);
            e.target.value = "";
          }}
        />
        <button type="button" onClick={() => downloadPlan(store.getState().plan)} data-testid="save-plan">
          Save
        </button>
      </fieldset>
      <fieldset className="group" aria-label="History">
        <button
          type="button"
          disabled={!canUndo}
          onClick={() => s.undo()}
          title="Undo (Ctrl+Z)"
          data-testid="undo"
        >
          Undo
        </button>
        <button
          type="button"
          disabled={!canRedo}
          onClick={() => s.redo()}
          title="Redo (Ctrl+Shift+Z)"
          data-testid="redo"
        >
          Redo
        </button>
      </fieldset>
      <fieldset className="group" aria-label="Add">
        <span className="group-label">Add</span>
        <ToolButton
          tool={{ kind: "add-support", support: "tree" }}
          label="Tree"
          title="Click the ground to place a tree"
        />
        <ToolButton
          tool={{ kind: "add-support", support: "metal-mast" }}
          label="Metal mast"
          title="Click the ground to place a grounded aluminium mast"
        />
        <ToolButton
          tool={{ kind: "add-support", support: "wood-pole" }}
          label="Wood pole"
          title="Click the ground to place a wooden pole"
        />
        <ToolButton
          tool={{ kind: "add-support", support: "building" }}
          label="Building"
          title="Click the ground to place a small building"
        />
        <ToolButton
          tool={{ kind: "add-wire", targets: [] }}
          label="Wire run"
          title="Click a support, then another (Shift-click for more, Enter to finish)"
        />
        <ToolButton
          tool={{ kind: "place-feed" }}
          label="Place feed"
          title="Click a wire to put the feed there"
        />
        {tool.kind === "add-wire" && tool.targets.length >= 2 && (
          <button type="button" onClick={() => finishWire(store)}>
            Finish run
          </button>
        )}
      </fieldset>
    </header>
  );
}
