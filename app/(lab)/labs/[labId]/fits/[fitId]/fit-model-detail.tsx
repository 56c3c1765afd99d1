"use client";
/**
 * One fitted kinetics: verdict, parameters with SE and 95 % profile intervals (or, when the data
 * cannot pin them, the curve of equally good solutions), goodness of fit, residuals, and the
 * predictions at the fit — predicted against measured, dispersion relation, repeats on the
 * tissue, sensitivities — plus a Turing-space map around the fitted point.
 */
import { useState } from "react";
import { FigureCaption, FitFigure } from "@/components/charts/fit-figure";
import { FitValley } from "@/components/charts/fit-valley";
import { Panel } from "@/components/ui/panel";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import type { FittedModelResult } from "@/lib/server/fits/result";
import { FitBestPanel } from "./fit-best-panel";
import { FitConditionPanel } from "./fit-condition-panel";
import { FitMapPanel } from "./fit-map-panel";
import { FitResidualsPanel } from "./fit-residuals-panel";

export function FitModelDetail({ labId, fit, model }: { labId: string; fit: FitDetailDto; model: FittedModelResult }) {
  const r = model.fit;
  const conditions = model.predictions.map((p) => p.condition);
  const [condition, setCondition] = useState(conditions[0]);
  const pred = model.predictions.find((p) => p.condition === condition) ?? model.predictions[0];
  const valley = r.identifiability.valley;
  const otherFree = r.parameters.find((p) => p.name !== valley?.parameter)?.name ?? null;
  const slug = `${fit.name}-${model.label}`.toLowerCase().replace(/[^a-z0-9]+/g, "-");

  // Every exported figure names the fit it came from (its id is the provenance a reader can look up).
  const caption = `Fit ${fit.id} · “${fit.name}” · kinetics ${model.label}`;

  return (
    <FigureCaption.Provider value={caption}>
      <div className="space-y-6" data-testid="model-detail">
        <FitBestPanel model={model} />

        {valley && (
          <Panel title="Equally good solutions">
            <p className="mb-2 text-sm text-ink-soft">
              {valley.parameter} stepped across its range with the other parameters re-optimised at each step: every
              point under the dashed line explains the data as well as the best fit.
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
          <FitResidualsPanel model={model} conditions={conditions} slug={slug} />
          <FitConditionPanel
            conditions={conditions}
            condition={condition}
            setCondition={setCondition}
            pred={pred}
            slug={slug}
          />
        </div>

        <FitMapPanel labId={labId} model={model} condition={condition} slug={slug} />
      </div>
    </FigureCaption.Provider>
  );
}
