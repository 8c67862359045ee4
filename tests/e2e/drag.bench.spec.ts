import { test } from "@playwright/test";
import { openDemo } from "./helpers";

/**
 * `npm run bench:app`: drag a support on the demo plan and measure, in the page's own clock,
 * (a) the time from each pointer move to the results panel showing the analysis of the plan that move
 * produced (the resonance figure is rendered in that same commit), and (b) the main thread's long tasks
 * (PerformanceObserver "longtask", i.e. tasks over 50 ms) during the drag. Prints the figures; asserts
 * nothing about speed (speed is measured, never asserted).
 */
const STEPS = 24;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length
    ? s.length % 2
      ? s[(s.length - 1) / 2]
      : (s[s.length / 2 - 1] + s[s.length / 2]) / 2
    : Number.NaN;
}

test("drag a support: input to updated resonance, and main-thread long tasks", async ({ page }) => {
  await openDemo(page);
  await page.getByLabel("Snap step").selectOption("off");
  await page.getByTestId("view-top").click();
  await page.waitForTimeout(300);
  const birch = await page.evaluate(() => {
    const probe = (
      window as unknown as { __yardProbe: { project: (x: number, y: number, z: number) => number[] } }
    ).__yardProbe;
    // The birch of the demo plan, at its canopy (the widest target seen from above).
    return {
      at: probe.project(5.5, 11.5, 9),
      metre: probe.project(6.5, 11.5, 9)[0] - probe.project(5.5, 11.5, 9)[0],
    };
  });
  await page.evaluate(() => {
    const w = window as unknown as {
      __bench: { longTasks: number[]; inputs: number[]; shown: [number, number][] };
    };
    w.__bench = { longTasks: [], inputs: [], shown: [] };
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__bench.longTasks.push(e.duration);
    }).observe({ type: "longtask" });
    window.addEventListener("pointermove", () => w.__bench.inputs.push(performance.now()), { capture: true });
    const status = document.querySelector('[data-testid="analysis-status"]') as HTMLElement;
    new MutationObserver(() => {
      w.__bench.shown.push([Number(status.dataset.resultRevision), performance.now()]);
    }).observe(status, { attributes: true, attributeFilter: ["data-result-revision"] });
  });

  // The page's own main-thread time over the drag (Chromium's counters): scripting, and all tasks.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Performance.enable");
  const counters = async () => {
    const { metrics } = await cdp.send("Performance.getMetrics");
    const get = (n: string) => metrics.find((m) => m.name === n)?.value ?? 0;
    return { script: get("ScriptDuration"), task: get("TaskDuration") };
  };
  const [x0, y0] = birch.at;
  await page.mouse.move(x0, y0);
  const before = await counters();
  await page.mouse.down();
  const latencies: number[] = [];
  for (let i = 1; i <= STEPS; i++) {
    // Back and forth along the wire by up to 0.6 m: each move changes the span, so each one re-solves.
    const dx = Math.sin((i / STEPS) * Math.PI * 4) * 0.6 * birch.metre;
    const prev = await page.getByTestId("analysis-status").getAttribute("data-plan-revision");
    await page.mouse.move(x0 + dx, y0 + 0.3 * birch.metre * (i % 2));
    const inputAt = await page.evaluate(() =>
      (window as unknown as { __bench: { inputs: number[] } }).__bench.inputs.at(-1),
    );
    // The plan revision this move produced, then the first time a result for it (or newer) was shown.
    const rev = await page
      .waitForFunction(
        (p) => {
          const r = (document.querySelector('[data-testid="analysis-status"]') as HTMLElement).dataset
            .planRevision;
          return r !== p ? Number(r) : false;
        },
        prev,
        { timeout: 5000 },
      )
      .then((h) => h.jsonValue() as Promise<number>)
      .catch(() => null);
    if (rev === null) continue;
    const shownAt = await page
      .waitForFunction(
        (target) => {
          const w = window as unknown as { __bench: { shown: [number, number][] } };
          return w.__bench.shown.find(([r]) => r >= target)?.[1] ?? false;
        },
        rev,
        { timeout: 30_000 },
      )
      .then((h) => h.jsonValue() as Promise<number>);
    if (inputAt !== undefined) latencies.push(shownAt - inputAt);
  }
  const after = await counters();
  const results = await page.evaluate(
    () => (window as unknown as { __bench: { shown: unknown[] } }).__bench.shown.length,
  );
  await page.mouse.up();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="analysis-status"]')?.getAttribute("data-state") === "current",
    null,
    { timeout: 60_000 },
  );
  const longTasks = await page.evaluate(
    () => (window as unknown as { __bench: { longTasks: number[] } }).__bench.longTasks,
  );
  const sorted = [...latencies].sort((a, b) => a - b);
  const figures = {
    drags: latencies.length,
    medianMs: Number(median(latencies).toFixed(1)),
    p90Ms: Number((sorted[Math.floor(sorted.length * 0.9)] ?? Number.NaN).toFixed(1)),
    maxMs: Number((sorted.at(-1) ?? Number.NaN).toFixed(1)),
    longTasks: longTasks.length,
    longestTaskMs: Number((longTasks.length ? Math.max(...longTasks) : 0).toFixed(1)),
    // Seconds → ms, per pointer move of the drag (each move also brings about one result).
    scriptMsPerMove: Number((((after.script - before.script) * 1000) / STEPS).toFixed(1)),
    taskMsPerMove: Number((((after.task - before.task) * 1000) / STEPS).toFixed(1)),
    resultsShown: results,
  };
  console.log(`bench:app drag-to-resonance ${JSON.stringify(figures)}`);
  test.info().annotations.push({ type: "bench", description: JSON.stringify(figures) });
});
