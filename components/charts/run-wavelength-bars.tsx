"use client";
/** Simulated wavelength ± 2u (green, read the tissue way) beside the linear prediction 2π/k* (violet; the box's fastest mode outlined in violet) and, from a fit, the tissue's measured mean (dark green). */
import { formatSig } from "./spectrum-format";

export interface RunWavelengthBarsProps {
  simulated: number | null;
  uncertainty: number | null;
  predicted: number | null;
  /** The fastest admissible mode of the box, if known. */
  domainMode: number | null;
  /** The measured mean ± SE a fit used (µm), when the run started from a fit. */
  measured?: { value: number; se: number } | null;
  unit: string;
}

export function RunWavelengthBars({
  simulated,
  uncertainty,
  predicted,
  domainMode,
  measured = null,
  unit,
}: RunWavelengthBarsProps) {
  const values = [simulated, predicted, domainMode, measured?.value ?? null].filter(
    (v): v is number => v !== null && Number.isFinite(v),
  );
  if (values.length === 0) return null;
  const hi = Math.max(...values, (simulated ?? 0) + 2 * (uncertainty ?? 0)) * 1.15;
  const x = (v: number) => `${(v / hi) * 100}%`;
  const row = (label: string, v: number | null, colour: string, u?: number | null, text = "text-card") =>
    v === null ? null : (
      <div className="grid grid-cols-[11rem_1fr] items-center gap-2 text-xs">
        <span className="text-ink-soft">{label}</span>
        <div className="relative h-4 rounded bg-paper-deep">
          <div className={`absolute inset-y-0 left-0 rounded ${colour}`} style={{ width: x(v) }} />
          {u ? (
            <div
              className="absolute inset-y-1 bg-ink/40"
              style={{ left: x(Math.max(0, v - 2 * u)), width: x(4 * u) }}
            />
          ) : null}
          <span className={`num absolute left-1 top-0 text-[11px] ${text}`}>
            {formatSig(v, 4)} {unit}
          </span>
        </div>
      </div>
    );
  return (
    <div className="space-y-1.5" data-testid="wavelength-bars">
      {row("simulated λ (readout) ± 2u", simulated, "bg-moss", uncertainty)}
      {row("linear prediction 2π/k*", predicted, "bg-iris")}
      {/* Outlined, with dark figures: a paler fill behind light figures fails WCAG 1.4.3 contrast. */}
      {row("fastest mode of this box", domainMode, "border-2 border-iris bg-iris-soft", null, "text-ink")}
      {measured && row("measured (fit's readouts) ± 2 SE", measured.value, "bg-moss-dark", measured.se)}
      <p className="text-xs text-ink-soft">
        Axis from 0 to{" "}
        <span className="num">
          {formatSig(hi, 3)} {unit}
        </span>
        ; dark band on the green bar: ± two standard uncertainties.
      </p>
    </div>
  );
}
