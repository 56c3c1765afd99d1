"use client";
/**
 * The state of an analysis panel's result: computing, out of date (the result shown belongs to
 * earlier inputs, e.g. the last change could not be computed), or current (kept invisible).
 * A result that no longer matches its inputs never reads "up to date".
 */
export function ComputingBadge({ on, stale = false, testId }: { on: boolean; stale?: boolean; testId: string }) {
  const text = on
    ? "computing…"
    : stale
      ? "out of date: the result shown is for the inputs before your last change"
      : "up to date";
  return (
    <span
      className={`num text-xs ${on || stale ? "text-ochre" : "text-transparent"}`}
      data-testid={testId}
      aria-live="polite"
    >
      {text}
    </span>
  );
}
