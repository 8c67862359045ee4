import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { App } from "./App";
import { autosave, loadDemoPlan, restore } from "./persistence";
import { StoreContext } from "./store/react";
import { createAppStore } from "./store/store";
import "./styles.css";
import { connectAnalysis, startWorker } from "./worker-client";

async function start() {
  const root = createRoot(document.getElementById("root")!);
  // ?demo starts from the demo plan whatever was autosaved (handy for tests and for a fresh look).
  const fresh = new URLSearchParams(location.search).has("demo");
  const restored = fresh ? { plan: null } : restore();
  let plan = restored.plan;
  if (!plan) {
    try {
      plan = await loadDemoPlan();
    } catch (e) {
      root.render(<p className="fatal">The demo plan could not be loaded: {(e as Error).message}</p>);
      return;
    }
  }
  const store = createAppStore(plan);
  if (restored.problem) store.getState().notify(restored.problem, "error");
  const worker = startWorker();
  connectAnalysis(store, worker.api, worker.stop);
  // Autosave after edits settle; a plan that does not validate is never written over the last good one.
  let timer: ReturnType<typeof setTimeout> | undefined;
  store.subscribe((s, prev) => {
    const ended = prev.gestureOrigin !== null && s.gestureOrigin === null;
    if ((s.plan === prev.plan && !ended) || s.gestureOrigin) return;
    clearTimeout(timer);
    timer = setTimeout(() => autosave(store.getState().plan), 400);
  });
  root.render(
    <StrictMode>
      <StoreContext.Provider value={store}>
        <App />
      </StoreContext.Provider>
    </StrictMode>,
  );
}

void start();
