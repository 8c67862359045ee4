/**
 * Undo history as snapshots of an immutable document. Each entry is the document as it was before a
 * committed change, so undo is "swap the current document with the top of `past`". Snapshots are cheap
 * here: plans are small, and immutable updates share every untouched branch.
 *
 * How a change enters history is stated by the caller (the undo policy):
 *  - "immediately": one entry now (an inspector field, delete, duplicate, add);
 *  - "eventually": part of a gesture that began with a mark; the whole gesture becomes one entry when it
 *    commits, or vanishes when it is cancelled (a drag, Escape bails back);
 *  - "never": replace the document without an entry (loading a file, autosave restore).
 */
export type UndoPolicy = "immediately" | "eventually" | "never";

export interface History<T> {
  past: readonly T[];
  future: readonly T[];
}

/** Enough for an evening's edits; old entries fall off the bottom. */
export const HISTORY_LIMIT = 200;

export function emptyHistory<T>(): History<T> {
  return { past: [], future: [] };
}

/** Record that `before` was the document before a committed change; a new change clears redo. */
export function record<T>(history: History<T>, before: T): History<T> {
  const past = [...history.past, before];
  if (past.length > HISTORY_LIMIT) past.splice(0, past.length - HISTORY_LIMIT);
  return { past, future: [] };
}

export function undo<T>(history: History<T>, current: T): { history: History<T>; doc: T } | null {
  if (history.past.length === 0) return null;
  const doc = history.past[history.past.length - 1];
  return {
    doc,
    history: { past: history.past.slice(0, -1), future: [current, ...history.future] },
  };
}

export function redo<T>(history: History<T>, current: T): { history: History<T>; doc: T } | null {
  if (history.future.length === 0) return null;
  const [doc, ...future] = history.future;
  return { doc, history: { past: [...history.past, current], future } };
}
