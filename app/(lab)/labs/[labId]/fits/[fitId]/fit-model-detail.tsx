"use client";
/**
 * One fitted kinetics: verdict, parameters with SE and 95 % profile intervals (or, when the data
 * cannot pin them, the curve of equally good solutions), goodness of fit, residuals, and the
 * predictions at the fit — predicted against measured, dispersion relation, repeats on the
 * tissue, sensitivities — plus a Turing-space map around the fitted point.
 */
import { useState } from "react";
import { DispersionPlot } from "@/components/charts/dispersion-plot";
import { formatNumber as f, unitsFor } from "@/components/charts/dispersion-format";
import { FitFigure } from "@/components/charts/fit-figure";
import { FitPredictedMeasured } from "@/components/charts/fit-predicted-measured";
import { FitValley } from "@/components/charts/fit-valley";
import { SensitivityBars } from "@/components/charts/sensitivity-bars";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import type { FittedModelResult } from "@/lib/server/fits/result";
import { VERDICT_TONE } from "../fit-format";
import { FitMapPanel } from "./fit-map-panel";

const side = (s: { value: number | null; open: string | null; turingEdge: boolean }) =>
  s.value === null
    ? `open (${s.open === "bound" ? "reaches the bound" : "beyond the range searched"})`
    : `${f(s.value)}${s.turingEdge ? "†" : ""}`;

function repeatsText(r: Record<string, number>): string {
  if ("wavelengthsAcross" in r) return `${f(r.wavelengthsAcross, 3)} wavelengths across, ${r.maxima} maxima`;
  if ("wavelengthsAcrossX" in r)
    return `${f(r.wavelengthsAcrossX, 3)} × ${f(r.wavelengthsAcrossY, 3)} wavelengths, ${r.maxima} maxima`;
  return Object.entries(r)
    .map(([k, v]) => `${k} ${f(v)}`)
    .join(", ");
}

