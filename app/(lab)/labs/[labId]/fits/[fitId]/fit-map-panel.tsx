"use client";
/**
 * Turing-space map of two chosen parameters around the fit (the kinetics analyses API, other
 * parameters at their fitted values for the chosen condition), with the fitted point and the
 * contour where the predicted wavelength equals the measured one.
 */
import { useState } from "react";
import useSWR from "swr";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { FitFigure } from "@/components/charts/fit-figure";
import { FitTuringMap } from "@/components/charts/fit-turing-map";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { sendJson, type ApiError } from "@/lib/client/api";
import type { FittedModelResult } from "@/lib/server/fits/result";
import type { TuringMapDto } from "@/lib/server/kinetics/map";

const SCALES = ["lengthScaleUm", "timeScaleS"];
const select = "rounded-md border border-rule bg-card px-2 py-1 text-sm";

export function FitMapPanel({
  labId,
  model,
  condition,
  slug,
}: {
  labId: string;
  model: FittedModelResult;
  condition: string;
  slug: string;
}) {
  const pred = model.predictions.find((p) => p.condition === condition) ?? model.predictions[0];
  const names = Object.keys(pred.parameters).filter((n) => !SCALES.includes(n) && pred.parameters[n] > 0);
  const fitted = [...new Set(model.fit.parameters.map((p) => p.parameter))].filter((n) => names.includes(n));
  const [x, setX] = useState(fitted[0] ?? names[0]);
  const [y, setY] = useState(fitted[1] ?? names.find((n) => n !== (fitted[0] ?? names[0])) ?? names[0]);
  const [span, setSpan] = useState(3);
  const k = model.kinetics;
  const ell = pred.lengthScaleUm;
  const axis = (name: string) => ({
    name,
    min: pred.parameters[name] / span,
    max: pred.parameters[name] * span,
    n: 40,
    scale: "log" as const,
  });
  const params = Object.fromEntries(Object.entries(pred.parameters).filter(([n]) => !SCALES.includes(n)));
  const body =
    names.length < 2 || !ell
      ? null
      : {
          kinetics: k.id,
          ...(k.kind === "lab" ? { version: k.version } : {}),
          parameters: params,
          lengthScaleUm: ell,
          ...(pred.timeScaleS ? { timeScaleS: pred.timeScaleS } : {}),
          x: axis(x),
          y: axis(y),
          wavenumbers: 100,
          target: { wavelength: pred.measuredMeanUm, tolerance: 0.02 * pred.measuredMeanUm },
        };
  const key = body ? JSON.stringify(body) : null;
  const map = useSWR<TuringMapDto, ApiError>(
    key ? [`/api/v1/labs/${labId}/analyses/turing-map`, key] : null,
    ([u, b]: [string, string]) => sendJson<TuringMapDto>("POST", u, JSON.parse(b)),
    { revalidateOnFocus: false, shouldRetryOnError: false, keepPreviousData: true },
  );
  const m = map.data;
  return (
    <Panel title={`Turing-space map around the fit — ${condition}`}>
      {names.length < 2 || !ell ? (
        <p className="text-sm text-ink-soft">A map needs two positive parameters and a length scale in µm.</p>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[1fr_18rem]">
          <div>
            {map.error && <Notice tone="error">{map.error.message}</Notice>}
            {m ? (
              <FitFigure filename={`${slug}-turing-map-${condition}`} testId="fit-map-figure">
                <FitTuringMap
                  nx={m.nx}
                  ny={m.ny}
                  x={m.x}
                  y={m.y}
                  classes={m.classes}
                  wavelengthUm={m.wavelength.map((v) => (v === null ? null : v * ell))}
                  contour={m.target?.contour ?? null}
                  point={{ x: pred.parameters[x], y: pred.parameters[y] }}
                  measuredUm={pred.measuredMeanUm}
                />
              </FitFigure>
            ) : (
              !map.error && <p className="text-sm text-ink-soft">Computing the map…</p>
            )}
          </div>
          <div className="space-y-2 text-sm">
            <label className="block">
              x axis{" "}
              <select className={select} value={x} onChange={(e) => setX(e.target.value)}>
                {names.map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
              </select>
            </label>
            <label className="block">
              y axis{" "}
              <select className={select} value={y} onChange={(e) => setY(e.target.value)}>
                {names.map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
              </select>
            </label>
            <label className="block">
              range{" "}
              <select className={select} value={span} onChange={(e) => setSpan(Number(e.target.value))}>
                <option value={2}>fit ÷ 2 … × 2</option>
                <option value={3}>fit ÷ 3 … × 3</option>
                <option value={10}>fit ÷ 10 … × 10</option>
              </select>
            </label>
            <p className="text-xs text-ink-soft">
              Log axes, 40 × 40 cells; the other parameters stay at the fit for {condition}. Green: where 2π/k* equals
              the measured <span className="num">{f(pred.measuredMeanUm)} µm</span> (± 2 %). Where it crosses the violet
              Turing region, other parameter pairs would explain the same spacing.
            </p>
            {m && (
              <p className="num text-xs text-ink-soft">
                Turing in {f(m.turingFraction * 100, 3)} % of cells · {m.elapsedMs} ms
              </p>
            )}
          </div>
        </div>
      )}
    </Panel>
  );
}
