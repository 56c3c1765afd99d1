"use client";
/** Predicted against measured wavelength per condition, and the residual of every datum. */
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { FitFigure } from "@/components/charts/fit-figure";
import { FitPredictedMeasured } from "@/components/charts/fit-predicted-measured";
import { Panel } from "@/components/ui/panel";
import type { FittedModelResult } from "@/lib/server/fits/result";

export function FitResidualsPanel({
  model,
  conditions,
  slug,
}: {
  model: FittedModelResult;
  conditions: string[];
  slug: string;
}) {
  const r = model.fit;
  return (
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
              <td className={`num text-right ${x.residual !== null && Math.abs(x.residual) > 3 ? "text-brick" : ""}`}>
                {f(x.residual, 3)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Panel>
  );
}
