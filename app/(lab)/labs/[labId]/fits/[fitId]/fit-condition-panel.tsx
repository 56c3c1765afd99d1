"use client";
/** The predictions at the fit for one chosen condition: state, dispersion relation, repeats on the tissue, sensitivities. */
import { DispersionPlot } from "@/components/charts/dispersion-plot";
import { formatNumber as f, unitsFor } from "@/components/charts/dispersion-format";
import { FitFigure } from "@/components/charts/fit-figure";
import { SensitivityBars } from "@/components/charts/sensitivity-bars";
import { Panel } from "@/components/ui/panel";
import type { FittedModelResult } from "@/lib/server/fits/result";

function repeatsText(r: Record<string, number>): string {
  if ("wavelengthsAcross" in r) return `${f(r.wavelengthsAcross, 3)} wavelengths across, ${r.maxima} maxima`;
  if ("wavelengthsAcrossX" in r)
    return `${f(r.wavelengthsAcrossX, 3)} × ${f(r.wavelengthsAcrossY, 3)} wavelengths, ${r.maxima} maxima`;
  return Object.entries(r)
    .map(([k, v]) => `${k} ${f(v)}`)
    .join(", ");
}

export function FitConditionPanel({
  conditions,
  condition,
  setCondition,
  pred,
  slug,
}: {
  conditions: string[];
  condition: string;
  setCondition: (next: string) => void;
  pred: FittedModelResult["predictions"][number];
  slug: string;
}) {
  const units = unitsFor(pred.lengthScaleUm, pred.timeScaleS);
  return (
    <Panel
      title="At the fit, per condition"
      actions={
        conditions.length > 1 && (
          <select
            className="rounded-md border border-rule bg-card px-2 py-1 text-sm"
            value={condition}
            onChange={(e) => setCondition(e.target.value)}
            data-testid="prediction-condition"
            aria-label="Condition"
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
  );
}
