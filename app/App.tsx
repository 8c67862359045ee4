import { useEffect } from "react";
import { Inspector } from "./panels/Inspector";
import { Outline } from "./panels/Outline";
import { Results } from "./panels/Results";
import { StageControls } from "./panels/StageControls";
import { Toolbar } from "./panels/Toolbar";
import { deleteElement, duplicateElement } from "./plan/commands";
import { Yard } from "./scene/Yard";
import { useApp, useAppStore } from "./store/react";
import { finishWire } from "./tools";

/** Keyboard: undo/redo, delete, duplicate, Escape to leave a tool. Not while typing in a field. */
function useShortcuts() {
  const store = useAppStore();
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      const typing =
        target &&
        (target.tagName === "INPUT" || target.tagName === "SELECT" || target.tagName === "TEXTAREA");
      const s = store.getState();
      const mod = e.ctrlKey || e.metaKey;
      if (mod && e.key.toLowerCase() === "z") {
        if (typing) return;
        e.preventDefault();
        if (e.shiftKey) s.redo();
        else s.undo();
        return;
      }
      if (mod && e.key.toLowerCase() === "y") {
        if (typing) return;
        e.preventDefault();
        s.redo();
        return;
      }
      if (typing) return;
      if (e.key === "Escape") {
        if (s.tool.kind !== "select") s.setTool({ kind: "select" });
        else s.select(null);
      } else if (e.key === "Enter" && s.tool.kind === "add-wire") {
        finishWire(store);
      } else if ((e.key === "Delete" || e.key === "Backspace") && s.selectedId) {
        const r = deleteElement(s.plan, s.selectedId);
        if (r.refused) s.notify(r.refused, "error");
        else {
          s.applyEdit(() => r.plan, "immediately");
          s.select(null);
        }
      } else if (mod && e.key.toLowerCase() === "d" && s.selectedId) {
        e.preventDefault();
        const r = duplicateElement(s.plan, s.selectedId);
        if (r) {
          s.applyEdit(() => r.plan, "immediately");
          s.select(r.id);
        }
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [store]);
}

function Notice() {
  const notice = useApp((s) => s.notice);
  const tool = useApp((s) => s.tool);
  const hint =
    tool.kind === "add-support"
      ? "Click the ground to place it. Esc cancels."
      : tool.kind === "add-wire"
        ? `Click a support or the ground for anchor ${tool.targets.length + 1}. Shift-click to keep adding; Enter finishes; Esc cancels.`
        : tool.kind === "place-feed"
          ? "Click a wire where the feed should go. Esc cancels."
          : null;
  if (hint) return <div className="notice notice-info">{hint}</div>;
  if (!notice) return null;
  return (
    <div
      className={`notice notice-${notice.tone}`}
      role={notice.tone === "error" ? "alert" : "status"}
      data-testid="notice"
      key={notice.nonce}
    >
      {notice.text}
    </div>
  );
}

export function App() {
  useShortcuts();
  return (
    <div className="app">
      <Toolbar />
      <main className="workspace">
        <div className="sidebar">
          <Outline />
          <Inspector />
        </div>
        <div className="stage">
          <Yard />
          <Notice />
          <StageControls />
          <div className="legend" aria-hidden>
            <span>
              <i className="sw sw-low" /> low current
            </span>
            <span>
              <i className="sw sw-high" /> high current
            </span>
            <span>
              <i className="dot dot-hv" /> high RF voltage
            </span>
            <span>
              <i className="dot dot-feed" /> feed
            </span>
          </div>
        </div>
        <Results />
      </main>
    </div>
  );
}
