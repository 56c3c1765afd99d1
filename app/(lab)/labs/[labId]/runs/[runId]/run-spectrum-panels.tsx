"use client";
/** The final pattern's spectrum, orientation and local wavelength along x, in the run's length unit. */
import { OrientationRose } from "@/components/charts/orientation-rose";
import { RunGradientProfile } from "@/components/charts/run-gradient-profile";
import { SpectrumPlot } from "@/components/charts/spectrum-plot";
import { Panel } from "@/components/ui/panel";
import type { ImageReadoutResult, SpectrumProducts } from "@/lib/server/readouts/result";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig } from "../../readouts/readout-format";

export function RunSpectrumPanels({
  r,
  readout,
  spectrum,
}: {
  r: RunDetailDto;
  readout: ImageReadoutResult;
  spectrum: SpectrumProducts | undefined;
}) {
  const plan = r.plan;
  const lf = plan.lengthFactor ?? 1,
    unit = plan.lengthUnit;
  const w = readout.wavelength;
  return (
    <>
      <Panel title="Radially averaged power spectrum of the final pattern">
        {spectrum ? (
          <SpectrumPlot
            {...spectrum.radialSpectrum}
            frequencyPerUm={spectrum.radialSpectrum.frequencyPerUm.map((f) => f / lf)}
            lowCutPerUm={spectrum.radialSpectrum.lowCutPerUm / lf}
            wavelengthUm={w.wavelengthUm !== null ? w.wavelengthUm * lf : null}
            uncertaintyUm={w.uncertaintyUm !== null ? w.uncertaintyUm * lf : null}
            lengthUnit={unit}
          />
        ) : (
          <p className="text-sm text-ink-soft">Loading the spectrum…</p>
        )}
        {!plan.lengthFactor && (
          <p className="mt-1 text-xs text-ink-soft" data-testid="model-units-note">
            This kinetics is non-dimensional and the run has no length scale ℓ: lengths are in model length (frequencies
            in cycles per model length). Give ℓ in the run form for µm.
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
                wavelengths: spectrum.localWavelength.profile.wavelengthUm.map((v) => (v === null ? null : v * lf)),
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
              {formatSig(spectrum ? spectrum.localWavelength.tileSizePx * readout.pixelSizeUm * lf : null, 3)} {unit}
            </span>
            , half overlapping.
          </p>
        </Panel>
      </div>
    </>
  );
}