export function FitModelDetail({ labId, fit, model }: { labId: string; fit: FitDetailDto; model: FittedModelResult }) {
  const r = model.fit;
  const conditions = model.predictions.map((p) => p.condition);
  const [condition, setCondition] = useState(conditions[0]);
  const pred = model.predictions.find((p) => p.condition === condition) ?? model.predictions[0];
  const identifiable = r.identifiability.identifiable;
  const valley = r.identifiability.valley;
  const otherFree = r.parameters.find((p) => p.name !== valley?.parameter)?.name ?? null;
  const slug = `${fit.name}-${model.label}`.toLowerCase().replace(/[^a-z0-9]+/g, "-");
  const units = unitsFor(pred.lengthScaleUm, pred.timeScaleS);

  return (
    <div className="space-y-6" data-testid="model-detail">
      <Panel
        title={<>Best fit — {model.label}</>}
        actions={<Badge tone={VERDICT_TONE[r.verdict] ?? "plain"}>{r.verdict}</Badge>}
      >
        <p className="text-sm" data-testid="fit-verdict">
          {r.verdictReason}
        </p>
        {r.notes.map((n) => (
          <p key={n} className="mt-1 text-xs text-ink-soft">
            Note: {n}
          </p>
        ))}
        {r.warnings.map((w) => (
          <div key={w} className="mt-2">
            <Notice tone="warning">{w}</Notice>
          </div>
        ))}
        {!identifiable && (
          <div className="mt-3">
            <Notice tone="warning" testId="not-identifiable">
              Not identifiable: these data cannot pin the parameters down. {r.identifiability.reasons.join(" ")} The
              values below are one of many equally good solutions; the curve further down shows them all.
            </Notice>
          </div>
        )}
        <table className="mt-3 w-full text-sm" data-testid="parameters-table">
          <thead className="text-left text-xs font-medium text-ink-soft">
            <tr>
              <th className="py-1">Parameter</th>
              <th>Condition</th>
              <th className="text-right">Value</th>
              <th className="text-right">SE</th>
              <th className="pl-4">95 % profile interval</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {r.parameters.map((p) => (
              <tr key={p.name} className="border-t border-rule/60" data-testid={`fitted-${p.name}`}>
                <td className="num py-1 font-medium">{p.parameter}</td>
                <td>{p.condition ?? <span className="text-ink-soft">all</span>}</td>
                <td className={`num text-right ${identifiable ? "text-iris" : "text-ink-soft"}`}>{f(p.value)}</td>
                <td className="num text-right">{p.standardError === null ? "—" : f(p.standardError)}</td>
                <td className="num pl-4" data-testid={`interval-${p.name}`}>
                  {p.interval95 ? `${side(p.interval95.lower)} … ${side(p.interval95.upper)}` : "not computed"}
                </td>
                <td className="text-xs text-ink-soft">
                  {p.atBound && <Badge tone="ochre">at a bound</Badge>} {p.log && "fitted as ln"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-2 text-xs text-ink-soft">
          Fixed:{" "}
          <span className="num">
            {Object.entries(r.fixed)
              .map(
                ([k, v]) =>
                  `${k} = ${
                    typeof v === "number"
                      ? f(v)
                      : Object.entries(v)
                          .map(([c, x]) => `${f(x)} (${c})`)
                          .join(", ")
                  }`,
              )
              .join("; ") || "none"}
          </span>
          . Parameters are in the kinetics&apos; own units (non-dimensional unless marked). † the limit is the edge of
          the Turing region. Intervals: where χ² rises by <span className="num">{f(r.profileDelta, 3)}</span> with the
          other parameters re-optimised (Raue et al. 2009).
        </p>
        <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4" data-testid="goodness">
          <div>
            <dt className="text-xs text-ink-soft">χ²</dt>
            <dd className="num">{f(r.chiSquare)}</dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">reduced χ² (n − p = {r.n - r.p})</dt>
            <dd className="num">{f(r.reducedChiSquare)}</dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">AICc</dt>
            <dd className="num">{f(r.aicc)}</dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">BIC</dt>
            <dd className="num">{f(r.bic)}</dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">measurements n / parameters p</dt>
            <dd className="num">
              {r.n} / {r.p}
            </dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">solver</dt>
            <dd className="text-xs">
              {r.convergence.converged ? "converged" : "not converged"} ({r.convergence.reason}),{" "}
              {r.convergence.starts.length} starts, {r.convergence.evaluations} evaluations
            </dd>
          </div>
          <div>
            <dt className="text-xs text-ink-soft">fit time</dt>
            <dd className="num">{f(model.elapsedMs / 1000, 3)} s</dd>
          </div>
        </dl>
      </Panel>

      {valley && (
        <Panel title="Equally good solutions">
          <p className="mb-2 text-sm text-ink-soft">
            {valley.parameter} stepped across its range with the other parameters re-optimised at each step: every point
            under the dashed line explains the data as well as the best fit.
          </p>
          <FitFigure filename={`${slug}-valley`}>
            <FitValley
              parameter={valley.parameter}
              threshold={r.profileDelta}
              other={otherFree}
              points={valley.points.map((p) => ({
                x: p.params[valley.parameter],
                y: otherFree ? p.params[otherFree] : null,
                deltaChiSquare: p.deltaChiSquare,
                within: p.withinConfidence,
              }))}
            />
          </FitFigure>
        </Panel>
      )}

      <div className="grid gap-6 xl:grid-cols-2">
        <Panel title="Predicted and measured wavelength">
          <FitFigure filename={`${slug}-predicted-measured`}>
            <FitPredictedMeasured
              conditions={conditions}
              measured={r.residuals.map((x) => ({
                condition: x.condition,
                valueUm: x.measuredFourierUm,
                uncertaintyUm: x.uncertaintyFourierUm,
              }))}
              predicted={model.predictions.map((p) => ({ condition: p.condition, valueUm: p.predictedUm }))}
            />
          </FitFigure>
          <table className="mt-2 w-full text-sm" data-testid="residuals-table">
            <thead className="text-left text-xs font-medium text-ink-soft">
              <tr>
                <th className="py-1">#</th>
                <th>Condition</th>
                <th>As measured</th>
                <th className="text-right">Fourier λ (µm)</th>
                <th className="text-right">Predicted (µm)</th>
                <th className="text-right">Residual (SD)</th>
              </tr>
            </thead>
            <tbody>
              {r.residuals.map((x) => (
                <tr key={x.index} className="border-t border-rule/60">
                  <td className="num py-1 pr-2">{x.index + 1}</td>
                  <td>{x.condition}</td>
                  <td className="num text-xs">
                    {x.kind === "nearest-neighbour" ? `a = ${f(x.measuredUm)} µm` : `λ = ${f(x.measuredUm)} µm`}
                  </td>
                  <td className="num text-right text-moss">
                    {f(x.measuredFourierUm)} ± {f(x.uncertaintyFourierUm, 2)}
                  </td>
                  <td className="num text-right text-iris">
                    {f(x.predictedUm)}
                    {!x.turing && x.predictedUm !== null && <span className="text-ochre"> (not Turing)</span>}
                  </td>
                  <td
                    className={`num text-right ${x.residual !== null && Math.abs(x.residual) > 3 ? "text-brick" : ""}`}
                  >
                    {f(x.residual, 3)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
        <Panel
          title="At the fit, per condition"
          actions={
            conditions.length > 1 && (
              <select
                className="rounded-md border border-rule bg-card px-2 py-1 text-sm"
                value={condition}
                onChange={(e) => setCondition(e.target.value)}
                data-testid="prediction-condition"
              >
                {conditions.map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </select>
            )
          }
        >
          <dl className="mb-3 grid grid-cols-2 gap-x-6 gap-y-1 text-sm">
            <div>
              <dt className="text-xs text-ink-soft">state</dt>
              <dd>{pred.classification}</dd>
            </div>
            <div>
              <dt className="text-xs text-ink-soft">predicted 2π/k* / measured (weighted mean)</dt>
              <dd className="num">
                <span className="text-iris">{f(pred.predictedUm)} µm</span> /{" "}
                <span className="text-moss">
                  {f(pred.measuredMeanUm)} ± {f(pred.measuredSeUm, 2)} µm
                </span>
              </dd>
            </div>
          </dl>
          {pred.curve.k.length > 0 && (
            <FitFigure filename={`${slug}-dispersion-${condition}`}>
              <DispersionPlot
                k={pred.curve.k}
                sigma={pred.curve.sigma}
                imSigma={pred.curve.imSigma}
                bands={pred.bands}
                kStar={pred.kStar}
                modes={null}
                units={units}
                height={260}
              />
            </FitFigure>
          )}
          {pred.tissues.length > 0 && (
            <div className="mt-2 text-sm" data-testid="tissue-repeats">
              <h3 className="text-xs font-semibold text-ink-soft">Expected repeats on the tissue</h3>
              {pred.tissues.map((t, i) => (
                <p key={i} className="num">
                  {t.domain.kind === "interval"
                    ? `strip of ${f(t.domain.length)} µm`
                    : t.domain.kind === "rectangle"
                      ? `${f(t.domain.lx)} × ${f(t.domain.ly)} µm`
                      : "tissue"}
                  :{" "}
                  {t.patterningExpected
                    ? `λ = ${f(t.wavelengthUm)} µm, ${repeatsText(t.repeats)}`
                    : "no admissible mode grows — no pattern expected"}
                </p>
              ))}
            </div>
          )}
          <h3 className="mt-3 text-xs font-semibold text-ink-soft">Sensitivities of λ* at the fit</h3>
          {pred.elasticities.length > 0 ? (
            <FitFigure filename={`${slug}-sensitivities-${condition}`}>
              <SensitivityBars items={pred.elasticities} />
            </FitFigure>
          ) : (
            <p className="text-sm text-ink-soft">None computed.</p>
          )}
          {pred.elasticityNote && <p className="text-xs text-ink-soft">{pred.elasticityNote}</p>}
        </Panel>
      </div>

      <FitMapPanel labId={labId} model={model} condition={condition} slug={slug} />
    </div>
  );
}
