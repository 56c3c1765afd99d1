"use client";
import Link from "next/link";
import useSWR from "swr";
import { useState } from "react";
import { OrientationRose } from "@/components/charts/orientation-rose";
import { FieldImage } from "@/components/charts/field-image";
import { RunGradientProfile } from "@/components/charts/run-gradient-profile";
import { RunScrubber } from "@/components/charts/run-scrubber";
import { RunWavelengthBars } from "@/components/charts/run-wavelength-bars";
import { SpectrumPlot } from "@/components/charts/spectrum-plot";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import type { SpectrumProducts } from "@/lib/server/readouts/result";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig, STATUS_TONE, STATUS_WORDS } from "../../readouts/readout-format";
import { STOP_WORDS, withUnit } from "../run-format";
import { RunProvenance } from "./run-provenance";

const active = (s: string) => s === "queued" || s === "running";
const SYMMETRY_WORDS: Record<string, string> = {
  stripes: "stripes",
  hexagonal: "spots on a hexagonal lattice",
  labyrinth: "labyrinth or disordered",
};

/** The new-run form prefilled with this run's kinetics, parameters and grid, starting from its final fields. */
function continueHref(labId: string, r: RunDetailDto): string {
  const q = new URLSearchParams({ from: r.id, kinetics: r.kinetics.ref });
  if (r.kinetics.version) q.set("version", String(r.kinetics.version));
  for (const [k, v] of Object.entries(r.spec.parameters)) q.set(`p.${k}`, String(v));
  if (r.spec.scales?.lengthScaleUm) q.set("lengthScaleUm", String(r.spec.scales.lengthScaleUm));
  if (r.spec.scales?.timeScaleS) q.set("timeScaleS", String(r.spec.scales.timeScaleS));
  return `/labs/${labId}/runs/new?${q.toString()}`;
}

