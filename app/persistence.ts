import { type Plan, parsePlan } from "../solver/plan/schema";

/**
 * Autosave and plan files. The last plan that passed validation is kept in localStorage; a plan that
 * does not validate (mid-edit, or from a bad file) never overwrites it. A file that fails to open leaves
 * the current plan untouched and is reported by what is wrong and where.
 */
const KEY = "yard-antenna-planner:plan";
const REJECTED_KEY = "yard-antenna-planner:rejected";

export type Opened = { ok: true; plan: Plan } | { ok: false; message: string; elementId?: string };

/** Parse a plan file's text: JSON first, then the plan schema; every failure has a readable message. */
export function readPlanText(text: string): Opened {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    return { ok: false, message: `Not a JSON file: ${(e as Error).message}` };
  }
  try {
    return { ok: true, plan: parsePlan(json) };
  } catch (e) {
    const err = e as Error & { elementId?: string };
    return { ok: false, message: err.message, ...(err.elementId ? { elementId: err.elementId } : {}) };
  }
}

export function planToText(plan: Plan): string {
  return `${JSON.stringify(plan, null, 2)}\n`;
}

/** Save if the plan is valid; returns false (and keeps the old save) if not. */
export function autosave(plan: Plan, storage: Storage = localStorage): boolean {
  const text = planToText(plan);
  const check = readPlanText(text);
  if (!check.ok) return false;
  try {
    storage.setItem(KEY, text);
    return true;
  } catch {
    return false; // storage full or disabled: the app still works, it just cannot remember
  }
}

/** The autosaved plan, if there is one and it still validates. A save that fails is set aside, not lost. */
export function restore(storage: Storage = localStorage): { plan: Plan | null; problem?: string } {
  let text: string | null = null;
  try {
    text = storage.getItem(KEY);
  } catch {
    return { plan: null };
  }
  if (!text) return { plan: null };
  const opened = readPlanText(text);
  if (opened.ok) return { plan: opened.plan };
  try {
    storage.setItem(REJECTED_KEY, text);
  } catch {
    /* nothing more we can do */
  }
  return { plan: null, problem: `The saved plan could not be read (${opened.message}); it was set aside.` };
}

export async function loadDemoPlan(): Promise<Plan> {
  const response = await fetch(`${import.meta.env.BASE_URL}demo-plan.json`);
  if (!response.ok) throw new Error(`demo plan: HTTP ${response.status}`);
  const opened = readPlanText(await response.text());
  if (!opened.ok) throw new Error(`demo plan: ${opened.message}`);
  return opened.plan;
}

/** Offer the plan as a download. */
export function downloadPlan(plan: Plan): void {
  const blob = new Blob([planToText(plan)], { type: "application/json" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = `${(plan.name || "yard-plan").replace(/[^\w.-]+/g, "-").slice(0, 60)}.json`;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
