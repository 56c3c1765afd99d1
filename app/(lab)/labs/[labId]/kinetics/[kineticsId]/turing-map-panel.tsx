"use client";
/** Turing-space map of two chosen parameters over ranges (linear or log), with a target wavelength. */
import { useState } from "react";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { TuringMapHeatmap } from "@/components/charts/turing-map-heatmap";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { KineticsInfoDto, KineticsParameterDto } from "@/lib/server/kinetics/catalogue";
import type { TuringMapDto } from "@/lib/server/kinetics/map";
import type { AnalysisBase } from "./analysis-base";
import { ComputingBadge } from "./computing-badge";
import { numberOrText, optionalNumber, useAnalysis } from "./use-analysis";

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";

interface AxisDraft {
  name: string;
  min: string;
  max: string;
  n: string;
  scale: "linear" | "log";
}

/** Default sweep: default/5 … default×5 inside the allowed range (or the range itself when the default is 0). */
function defaultAxis(p: KineticsParameterDto, n: number): AxisDraft {
  const lo = p.min ?? -Infinity,
    hi = p.max ?? Infinity;
  const [a, b] =
    p.default > 0
      ? [Math.max(lo, p.default / 5), Math.min(hi, p.default * 5)]
      : [Number.isFinite(lo) ? lo : 0, Number.isFinite(hi) ? hi : 1];
  return {
    name: p.name,
    min: String(Number(a.toPrecision(3))),
    max: String(Number(b.toPrecision(3))),
    n: String(n),
    scale: "linear",
  };
}

