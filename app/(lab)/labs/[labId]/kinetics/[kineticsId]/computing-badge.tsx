"use client";
export function ComputingBadge({ on, testId }: { on: boolean; testId: string }) {
  return (
    <span className={`num text-xs ${on ? "text-ochre" : "text-transparent"}`} data-testid={testId} aria-live="polite">
      {on ? "computing…" : "up to date"}
    </span>
  );
}
