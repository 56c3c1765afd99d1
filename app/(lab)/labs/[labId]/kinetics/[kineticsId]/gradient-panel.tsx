"use client";
/** A parameter varying along the tissue: local predicted wavelength vs position and where patterning is expected. */
import { useState } from "react";
import { DispersionGradientPlot } from "@/components/charts/dispersion-gradient-plot";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { GradientDto } from "@/lib/server/kinetics/analyses";
import type { AnalysisBase } from "./analysis-base";
import { ComputingBadge } from "./computing-badge";
import { numberOrText, useAnalysis } from "./use-analysis";

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";
type Kind = "linear" | "exponential" | "table";

export function GradientPanel({ labId, info, base }: { labId: string; info: KineticsInfoDto; base: AnalysisBase }) {
  const first = info.parameters.find((p) => p.name !== "gamma") ?? info.parameters[0];
  const [parameter, setParameter] = useState(first?.name ?? "");
  const [kind, setKind] = useState<Kind>("linear");
  const [v, setV] = useState(() => ({
    from: String(first?.default ?? 1),
    to: String((first?.default ?? 1) * 2),
    source: String(first?.default ?? 1),
    decay: "20",
    floor: "0",
    text: "position,value\n0,1\n100,2\n",
    length: "100",
  }));
  const hasLength = base.lengthScaleUm !== undefined || info.units === "dimensional";
  const unit = hasLength ? "µm" : "model length";
  const profile =
    kind === "linear"
      ? { kind, from: numberOrText(v.from), to: numberOrText(v.to) }
      : kind === "exponential"
        ? { kind, source: numberOrText(v.source), decayLength: numberOrText(v.decay), floor: numberOrText(v.floor) }
        : { kind, text: v.text };
  const g = useAnalysis<GradientDto>(
    `/api/v1/labs/${labId}/analyses/gradient`,
    parameter ? { ...base, parameter, profile, length: numberOrText(v.length), samples: 101 } : null,
    500,
  );
  const d = g.data;
  const physical = d?.positionUnits === "um";
  const points = d?.points.map((p) => ({ x: p.x, wavelength: physical ? p.wavelengthUm : p.wavelength })) ?? [];
  const set = (patch: Partial<typeof v>) => setV((x) => ({ ...x, ...patch }));
  return (
    <Panel
      title="Gradient along the tissue"
      actions={<ComputingBadge on={g.computing} stale={g.stale} testId="gradient-computing" />}
    >
      <div className="grid grid-cols-3 gap-2">
        <label className="block text-xs">
          parameter
          <select
            className={field}
            value={parameter}
            onChange={(e) => setParameter(e.target.value)}
            data-testid="gradient-parameter"
          >
            {info.parameters.map((p) => (
              <option key={p.name} value={p.name}>
                {p.name}
              </option>
            ))}
          </select>
        </label>
        <label className="block text-xs">
          varies
          <select
            className={field}
            value={kind}
            onChange={(e) => setKind(e.target.value as Kind)}
            data-testid="gradient-kind"
          >
            <option value="linear">linearly</option>
            <option value="exponential">exponentially (from a source at x = 0)</option>
            <option value="table">by a pasted position,value table</option>
          </select>
        </label>
        <label className="block text-xs">
          tissue length ({unit})
          <input className={field} value={v.length} onChange={(e) => set({ length: e.target.value })} />
        </label>
        {kind === "linear" && (
          <>
            <label className="block text-xs">
              value at x = 0
              <input
                className={field}
                value={v.from}
                onChange={(e) => set({ from: e.target.value })}
                data-testid="gradient-from"
              />
            </label>
            <label className="block text-xs">
              value at the far end
              <input
                className={field}
                value={v.to}
                onChange={(e) => set({ to: e.target.value })}
                data-testid="gradient-to"
              />
            </label>
          </>
        )}
        {kind === "exponential" && (
          <>
            <label className="block text-xs">
              source amplitude
              <input className={field} value={v.source} onChange={(e) => set({ source: e.target.value })} />
            </label>
            <label className="block text-xs">
              decay length ({unit})
              <input className={field} value={v.decay} onChange={(e) => set({ decay: e.target.value })} />
            </label>
            <label className="block text-xs">
              floor
              <input className={field} value={v.floor} onChange={(e) => set({ floor: e.target.value })} />
            </label>
          </>
        )}
        {kind === "table" && (
          <label className="col-span-3 block text-xs">
            position ({unit}), value — one pair per line
            <textarea
              className={field}
              rows={4}
              value={v.text}
              onChange={(e) => set({ text: e.target.value })}
              data-testid="gradient-table"
            />
          </label>
        )}
      </div>
      {g.error && (
        <div className="mt-3">
          <Notice tone="error" testId="gradient-error">
            {g.error.message}
          </Notice>
        </div>
      )}
      {d && (
        <div className={`mt-3 ${g.error ? "opacity-50" : ""}`}>
          <DispersionGradientPlot
            points={points}
            regions={d.patterningRegions}
            positionUnit={physical ? "µm" : "model length"}
            wavelengthUnit={physical ? "µm" : "model length"}
          />
          <p className="text-sm" data-testid="patterning-regions">
            {d.patterningRegions.length ? (
              <>
                Patterning expected (Turing locally) at{" "}
                {d.patterningRegions
                  .map((r) => (
                    <span key={r.from} className="num text-iris">
                      {f(r.from)}–{f(r.to)} {physical ? "µm" : "model length"}
                    </span>
                  ))
                  .reduce<React.ReactNode[]>((a, x, i) => (i ? [...a, ", ", x] : [x]), [])}
                .
              </>
            ) : (
              "No position is Turing unstable: no patterning expected along this gradient."
            )}
          </p>
          <p className="text-xs text-ink-soft">
            A local reading: valid where the parameter changes little over one wavelength.
          </p>
        </div>
      )}
    </Panel>
  );
}
