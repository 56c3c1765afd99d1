import type { GreyImage } from "../imaging/grey-image";
import { analyseSpectrum } from "./analyse-spectrum";
import { computeAutocorrelationCheck } from "./autocorrelation";
import { evaluatePowerLaw } from "./background-fit";
import { applyMaskTaper } from "./mask-taper";
import { resolveReadoutOptions, type ReadoutOptions } from "./options";
import { computePowerSpectrum } from "./power-spectrum";
import { prepareRegion, type PreparedRegion } from "./prepare-region";
import type { WavelengthReadout } from "./result";
import type { SpectrumAnalysis } from "./analyse-spectrum";
import { combineWavelengthUncertainty } from "./uncertainty";
import { isSpotPacking, measureRegionSpotOrder } from "./spot-order";
import { measureWavelengthDrift, type WavelengthDrift } from "./wavelength-drift";
import { formatPlain } from "../format/measurement";
import { describeRegion } from "./describe-region";
import { outlineMask } from "./outline-mask";
import { measureSubregionSpread } from "./subregion-uncertainty";

/** A peak counts only with at least this many periods across the analysed region (SCIENCE.md §5, step 5). */
export const MIN_PERIODS_ACROSS = 4;

/**
 * The lowest ring searched for the peak: MIN_PERIODS_ACROSS periods across the region's shorter
 * side, or across a tissue mask (the side of a square of its area). Lower rings still enter the
 * background fit (from `lowCutCycles`).
 */
function searchFromRing(ringN: number, region: PreparedRegion, includedCount: number): number {
  let extentPx = Math.min(region.width, region.height);
  if (region.tissueMask && region.included) extentPx = Math.min(extentPx, Math.sqrt(includedCount));
  return (MIN_PERIODS_ACROSS * ringN) / extentPx;
}

/**
 * Reads the dominant wavelength of a grey image (SCIENCE.md §5): ROI → flatten → mean → window →
 * zero-padded 2-D FFT → radial spectrum → peak (2-D refined) → significance, uncertainty,
 * orientation, symmetry, autocorrelation cross-check.
 * @throws ReadoutError with code too_large, missing_pixel_size, zero_area_roi, too_small, no_variation, bad_option
 */
