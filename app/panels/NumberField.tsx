import { type KeyboardEvent, useEffect, useId, useState } from "react";

/**
 * A labelled field that commits on Enter or blur, reverts on Escape, and steps with the arrow keys
 * (Shift for ten steps). Typing never edits the plan until committed, so one entry is one undo step.
 */
interface Props {
  label: string;
  unit?: string;
  value: number | undefined;
  /** Decimal places shown (default 2), unless `format` says how to show the value. */
  digits?: number;
  /** How to show the value, for quantities spanning decades (σ from 0.0001 to 5 S/m). */
  format?: (value: number) => string;
  /** Arrow-key step; without one the arrows do nothing. */
  step?: number;
  min?: number;
  max?: number;
  /** A further check of a typed value: the problem in words, or null. A value with a problem is never committed. */
  check?: (value: number) => string | null;
  testId: string;
  onCommit: (value: number) => void;
}

export function NumberField({
  label,
  unit,
  value,
  digits = 2,
  format,
  step,
  min,
  max,
  check,
  testId,
  onCommit,
}: Props) {
  const id = useId();
  const show = (v: number) => (format ? format(v) : v.toFixed(digits));
  const shown = value === undefined ? "" : show(value);
  const [draft, setDraft] = useState(shown);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    setDraft(shown);
    setProblem(null);
  }, [shown]);

  const commit = (text: string) => {
    const v = Number.parseFloat(text.replace(",", "."));
    if (!Number.isFinite(v)) return setProblem("enter a number");
    if (min !== undefined && v < min) return setProblem(`at least ${min}`);
    if (max !== undefined && v > max) return setProblem(`at most ${max}`);
    const why = check?.(v) ?? null;
    if (why) return setProblem(why);
    setProblem(null);
    if (text.trim() !== shown) onCommit(v);
  };
  const onKey = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "Enter") commit(draft);
    else if (e.key === "Escape") {
      setDraft(shown);
      setProblem(null);
      (e.target as HTMLInputElement).blur();
    } else if (step !== undefined && (e.key === "ArrowUp" || e.key === "ArrowDown")) {
      e.preventDefault();
      const base = Number.parseFloat(draft);
      if (!Number.isFinite(base)) return;
      let v = base + (e.key === "ArrowUp" ? 1 : -1) * step * (e.shiftKey ? 10 : 1);
      if (min !== undefined) v = Math.max(min, v);
      if (max !== undefined) v = Math.min(max, v);
      const text = show(v);
      setDraft(text);
      commit(text);
    }
  };
  return (
    <div className={`field ${problem ? "field-bad" : ""}`}>
      <label htmlFor={id}>{label}</label>
      <div className="field-input">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          value={draft}
          aria-label={unit ? `${label} (${unit})` : label}
          aria-invalid={problem ? true : undefined}
          data-testid={testId}
          onChange={(e) => setDraft(e.target.value)}
          onBlur={() => commit(draft)}
          onKeyDown={onKey}
          placeholder="—"
        />
        {unit && <span className="field-unit">{unit}</span>}
      </div>
      {problem && (
        <span className="field-problem" data-testid={`${testId}-problem`} role="alert">
          {problem}
        </span>
      )}
    </div>
  );
}
