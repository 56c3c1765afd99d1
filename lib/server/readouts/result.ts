/**
 * What a finished readout stores in its `result` column, and the headline numbers lists and the
 * condition comparison read from it. Types only plus one pure function, so pages may import them.
 */
import "server-only";
import type { LocalWavelengthMap, WavelengthReadout } from "@/lib/readout";
import type { SpacingTableReadout, TableUnit } from "@/lib/spacing";

export interface ImageReadoutResult {
  type: "image";
  image: {
    width: number;
    height: number;
    channels: number;
    bitDepth: 8 | 16 | 32;
    format: string;
    channelUsed: number | "luminance";
    /** Stack sizes and the plane / time point read (0-based; planeUsed null for a max-z projection); absent on older readouts. */
    planes?: number;
    timePoints?: number;
    planeUsed?: number | null;
    timePointUsed?: number;
    projection?: "none" | "max-z";
    /** EXIF/TIFF orientation applied (1 = as stored). */
    orientation?: number;
    /** Source px per analysed px before the readout's own binning (a large image read reduced). */
    reduceFactor?: number;
  };
  /** µm/px used, and where it came from (file metadata, the uploader, or the readout's settings). */
  pixelSizeUm: number;
  pixelSizeSource: string | null;
  /** All numbers of the wavelength readout; the spectrum arrays live in spectrum.json. */
  wavelength: Omit<WavelengthReadout, "radialSpectrum" | "angularPower">;
  /** Stored preview size (px) and preview px per source px. */
  preview: { width: number; height: number; scale: number };
  /** The Fourier image spans ± maxFrequencyPerUm on both axes; the peak ring at ringFraction of the half-width (absent on readouts made before it was cropped). */
  fft?: { maxFrequencyPerUm: number; ringFraction: number | null };
  computeMs: number;
}

export interface TableReadoutResult {
  type: "table";
  /** The column mapping used; `guessed` when it was read from the header names. */
  mapping: { x?: string; y?: string; position?: string; spacing?: string; unit: TableUnit; guessed: boolean };
  /** The columns taken in words, with their letters: `x = A ("X (µm)"), y = B ("Y (µm)")` (absent on older readouts). */
  columnsTaken?: string;
  /** What was read: a workbook's sheet, or delimited text (absent on older readouts). */
  source?: { kind: "xlsx"; sheet: string } | { kind: "text" };
  /** Decimal mark of text cells ("," for semicolon-separated files with decimal commas). */
  decimalMark?: "." | ",";
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
  table: SpacingTableReadout;
}

export type ReadoutResult = ImageReadoutResult | TableReadoutResult;

/** Contents of spectrum.json: arrays for the plots. */
export interface SpectrumProducts {
  radialSpectrum: WavelengthReadout["radialSpectrum"];
  angularPower: number[];
  localWavelength: Omit<LocalWavelengthMap, "globalWavelengthUm">;
}

/** Which number a readout's `wavelengthUm` column holds; the comparison says so beside each value. */
export type WavelengthMeasure =
  "fourier-wavelength" | "mean-spacing-1d" | "hex-equivalent-from-nn" | "mean-spacing-table";

export const MEASURE_LABELS: Record<WavelengthMeasure, string> = {
  "fourier-wavelength": "Fourier wavelength (image)",
  "mean-spacing-1d": "mean spacing of 1-D positions",
  "hex-equivalent-from-nn": "hexagonal-equivalent wavelength (√3/2 · mean NN distance)",
  "mean-spacing-table": "mean of listed spacings",
};

export interface ReadoutHeadline {
  measure: WavelengthMeasure;
  wavelengthUm: number | null;
  uncertaintyUm: number | null;
  periodFound: boolean;
  /** Image readouts */
  significance?: number;
  symmetry?: string | null;
  nearestNeighbourUm?: number | null;
  /** Table readouts */
  n?: number;
}

/**
 * The headline of a result. Images: the Fourier wavelength ± its uncertainty. Tables: a number
 * comparable with a Fourier wavelength (SCIENCE.md §4): the mean spacing for positions and
 * spacing lists, (√3/2)·mean NN distance for 2-D centroids; the uncertainty is the SEM.
 */
export function headlineOf(result: ReadoutResult): ReadoutHeadline {
  if (result.type === "image") {
    const w = result.wavelength;
    return {
      measure: "fourier-wavelength",
      wavelengthUm: w.wavelengthUm,
      uncertaintyUm: w.uncertaintyUm,
      periodFound: w.periodFound,
      significance: w.significance,
      symmetry: w.symmetry,
      nearestNeighbourUm: w.nearestNeighbourUm,
    };
  }
  const t = result.table;
  if (t.kind === "centroids-2d") {
    return {
      measure: "hex-equivalent-from-nn",
      wavelengthUm: t.equivalentHexWavelengthUm,
      uncertaintyUm: (Math.sqrt(3) / 2) * t.nearestNeighbourUm.sem,
      periodFound: true,
      n: t.n,
      nearestNeighbourUm: t.nearestNeighbourUm.mean,
    };
  }
  if (t.kind === "positions-1d")
    return {
      measure: "mean-spacing-1d",
      wavelengthUm: t.meanSpacingUm,
      uncertaintyUm: t.spacingUm.sem,
      periodFound: true,
      n: t.n,
    };
  return {
    measure: "mean-spacing-table",
    wavelengthUm: t.spacingUm.mean,
    uncertaintyUm: t.spacingUm.sem,
    periodFound: true,
    n: t.n,
  };
}
