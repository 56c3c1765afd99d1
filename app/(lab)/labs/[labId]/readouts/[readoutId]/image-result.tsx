"use client";
import useSWR from "swr";
import { OrientationRose } from "@/components/charts/orientation-rose";
import { SpectrumPlot } from "@/components/charts/spectrum-plot";
import { WavelengthProfile } from "@/components/charts/wavelength-profile";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { RoiEditor } from "@/components/ui/roi-editor";
import { fetchJson } from "@/lib/client/api";
import type { RoiInput } from "@/lib/contracts/readout";
import type { ReadoutDetailDto } from "@/lib/server/readouts/readouts";
import type { ImageReadoutResult, SpectrumProducts } from "@/lib/server/readouts/result";
import { formatSig, pixelSizeLabel, plusMinus } from "../readout-format";
import { describeStackUsed } from "./stack-fields";
import { TissueOutline } from "./tissue-outline";

const METHOD_WORDS = {
  combined: (n: number) =>
    n >= 3
      ? `combined standard uncertainty (k = 1): spread over ${n} sub-regions, peak localisation in noise, interpolation`
      : "combined standard uncertainty (k = 1): peak localisation in noise and interpolation (too few sub-regions for a spread)",
  "subregion-sem": (n: number) => `spread over ${n} overlapping sub-regions (SD/√n)`,
  "peak-half-width": () => "half width at half maximum of the spectral peak (Δλ = λ·Δf/f)",
} as const;

const SYMMETRY_WORDS = {
  stripes: "stripes",
  hexagonal: "spots on a hexagonal lattice",
  labyrinth: "labyrinth or disordered",
} as const;

function Row({ label, children, testId }: { label: string; children: React.ReactNode; testId?: string }) {
  return (
    <>
      <dt className="text-ink-soft">{label}</dt>
      <dd data-testid={testId}>{children}</dd>
    </>
  );
}