export function readWavelength(image: GreyImage, options: ReadoutOptions): WavelengthReadout {
  const settings = resolveReadoutOptions(options, image.width, image.height);
  // Nothing of the region or its spectrum outlives this call: their large arrays may be reused ones.
  const region = prepareRegion(image, settings, true);
  // Pixels inside the mask, counted once (the peak search and the uncertainty both use it).
  const includedCount = countIncluded(region.included, region.width * region.height);
  // The flattened region stays unwindowed for the sub-regions and the spot search: the separable
  // window is applied on the fly by the FFT; inside a tissue mask a copy tapers at the tissue's edge.
  const flattened = region.data;
  let spec;
  const tapered = !!(region.tissueMask && region.included && settings.window !== "none");
  if (tapered) {
    const copy = region.data.slice();
    applyMaskTaper(copy, region.width, region.height, region.included!);
    spec = computePowerSpectrum(copy, region.width, region.height, { ...settings, window: "none" });
  } else spec = computePowerSpectrum(region.data, region.width, region.height, { ...settings, reusePower: true });
  const a = analyseSpectrum(spec, settings.lowCutCycles, [searchFromRing(spec.ringN, region, includedCount), Infinity]);
  const px = region.pixelSizeUm; // µm per analysed pixel
  const periodFound = a.significance >= settings.significanceThreshold;
  const warnings: string[] = [];
  if (region.binFactor > 1)
    warnings.push(
      `The region was binned ${region.binFactor}×${region.binFactor} to fit the ${settings.maxAnalysisSidePx} px analysis limit.`,
    );
  warnings.push(...describeRegion(region));
  const lambdaPx = 1 / a.frequencyPerPx; // analysed grid
  const halfWidthPx = (lambdaPx * a.halfWidthRings) / a.refinedRing; // Δλ = λ·Δf/f
  let semPx: number | null = null,
    subregionCount = 0,
    drift: WavelengthDrift | null = null;
  if (periodFound && settings.subregions) {
    const spread = measureSubregionSpread({ ...region, data: flattened }, settings, a.frequencyPerPx);
    semPx = spread.semPx;
    subregionCount = spread.wavelengthsPx.length;
    drift = measureWavelengthDrift(
      spread.wavelengthsPx.map((wavelengthPx, i) => ({
        xPx: spread.centresPx[i][0],
        yPx: spread.centresPx[i][1],
        wavelengthPx,
      })),
      region.width,
      region.height,
    );
    if (drift?.flagged)
      warnings.push(
        `The wavelength changes across the field from ${formatPlain(drift.fromPx * region.pixelSizeUm, 3)} to ${formatPlain(drift.toPx * region.pixelSizeUm, 3)} µm; the value above is an average over the field — see the local profile.`,
      );
    if (semPx === null)
      warnings.push(
        `Too few usable sub-regions (${subregionCount} of 9) to measure the spread across the field; the uncertainty holds only the peak's localisation.`,
      );
  }
  const u = combineWavelengthUncertainty({
    wavelengthPx: lambdaPx,
    binPerPx: peakBinPerPx(a, spec.padWidth, spec.padHeight),
    subregionSemPx: semPx,
    excludedFraction: 1 - includedCount / (region.width * region.height),
    maskTapered: tapered,
    peakSnr: a.peak2d ? a.peak2d.power / evaluatePowerLaw(a.background, a.frequencyPerPx) : 1,
  });
  const uncertaintyPx = u.uncertaintyPx;
  if (periodFound && lambdaPx * settings.lowCutCycles * 2 > Math.min(region.width, region.height)) {
    warnings.push("Fewer than 4 periods fit across the region; the wavelength is poorly constrained.");
  }
  let autocorrelation: WavelengthReadout["autocorrelation"] = null;
  if (periodFound && settings.autocorrelation) {
    const ac = computeAutocorrelationCheck(
      spec,
      a.frequencyPerPx,
      a.symmetry,
      a.angular.orientationDeg,
      a.angular.orientation6Deg,
    );
    if (ac) {
      const tol = 3 * Math.hypot(uncertaintyPx, ac.lagStepPx / 2, 0.01 * lambdaPx);
      const agrees = Math.abs(ac.impliedWavelengthPx - lambdaPx) <= tol;
      autocorrelation = {
        firstMaximumUm: ac.firstMaximumPx * px,
        impliedWavelengthUm: ac.impliedWavelengthPx * px,
        direction: ac.direction,
        agrees,
      };
      if (!agrees)
        warnings.push(
          `The autocorrelation implies λ = ${(ac.impliedWavelengthPx * px).toPrecision(4)} µm, beyond the uncertainty of the spectral ${(lambdaPx * px).toPrecision(4)} µm.`,
        );
    } else warnings.push("The autocorrelation has no clear first maximum; cross-check skipped.");
  }
  if (!periodFound)
    warnings.push(
      `No significant period: the peak is ${formatPlain(a.significance, 3)}× the background, below the threshold ${settings.significanceThreshold}.`,
    );
  // Disordered hexagonal packings have a nearly uniform Fourier ring: look at the spots themselves.
  const spots =
    periodFound && a.symmetry === "labyrinth"
      ? measureRegionSpotOrder(flattened, region.width, region.height, lambdaPx, region.included)
      : null;
  const fromSpots = isSpotPacking(spots);
  const symmetry = fromSpots ? "hexagonal" : a.symmetry;
  const hex = periodFound && symmetry === "hexagonal";
  const nn = 2 / Math.sqrt(3);
  const nnUm = fromSpots ? spots!.nearestNeighbourMeanPx * px : nn * lambdaPx * px;
  const nnUncertaintyUm = fromSpots
    ? (spots!.nearestNeighbourSdPx / Math.sqrt(spots!.interiorCount)) * px
    : nn * uncertaintyPx * px;
  const { excludeMask, ...rest } = settings;
  return {
    periodFound,
    wavelengthUm: periodFound ? lambdaPx * px : null,
    wavelengthPx: periodFound ? lambdaPx * region.binFactor : null,
    uncertaintyUm: periodFound ? uncertaintyPx * px : null,
    uncertaintyPx: periodFound ? uncertaintyPx * region.binFactor : null,
    uncertaintyMethod: periodFound ? "combined" : null,
    expandedUncertainty95Um: periodFound ? u.expanded95Px * px : null,
    uncertaintyComponentsUm: periodFound
      ? {
          subregion: u.subregionPx * px,
          localisation: u.localisationPx * px,
          resolution: u.resolutionPx * px,
          mask: u.maskPx * px,
        }
      : null,
    subregionSemUm: semPx !== null ? semPx * px : null,
    subregionCount,
    halfWidthUm: periodFound ? halfWidthPx * px : null,
    significance: a.significance,
    significanceThreshold: settings.significanceThreshold,
    orientationDeg: periodFound && !fromSpots ? (hex ? a.angular.orientation6Deg : a.angular.orientationDeg) : null,
    anisotropy: a.angular.h2,
    symmetry: periodFound ? symmetry : null,
    symmetrySource: periodFound ? (fromSpots ? "spots" : "fourier") : null,
    spotOrder: spots
      ? {
          count: spots.count,
          psi6Local: spots.psi6Local,
          psi6Global: spots.psi6Global,
          roundness: spots.roundness,
          nearestNeighbourMeanUm: spots.nearestNeighbourMeanPx * px,
          nearestNeighbourSdUm: spots.nearestNeighbourSdPx * px,
          polarity: spots.polarity,
        }
      : null,
    wavelengthDrift: drift ? { fromUm: drift.fromPx * px, toUm: drift.toPx * px, flagged: drift.flagged } : null,
    symmetryScores: { h2: a.angular.h2, h4: a.angular.h4, h6: a.angular.h6 },
    nearestNeighbourUm: hex ? nnUm : null,
    nearestNeighbourUncertaintyUm: hex ? nnUncertaintyUm : null,
    autocorrelation,
    radialSpectrum: {
      frequencyPerUm: Array.from(a.radial.frequencyPerPx, (f) => f / px),
      power: Array.from(a.radial.power),
      background: Array.from(a.radial.frequencyPerPx, (f) => (f > 0 ? evaluatePowerLaw(a.background, f) : 0)),
      lowCutPerUm: settings.lowCutCycles / spec.ringN / px,
    },
    angularPower: Array.from(a.angular.angularPower),
    settings: {
      ...rest,
      excludeMaskPixels: excludeMask ? excludeMask.reduce((s, v) => s + (v ? 1 : 0), 0) : 0,
      analysedWidthPx: region.width,
      analysedHeightPx: region.height,
      binFactor: region.binFactor,
      paddedWidthPx: spec.padWidth,
      paddedHeightPx: spec.padHeight,
    },
    tissueRegion: {
      found: region.tissueMask !== null,
      fraction: region.tissueFraction,
      outline: region.tissueMask ? outlineMask(region.tissueMask, region) : null,
    },
    treatedPixels: {
      saturated: region.treatedSaturatedPx,
      bright: region.treatedBrightPx,
      dark: region.treatedDarkPx,
      total: region.treatedSaturatedPx + region.treatedBrightPx + region.treatedDarkPx,
    },
    warnings,
  };
}

/** The padded spectrum's frequency step along the peak's direction (cycles/px). */
function peakBinPerPx(a: SpectrumAnalysis, padWidth: number, padHeight: number): number {
  const p = a.peak2d;
  const f = p ? Math.hypot(p.fx, p.fy) : 0;
  if (!p || !(f > 0)) return 1 / Math.sqrt(padWidth * padHeight);
  return Math.hypot(p.fx / f / padWidth, p.fy / f / padHeight);
}

/** Pixels inside the mask (all of them without one). */
function countIncluded(included: Uint8Array | null, all: number): number {
  if (!included) return all;
  let n = 0;
  for (let i = 0; i < included.length; i++) n += included[i] ? 1 : 0;
  return n;
}
