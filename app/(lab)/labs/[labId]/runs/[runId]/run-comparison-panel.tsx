"use client";
/** The run's final pattern read like a tissue image, set against the linear prediction (and a fit's measurement). */
import { RunWavelengthBars } from "@/components/charts/run-wavelength-bars";
import { Panel } from "@/components/ui/panel";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig } from "../../readouts/readout-format";
import { withUnit } from "../run-format";
import { RunFitComparison } from "./run-fit-comparison";

const SYMMETRY_WORDS: Record<string, string> = {
  stripes: "stripes",
  hexagonal: "spots on a hexagonal lattice",
  labyrinth: "labyrinth or disordered",
};

export function RunComparisonPanel({
  labId,
  r,
  res,
}: {
  labId: string;
  r: RunDetailDto;
  res: NonNullable<RunDetailDto["result"]>;
}) {
  const plan = r.plan;
  const lf = plan.lengthFactor ?? 1,
    unit = plan.lengthUnit;
  const w = res.readout?.wavelength;
  return (
    <Panel title="Simulated pattern against linear theory">
      <p className="mb-3 text-base" data-testid="comparison-sentence">
        {res.comparison?.sentence ??
          res.readoutSkipped ??
          "There is no linear prediction to compare with (see the warning above)."}
      </p>
      {plan.fromFit && <RunFitComparison labId={labId} fromFit={plan.fromFit} result={res} />}
      <div className="grid gap-5 lg:grid-cols-2">
        <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
          <dt className="text-ink-soft">
            {w?.symmetry === "hexagonal" ? "Fourier wavelength λ (row spacing)" : "Wavelength λ"}
          </dt>
          <dd className="num font-semibold text-moss" data-testid="run-wavelength">
            {w
              ? withUnit(
                  w.wavelengthUm !== null ? w.wavelengthUm * lf : null,
                  unit,
                  w.uncertaintyUm !== null ? w.uncertaintyUm * lf : null,
                )
              : "—"}
          </dd>
          {w?.symmetry === "hexagonal" && (
            <>
              <dt className="text-ink-soft">Nearest-neighbour spacing a = (2/√3)·λ</dt>
              <dd className="num">
                {withUnit(w.nearestNeighbourUm !== null ? w.nearestNeighbourUm * lf : null, unit)}
              </dd>
            </>
          )}
          <dt className="text-ink-soft">Linear prediction 2π/k*</dt>
          <dd className="num text-iris" data-testid="run-predicted">
            {plan.prediction ? withUnit(plan.prediction.wavelength * lf, unit) : "—"}
          </dd>
          {plan.prediction?.domainMode && (
            <>
              <dt className="text-ink-soft">Fastest mode of this box</dt>
              <dd className="num text-iris">
                {withUnit(plan.prediction.domainMode.wavelength * lf, unit)}{" "}
                <span className="text-xs text-ink-soft">
                  (m, n) = ({plan.prediction.domainMode.indices.join(", ")})
                </span>
              </dd>
            </>
          )}
          <dt className="text-ink-soft">Symmetry</dt>
          <dd>
            {w?.symmetry ? SYMMETRY_WORDS[w.symmetry] : "—"}
            {w && (
              <span className="num ml-2 text-xs text-ink-soft">
                h₂ = {formatSig(w.symmetryScores.h2, 3)}, h₆ = {formatSig(w.symmetryScores.h6, 3)}
              </span>
            )}
          </dd>
          <dt className="text-ink-soft">Orientation θ (wave vector)</dt>
          <dd className="num">{w?.orientationDeg != null ? `${formatSig(w.orientationDeg, 3)}°` : "—"}</dd>
          <dt className="text-ink-soft">Significance (peak ÷ background)</dt>
          <dd className="num">{w ? `${formatSig(w.significance, 3)}×` : "—"}</dd>
          <dt className="text-ink-soft">Read species</dt>
          <dd className="num">
            {plan.species[0]} (final field, cell size{" "}
            {withUnit((r.spec.grid.lengthUm[0] / r.spec.grid.cells[0]) * lf, unit)})
          </dd>
        </dl>
        <RunWavelengthBars
          simulated={w?.wavelengthUm != null ? w.wavelengthUm * lf : null}
          uncertainty={w?.uncertaintyUm != null ? w.uncertaintyUm * lf : null}
          predicted={plan.prediction ? plan.prediction.wavelength * lf : null}
          domainMode={plan.prediction?.domainMode ? plan.prediction.domainMode.wavelength * lf : null}
          measured={
            plan.fromFit && unit === "µm" ? { value: plan.fromFit.measuredMeanUm, se: plan.fromFit.measuredSeUm } : null
          }
          unit={unit}
        />
      </div>
      <p className="mt-3 text-xs text-ink-soft">
        Research use: a simulation of a model is a hypothesis to be tested against tissue, not a measurement.
      </p>
    </Panel>
  );
}