export function ImageResult({ readout, result }: { readout: ReadoutDetailDto; result: ImageReadoutResult }) {
  const w = result.wavelength;
  const { data: spectrum } = useSWR<SpectrumProducts>(readout.derived["spectrum.json"] ?? null, fetchJson);
  const roi = readout.settings.kind === "image" ? (readout.settings.roi as RoiInput | null) : null;
  const hex = w.symmetry === "hexagonal";
  // Readouts stored before the tissue search have neither field.
  const tissue = w.tissueRegion ?? null;
  const treated = w.treatedPixels ?? null;
  const tissueOutline: RoiInput | null = tissue?.outline ? { kind: "polygon", points: tissue.outline } : null;
  return (
    <div className="space-y-5">
      <Panel title="Numbers">
        {!w.periodFound && (
          <div className="mb-3">
            <Notice tone="warning" testId="no-period">
              No significant period: the strongest ring is only{" "}
              <span className="num">{formatSig(w.significance, 3)}×</span> the background, below the threshold of{" "}
              <span className="num">{formatSig(w.significanceThreshold, 3)}×</span>. No wavelength is reported.
            </Notice>
          </div>
        )}
        <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1.5 text-sm">
          <Row label={hex ? "Fourier wavelength λ (row spacing)" : "Wavelength λ"} testId="readout-wavelength">
            <span className="num text-base font-semibold text-moss">
              {plusMinus(w.wavelengthUm, w.uncertaintyUm, "µm")}
            </span>
            <span className="num ml-3 text-ink-soft">{plusMinus(w.wavelengthPx, w.uncertaintyPx, "px")}</span>
          </Row>
          {hex && (
            <Row
              label={
                w.symmetrySource === "spots"
                  ? "Nearest-neighbour spacing (mean over spots found)"
                  : "Nearest-neighbour spacing a = (2/√3)·λ"
              }
              testId="readout-nn"
            >
              <span className="num font-semibold">
                {plusMinus(w.nearestNeighbourUm, w.nearestNeighbourUncertaintyUm, "µm")}
              </span>
              <span className="ml-2 text-xs text-ink-soft">
                distance between neighbouring spots — not the wavelength
              </span>
            </Row>
          )}
          {w.expandedUncertainty95Um != null && w.wavelengthUm !== null && (
            <Row label="95 % interval (λ ± 2u)" testId="readout-interval">
              <span className="num">
                {formatSig(w.wavelengthUm - w.expandedUncertainty95Um, 6)} to{" "}
                {formatSig(w.wavelengthUm + w.expandedUncertainty95Um, 6)} µm
              </span>
            </Row>
          )}
          <Row label="Uncertainty method">
            {w.uncertaintyMethod ? METHOD_WORDS[w.uncertaintyMethod](w.subregionCount) : "—"}
            {w.uncertaintyComponentsUm && (
              <span className="num ml-2 text-xs text-ink-soft">
                (sub-regions {formatSig(w.uncertaintyComponentsUm.subregion, 2)} µm; localisation{" "}
                {formatSig(w.uncertaintyComponentsUm.localisation, 2)} µm; interpolation{" "}
                {formatSig(w.uncertaintyComponentsUm.resolution, 2)} µm
                {w.uncertaintyComponentsUm.mask ? `; mask ${formatSig(w.uncertaintyComponentsUm.mask, 2)} µm` : ""})
              </span>
            )}
            {!w.uncertaintyComponentsUm && w.subregionSemUm !== null && w.halfWidthUm !== null && (
              <span className="num ml-2 text-xs text-ink-soft">
                (sub-regions {formatSig(w.subregionSemUm, 2)} µm; peak half-width {formatSig(w.halfWidthUm, 2)} µm)
              </span>
            )}
          </Row>
          <Row label="Significance (peak ÷ background)" testId="readout-significance">
            <span className="num">{formatSig(w.significance, 3)}×</span>{" "}
            <span className="text-ink-soft">
              (threshold <span className="num">{formatSig(w.significanceThreshold, 3)}×</span>) —{" "}
              {w.periodFound ? "period found" : "no significant period"}
            </span>
          </Row>
          <Row label="Orientation θ (wave vector)">
            <span className="num">{w.orientationDeg === null ? "—" : `${formatSig(w.orientationDeg, 3)}°`}</span>{" "}
            <span className="text-xs text-ink-soft">
              from +x towards +y (rows down)
              {hex ? "; one of three lattice directions, [0°, 60°)" : "; stripes run perpendicular to it"}
            </span>
          </Row>
          <Row label="Anisotropy">
            <span className="num">{formatSig(w.anisotropy, 3)}</span>{" "}
            <span className="text-xs text-ink-soft">0 isotropic … 1 one direction</span>
          </Row>
          <Row label="Symmetry" testId="readout-symmetry">
            {w.symmetry ? SYMMETRY_WORDS[w.symmetry] : "—"}
            {w.symmetrySource === "spots" && w.spotOrder && (
              <span className="text-ink-soft">
                {" "}
                in a disordered packing, found from the spots themselves (bond order |ψ₆| ={" "}
                <span className="num">{formatSig(w.spotOrder.psi6Local, 2)}</span>,{" "}
                <span className="num">{w.spotOrder.count}</span> spots)
              </span>
            )}{" "}
            <span className="num text-xs text-ink-soft">
              h₂ = {formatSig(w.symmetryScores.h2, 3)}, h₄ = {formatSig(w.symmetryScores.h4, 3)}, h₆ ={" "}
              {formatSig(w.symmetryScores.h6, 3)}
            </span>
            <span className="text-xs text-ink-soft">
              {" "}
              (stripes if h₂ ≥ 0.5, else hexagonal if h₆ ≥ 0.4, else labyrinth)
            </span>
          </Row>
          <Row label="Autocorrelation cross-check" testId="readout-autocorrelation">
            {w.autocorrelation ? (
              <>
                first maximum at <span className="num">{formatSig(w.autocorrelation.firstMaximumUm, 4)} µm</span> (
                {w.autocorrelation.direction}) → λ ≈{" "}
                <span className="num">{formatSig(w.autocorrelation.impliedWavelengthUm, 4)} µm</span>{" "}
                {w.autocorrelation.agrees ? (
                  <span className="text-moss">agrees with the spectrum</span>
                ) : (
                  <span className="font-medium text-ochre">
                    disagrees with the spectrum — check the pattern and the ROI
                  </span>
                )}
              </>
            ) : (
              "not available"
            )}
          </Row>
          <Row label="Pixel size">
            <span className="num">{pixelSizeLabel(result.pixelSizeUm, result.pixelSizeSource)}</span>
          </Row>
          <Row label="Analysed region">
            <span className="num">
              {w.settings.analysedWidthPx}×{w.settings.analysedHeightPx} px
              {w.settings.binFactor > 1 ? ` after ${w.settings.binFactor}× binning` : ""}, padded to{" "}
              {w.settings.paddedWidthPx}×{w.settings.paddedHeightPx}
            </span>{" "}
            <span className="text-xs text-ink-soft">
              of a {result.image.width}×{result.image.height} px {result.image.format.toUpperCase()} (
              {result.image.bitDepth}-bit, channel {String(result.image.channelUsed)}
              {describeStackUsed(result.image)})
            </span>
          </Row>
          <Row label="Region analysed" testId="readout-tissue-region">
            {tissue?.found ? (
              <>
                the tissue found automatically: <span className="num">{formatSig(100 * tissue.fraction, 3)} %</span> of
                the {roi ? "region of interest" : "image"}{" "}
                <span className="text-xs text-ink-soft">
                  (green dashed outline on the preview; the rest looks like slide or mounting medium)
                </span>
              </>
            ) : (
              <>the whole {roi ? "region of interest" : "image"}</>
            )}
          </Row>
          <Row label="Pixels treated" testId="readout-treated-pixels">
            {treated && treated.total > 0 ? (
              <>
                <span className="num">{treated.total.toLocaleString("en-GB")}</span> replaced by the surrounding
                intensity{" "}
                <span className="text-xs text-ink-soft">
                  (<span className="num">{treated.saturated.toLocaleString("en-GB")}</span> saturated or clipped,{" "}
                  <span className="num">{treated.bright.toLocaleString("en-GB")}</span> bright debris
                  {/* Readouts stored before dark debris was treated have no count for it. */}
                  {treated.dark ? (
                    <>
                      , <span className="num">{treated.dark.toLocaleString("en-GB")}</span> dark debris
                    </>
                  ) : null}
                  , each with its rim)
                </span>
              </>
            ) : (
              "none"
            )}
          </Row>
        </dl>
        {w.warnings.length > 0 && (
          <div className="mt-3 space-y-1">
            {w.warnings.map((x) => (
              <Notice key={x} tone="warning">
                {x}
              </Notice>
            ))}
          </div>
        )}
      </Panel>
      <div className="grid gap-5 lg:grid-cols-2">
        <Panel title="Preview with the region of interest">
          {readout.derived["preview.png"] ? (
            <div className="relative">
              <RoiEditor
                imageUrl={readout.derived["preview.png"]}
                width={result.image.width}
                height={result.image.height}
                value={roi}
                readOnly
                testId="readout-preview"
              />
              {tissueOutline?.kind === "polygon" && (
                <TissueOutline points={tissueOutline.points} width={result.image.width} height={result.image.height} />
              )}
            </div>
          ) : (
            <p className="text-sm text-ink-soft">No preview stored.</p>
          )}
          <p className="mt-1 text-xs text-ink-soft">
            Whole image, contrast stretched; amber outline: the ROI (
            {roi ? "as set" : "none — the whole image was read"})
            {tissueOutline ? "; green dashed outline: the tissue region analysed (correct it below)" : ""}.
          </p>
        </Panel>
        <Panel title="FFT magnitude">
          {readout.derived["fft.png"] && (
            <div className="relative w-full max-w-md">
              {/* eslint-disable-next-line @next/next/no-img-element -- a stored PNG served by the API */}
              <img
                src={readout.derived["fft.png"]}
                alt="log power of the 2-D Fourier transform, zero frequency at the centre"
                className="block h-auto w-full rounded border border-rule"
                data-testid="readout-fft"
                style={{ imageRendering: "pixelated" }}
              />
              {result.fft?.ringFraction != null && w.periodFound && (
                <svg
                  viewBox="-1 -1 2 2"
                  preserveAspectRatio="none"
                  className="pointer-events-none absolute inset-0 h-full w-full"
                  aria-hidden="true"
                  data-testid="readout-fft-ring"
                >
                  <ellipse
                    cx={0}
                    cy={0}
                    rx={result.fft.ringFraction}
                    ry={result.fft.ringFraction}
                    fill="none"
                    stroke="#1f5c45"
                    strokeWidth={1.5}
                    strokeDasharray="4 3"
                    vectorEffect="non-scaling-stroke"
                  />
                </svg>
              )}
            </div>
          )}
          <p className="mt-1 text-xs text-ink-soft">
            log(1 + |F|²) of the analysed region after flattening and window; zero frequency at the centre, six decades
            shown
            {result.fft ? (
              <>
                , frequencies up to <span className="num">± {formatSig(result.fft.maxFrequencyPerUm, 3)}</span>{" "}
                cycles/µm on both axes
              </>
            ) : null}
            .
            {result.fft?.ringFraction != null && w.periodFound
              ? " Dashed green ring: the peak frequency 1/λ."
              : " Bright ring or spots = the dominant period."}
          </p>
        </Panel>
      </div>
      <Panel title="Radially averaged power spectrum">
        {spectrum ? (
          <SpectrumPlot {...spectrum.radialSpectrum} wavelengthUm={w.wavelengthUm} uncertaintyUm={w.uncertaintyUm} />
        ) : (
          <p className="text-sm text-ink-soft">Loading the spectrum…</p>
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
        <Panel title={`Local wavelength along ${spectrum?.localWavelength.profile.axis ?? "x"}`}>
          {spectrum ? (
            <WavelengthProfile
              {...spectrum.localWavelength.profile}
              globalWavelengthUm={w.wavelengthUm}
              tileSizeUm={spectrum.localWavelength.tileSizePx * result.pixelSizeUm}
            />
          ) : (
            <p className="text-sm text-ink-soft">Loading…</p>
          )}
        </Panel>
      </div>
    </div>
  );
}