export function TuringMapPanel({ labId, info, base }: { labId: string; info: KineticsInfoDto; base: AnalysisBase }) {
  const swept = info.parameters.filter((p) => p.name !== "gamma");
  const pick = swept.length >= 2 ? swept : info.parameters;
  // Two species with diagonal diffusion use the engine's closed-form cells; anything else needs a
  // general eigenvalue solver per wavenumber, about ten times slower, so it starts smaller.
  const fast = info.species.length === 2 && info.diffusion.every((row, i) => row.every((d, j) => i === j || d === "0"));
  const cells = fast ? 60 : 24;
  const [x, setX] = useState<AxisDraft>(() => defaultAxis(pick[0], cells));
  const [y, setY] = useState<AxisDraft>(() => defaultAxis(pick[1] ?? pick[0], cells));
  const [wavenumbers, setWavenumbers] = useState(fast ? "120" : "60");
  const [target, setTarget] = useState({ wavelength: "", tolerance: "" });
  const axisBody = (a: AxisDraft) => ({
    name: a.name,
    min: numberOrText(a.min),
    max: numberOrText(a.max),
    n: numberOrText(a.n),
    scale: a.scale,
  });
  const targetWavelength = optionalNumber(target.wavelength);
  const body =
    info.parameters.length < 2
      ? null
      : {
          ...base,
          x: axisBody(x),
          y: axisBody(y),
          wavenumbers: numberOrText(wavenumbers),
          ...(targetWavelength !== undefined
            ? {
                target: {
                  wavelength: targetWavelength,
                  tolerance:
                    optionalNumber(target.tolerance) ??
                    (typeof targetWavelength === "number" ? 0.05 * targetWavelength : 0),
                },
              }
            : {}),
        };
  const map = useAnalysis<TuringMapDto>(`/api/v1/labs/${labId}/analyses/turing-map`, body, 500);
  const m = map.data;
  const lengthUnit = m?.lengthScaleUm ? "µm" : "model length";
  const lf = m?.lengthScaleUm ?? 1;

  const axisControls = (label: string, a: AxisDraft, set: (a: AxisDraft) => void, testId: string) => (
    <div className="grid grid-cols-[5rem_1fr_1fr_3.5rem_6rem] items-end gap-2" data-testid={testId}>
      <label className="block text-xs">
        {label} axis
        <select
          className={field}
          value={a.name}
          onChange={(e) =>
            set(
              defaultAxis(
                info.parameters.find((p) => p.name === e.target.value)!,
                Number(a.n) || cells,
              ),
            )
          }
        >
          {info.parameters.map((p) => (
            <option key={p.name} value={p.name}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      <label className="block text-xs">
        from
        <input className={field} value={a.min} onChange={(e) => set({ ...a, min: e.target.value })} />
      </label>
      <label className="block text-xs">
        to
        <input className={field} value={a.max} onChange={(e) => set({ ...a, max: e.target.value })} />
      </label>
      <label className="block text-xs">
        cells
        <input className={field} value={a.n} onChange={(e) => set({ ...a, n: e.target.value })} />
      </label>
      <label className="block text-xs">
        spacing
        <select
          className={field}
          value={a.scale}
          onChange={(e) => set({ ...a, scale: e.target.value as "linear" | "log" })}
        >
          <option value="linear">linear</option>
          <option value="log">log</option>
        </select>
      </label>
    </div>
  );

  return (
    <Panel
      title="Turing-space map"
      actions={<ComputingBadge on={map.computing} stale={map.stale} testId="map-computing" />}
    >
      {info.parameters.length < 2 ? (
        <p className="text-sm text-ink-soft">A map needs two parameters; this kinetics has fewer.</p>
      ) : (
        <div className="grid gap-6 xl:grid-cols-[26rem_1fr]">
          <div className="space-y-3">
            {axisControls("x", x, setX, "map-x")}
            {axisControls("y", y, setY, "map-y")}
            <div className="grid grid-cols-3 gap-2">
              <label className="block text-xs">
                wavenumbers per cell
                <input className={field} value={wavenumbers} onChange={(e) => setWavenumbers(e.target.value)} />
              </label>
              <label className="block text-xs">
                target λ ({lengthUnit})
                <input
                  className={field}
                  value={target.wavelength}
                  placeholder="none"
                  onChange={(e) => setTarget({ ...target, wavelength: e.target.value })}
                  data-testid="map-target"
                />
              </label>
              <label className="block text-xs">
                ± tolerance ({lengthUnit})
                <input
                  className={field}
                  value={target.tolerance}
                  placeholder="5 % of λ"
                  onChange={(e) => setTarget({ ...target, tolerance: e.target.value })}
                />
              </label>
            </div>
            <p className="text-xs text-ink-soft">
              The other parameters stay at the values on the left. Interactive maps: at most 40 000 cells (200 × 200)
              and 200 wavenumbers, computed within 1 s.
            </p>
            {m && (
              <dl className="text-sm" data-testid="map-summary">
                <div className="flex justify-between border-b border-rule/60 py-1">
                  <dt className="text-ink-soft">Turing fraction</dt>
                  <dd className="num" data-testid="turing-fraction">
                    {f(m.turingFraction * 100, 3)} % of {m.nx * m.ny} cells
                  </dd>
                </div>
                {m.target && (
                  <div className="flex justify-between border-b border-rule/60 py-1">
                    <dt className="text-ink-soft">
                      cells at λ* = {f(m.target.wavelength * lf)} ± {f(m.target.tolerance * lf)} {lengthUnit}
                    </dt>
                    <dd className="num">{m.target.matchCount}</dd>
                  </div>
                )}
                <div className="flex justify-between py-1">
                  <dt className="text-ink-soft">computed in</dt>
                  <dd className="num">{m.elapsedMs} ms</dd>
                </div>
              </dl>
            )}
          </div>
          <div>
            {map.error && (
              <div className="mb-3">
                <Notice tone="error" testId="map-error">
                  {map.error.message}
                </Notice>
              </div>
            )}
            {m ? (
              <div className={map.error ? "opacity-50" : ""}>
                <TuringMapHeatmap
                  nx={m.nx}
                  ny={m.ny}
                  x={m.x}
                  y={m.y}
                  classes={m.classes}
                  wavelength={m.wavelength.map((v) => (v === null ? null : v * lf))}
                  wavelengthUnit={lengthUnit}
                  counts={m.counts}
                  match={m.target?.match ?? null}
                  contour={m.target?.contour ?? null}
                />
              </div>
            ) : (
              !map.error && <p className="text-sm text-ink-soft">Computing the map…</p>
            )}
          </div>
        </div>
      )}
    </Panel>
  );
}