export function RunView({ labId, initial, canStart }: { labId: string; initial: RunDetailDto; canStart: boolean }) {
  const url = `/api/v1/labs/${labId}/runs/${initial.id}`;
  const { data, mutate } = useSWR<RunDetailDto>(url, fetchJson, {
    fallbackData: initial,
    refreshInterval: (d) => (active((d ?? initial).status) ? 700 : 0),
  });
  const r = data ?? initial;
  const [cancelError, setCancelError] = useState<string | null>(null);
  const res = r.result,
    plan = r.plan;
  const { data: spectrum } = useSWR<SpectrumProducts>(r.files["spectrum.json"] ?? null, fetchJson);
  const lf = plan.lengthFactor ?? 1,
    unit = plan.lengthUnit,
    tf = plan.timeFactor ?? 1;
  const oneD = r.spec.grid.cells.length === 1;
  const w = res?.readout?.wavelength;
  async function cancel() {
    try {
      await sendJson("POST", `${url}/cancel`);
      await mutate();
    } catch (err) {
      setCancelError(err instanceof ApiError ? err.message : String(err));
    }
  }
  return (
    <div className="space-y-5" data-testid="run-view">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <Badge tone={res?.stopReason === "blow-up" ? "brick" : STATUS_TONE[r.status]}>
          <span data-testid="run-status">
            {r.status === "succeeded" && res ? STOP_WORDS[res.stopReason] : STATUS_WORDS[r.status]}
          </span>
        </Badge>
        <span className="text-ink-soft">
          Seed{" "}
          <span className="num text-ink" data-testid="run-seed">
            {r.seed}
          </span>
        </span>
        <span className="text-ink-soft">
          Step{" "}
          <span className="num text-ink">
            {formatSig(plan.dtS * tf, 4)} {plan.timeUnit}
          </span>{" "}
          × <span className="num text-ink">{plan.steps}</span> steps
        </span>
        {r.status === "succeeded" && canStart && (
          <Link className="ml-auto text-moss hover:underline" href={continueHref(labId, r)} data-testid="continue-run">
            Start a run from this pattern →
          </Link>
        )}
      </div>
      {plan.warnings.map((x) => (
        <Notice key={x} tone="warning">
          {x}
        </Notice>
      ))}
      {active(r.status) && (
        <Panel
          title="Simulating…"
          actions={
            r.canCancel ? (
              <Button variant="secondary" size="sm" onClick={cancel} data-testid="cancel-run">
                Cancel
              </Button>
            ) : null
          }
        >
          <div
            className="h-2 w-full max-w-md overflow-hidden rounded bg-paper-deep"
            role="progressbar"
            aria-valuenow={Math.round(r.progress * 100)}
            aria-valuemin={0}
            aria-valuemax={100}
          >
            <div className="h-full bg-moss transition-all" style={{ width: `${Math.round(r.progress * 100)}%` }} />
          </div>
          <p className="mt-2 text-sm text-ink-soft" data-testid="run-progress">
            <span className="num">{Math.round(r.progress * 100)} %</span>
            {r.progressNote
              ? ` · ${r.progressNote}`
              : r.status === "queued"
                ? " · waiting for earlier jobs"
                : " · starting the solver"}
          </p>
          <p className="mt-1 text-xs text-ink-soft">
            Estimated solver time <span className="num">{formatSig(plan.estimatedCpuS, 2)} s</span> for{" "}
            <span className="num">{plan.workCellSteps.toLocaleString("en")}</span> cell-species-steps, plus a few
            seconds to start.
          </p>
          {cancelError && <Notice tone="error">{cancelError}</Notice>}
        </Panel>
      )}
      {(r.status === "failed" || r.status === "cancelled") && (
        <Notice tone="error" testId="run-error">
          This run {r.status === "failed" ? "failed" : "was cancelled"}: {r.error ?? "no reason was recorded"}. Nothing
          was stored; start a new run.
        </Notice>
      )}
      {res?.stopReason === "blow-up" && (
        <Notice tone="error" testId="run-blow-up">
          {res.message} The images and numbers below show that last good state.
        </Notice>
      )}
      {res && (
        <>
          <Panel title="Simulated pattern against linear theory">
            <p className="mb-3 text-base" data-testid="comparison-sentence">
              {res.comparison?.sentence ??
                res.readoutSkipped ??
                "There is no linear prediction to compare with (see the warning above)."}
            </p>
            {plan.fromFit && (
              <div className="mb-3 text-sm" data-testid="fit-comparison">
                <p className="text-base">
                  {res.measurementComparison?.sentence ??
                    "The fit's measurement is in µm; this run has no length scale, so the two cannot be compared."}
                </p>
                <p className="mt-1 text-ink-soft">
                  From the fit{" "}
                  <Link className="text-moss hover:underline" href={`/labs/${labId}/fits/${plan.fromFit.fitId}`}>
                    {plan.fromFit.fitName}
                  </Link>{" "}
                  ({plan.fromFit.model}), condition “{plan.fromFit.condition}”: measured{" "}
                  <span className="num text-moss">
                    {withUnit(plan.fromFit.measuredMeanUm, "µm", plan.fromFit.measuredSeUm)}
                  </span>{" "}
                  (n = <span className="num">{plan.fromFit.n}</span>)
                  {plan.fromFit.readouts.length > 0 && (
                    <>
                      {" "}
                      from{" "}
                      {plan.fromFit.readouts.map((x, i) => (
                        <span key={x.readoutId}>
                          {i > 0 ? ", " : " "}
                          <Link className="text-moss hover:underline" href={`/labs/${labId}/readouts/${x.readoutId}`}>
                            {x.filename ?? "readout"}
                          </Link>
                        </span>
                      ))}
                    </>
                  )}
                </p>
              </div>
            )}
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
                  plan.fromFit && unit === "µm"
                    ? { value: plan.fromFit.measuredMeanUm, se: plan.fromFit.measuredSeUm }
                    : null
                }
                unit={unit}
              />
            </div>
            <p className="mt-3 text-xs text-ink-soft">
              Research use: a simulation of a model is a hypothesis to be tested against tissue, not a measurement.
            </p>
          </Panel>
          <Panel title="Snapshots">
            <RunScrubber
              snapshots={res.snapshots}
              species={plan.species}
              imageUrl={(i, s) => r.files[`snapshot-${i}-${s}.png`]}
              width={r.spec.grid.lengthUm[0] * lf}
              lengthUnit={unit}
              timeFactor={tf}
              timeUnit={plan.timeUnit}
              oneDimensional={oneD}
            />
          </Panel>
          <Panel title={`Final fields at t = ${formatSig(res.timeS * tf, 4)} ${plan.timeUnit}`}>
            <div className="grid gap-4 md:grid-cols-2">
              {plan.species.map(
                (s, i) =>
                  r.files[`final-${i}.png`] && (
                    <FieldImage
                      key={s}
                      src={r.files[`final-${i}.png`]}
                      alt={`final ${s}`}
                      width={r.spec.grid.lengthUm[0] * lf}
                      unit={unit}
                      min={res.fields[i].min}
                      max={res.fields[i].max}
                      species={s}
                      oneDimensional={oneD}
                      testId={`final-${i}`}
                    />
                  ),
              )}
            </div>
          </Panel>
          {res.readout && w && (
            <>
              <Panel title="Radially averaged power spectrum of the final pattern">
                {spectrum ? (
                  <SpectrumPlot
                    {...spectrum.radialSpectrum}
                    frequencyPerUm={spectrum.radialSpectrum.frequencyPerUm.map((f) => f / lf)}
                    lowCutPerUm={spectrum.radialSpectrum.lowCutPerUm / lf}
                    wavelengthUm={w.wavelengthUm !== null ? w.wavelengthUm * lf : null}
                    uncertaintyUm={w.uncertaintyUm !== null ? w.uncertaintyUm * lf : null}
                  />
                ) : (
                  <p className="text-sm text-ink-soft">Loading the spectrum…</p>
                )}
                {!plan.lengthFactor && (
                  <p className="mt-1 text-xs text-ink-soft" data-testid="model-units-note">
                    This kinetics is non-dimensional and the run has no length scale ℓ: read “µm” on this plot as “model
                    length” (frequencies in cycles per model length). Give ℓ in the run form for µm.
                  </p>
                )}
              </Panel>
              <div className="grid gap-5 lg:grid-cols-[auto_1fr]">
                <Panel title="Orientation">
                  {spectrum ? (
                    <OrientationRose
                      angularPower={spectrum.angularPower}
                      orientationDeg={w.orientationDeg}
                      anisotropy={w.anisotropy}
                    />
                  ) : (
                    <p className="text-sm text-ink-soft">Loading…</p>
                  )}
                </Panel>
                <Panel title="Local wavelength along x">
                  {!spectrum ? (
                    <p className="text-sm text-ink-soft">Loading…</p>
                  ) : (
                    <RunGradientProfile
                      measured={{
                        positions: spectrum.localWavelength.profile.positionUm.map((x) => x * lf),
                        wavelengths: spectrum.localWavelength.profile.wavelengthUm.map((v) =>
                          v === null ? null : v * lf,
                        ),
                        sd: spectrum.localWavelength.profile.sdUm.map((v) => (v === null ? null : v * lf)),
                      }}
                      predicted={
                        plan.gradientPrediction
                          ? {
                              positions: plan.gradientPrediction.positions.map((x) => x * lf),
                              wavelengths: plan.gradientPrediction.wavelengths.map((v) => (v === null ? null : v * lf)),
                            }
                          : {
                              positions: [0, r.spec.grid.lengthUm[0] * lf],
                              wavelengths: plan.prediction
                                ? [plan.prediction.wavelength * lf, plan.prediction.wavelength * lf]
                                : [null, null],
                            }
                      }
                      parameter={plan.gradientPrediction?.parameter ?? null}
                      unit={unit}
                    />
                  )}
                  <p className="mt-1 text-xs text-ink-soft">
                    Tiles of{" "}
                    <span className="num">
                      {formatSig(
                        spectrum ? spectrum.localWavelength.tileSizePx * res.readout.pixelSizeUm * lf : null,
                        3,
                      )}{" "}
                      {unit}
                    </span>
                    , half overlapping.
                  </p>
                </Panel>
              </div>
            </>
          )}
        </>
      )}
      <RunProvenance r={r} labId={labId} />
    </div>
  );
}
