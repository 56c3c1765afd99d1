"use client";
/** The run form's kinetics choice, its parameter values and, for non-dimensional kinetics, the scales ℓ and τ. */
import { Panel } from "@/components/ui/panel";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import { field, Label } from "./run-form-label";
import type { RunDraft, RunPrefill } from "./use-run-draft";

export function RunKineticsPanel({
  d,
  kinetics,
  prefill,
}: {
  d: RunDraft;
  kinetics: KineticsInfoDto[];
  prefill: RunPrefill;
}) {
  const { info, dimensional } = d;
  return (
    <Panel title="Kinetics and parameters">
      {prefill.fit && (
        <p className="mb-2 text-xs text-ink-soft" data-testid="run-from-fit">
          From the fit {prefill.fit.label}. Kinetics, parameters and scales are the fit&apos;s.
        </p>
      )}
      <select
        className={field}
        value={d.id}
        disabled={!!prefill.fit}
        onChange={(e) => d.choose(e.target.value)}
        data-testid="run-kinetics"
        aria-label="Kinetics"
      >
        {kinetics.map((k) => (
          <option key={k.id} value={k.id}>
            {k.name}
            {k.version ? ` (lab, v${k.version})` : ""}
          </option>
        ))}
      </select>
      <div className="mt-3 space-y-2">
        {info?.parameters.map((p) => (
          <Label
            key={p.name}
            text={
              <>
                <span className="num font-medium text-ink">{p.name}</span>{" "}
                <span className="num">
                  [{p.min ?? "−∞"}, {p.max ?? "∞"}]{p.unit && p.unit !== "1" ? ` ${p.unit}` : ""}
                </span>
              </>
            }
          >
            <input
              className={field}
              value={d.values[p.name] ?? ""}
              disabled={!!prefill.fit}
              onChange={(e) => d.setValues((v) => ({ ...v, [p.name]: e.target.value }))}
              data-testid={`run-param-${p.name}`}
            />
          </Label>
        ))}
      </div>
      {!dimensional && (
        <div className="mt-3 grid grid-cols-2 gap-2 border-t border-rule pt-3">
          <p className="col-span-2 text-xs text-ink-soft">
            Non-dimensional kinetics: sizes and times below are model units; ℓ and τ turn results into µm and s.
          </p>
          <Label text="length scale ℓ (µm)">
            <input
              className={field}
              value={d.lengthScale}
              placeholder="none"
              disabled={!!prefill.fit}
              onChange={(e) => d.setLengthScale(e.target.value)}
              data-testid="run-length-scale"
            />
          </Label>
          <Label text="time scale τ (s)">
            <input
              className={field}
              value={d.timeScale}
              placeholder="none"
              disabled={!!prefill.fit}
              onChange={(e) => d.setTimeScale(e.target.value)}
              data-testid="run-time-scale"
            />
          </Label>
        </div>
      )}
    </Panel>
  );
}
