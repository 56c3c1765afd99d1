import type { SolverStopReason } from "./types";
import type { MeasurementKind } from "./wavelength-spec";
import type { StartReport } from "./solve-least-squares";

export type WavelengthVerdict = "fits" | "fits only outside the Turing region" | "cannot reach the measured wavelength";

/** One side of a 95 % profile-likelihood interval. */
export interface IntervalSide {
  /** Limit, natural units; null when open-ended. */
  value: number | null;
  /** Why it is open: the parameter's bound was reached (`bound`) or the search range ran out (`range`). */
  open: "bound" | "range" | null;
  /** The limit is the edge of the Turing region, reached before χ² rose by the threshold. */
  turingEdge: boolean;
}

export interface FittedParameter {
  /** `Du`, or `k[treated]` for a per-condition parameter. */
  name: string;
  parameter: string;
  condition: string | null;
  value: number;
  /** From (JᵀWJ)⁻¹; null when the fit is not identifiable. */
  standardError: number | null;
  /** 95 % profile-likelihood interval; null when profiles were not computed. */
  interval95: { lower: IntervalSide; upper: IntervalSide } | null;
  log: boolean;
  atBound: boolean;
}

export interface FittedDatum {
  index: number;
  condition: string;
  kind: MeasurementKind;
  /** As given: wavelength or nearest-neighbour spacing, µm. */
  measuredUm: number;
  /** On the Fourier scale the model predicts (× √3/2 for a spacing), µm, with its uncertainty. */
  measuredFourierUm: number;
  uncertaintyFourierUm: number;
  /** The model's 2π/k* at the fit, µm; null without a prediction. */
  predictedUm: number | null;
  turing: boolean;
  /** (predicted − measured)/uncertainty on the Fourier scale; null without a prediction. */
  residual: number | null;
}

export interface WavelengthFitResult {
  verdict: WavelengthVerdict;
  /** The verdict in one or two sentences with the numbers behind it. */
  verdictReason: string;
  parameters: FittedParameter[];
  /** Fixed parameters as given. */
  fixed: Record<string, number | Record<string, number>>;
  /** Number of measurements and of fitted coordinates. */
  n: number;
  p: number;
  chiSquare: number;
  reducedChiSquare: number | null;
  aicc: number | null;
  bic: number;
  residuals: FittedDatum[];
  /** Per condition: the fitted state is Turing-unstable. */
  turingAtFit: Record<string, boolean>;
  identifiability: {
    identifiable: boolean;
    reasons: string[];
    singularRatio: number;
    /** Curve of equally good solutions when not identifiable: the stepped parameter and the points. */
    valley: {
      parameter: string;
      points: { params: Record<string, number>; deltaChiSquare: number; withinConfidence: boolean }[];
    } | null;
  };
  convergence: {
    converged: boolean;
    reason: SolverStopReason;
    iterations: { library: number; polish: number };
    evaluations: number;
    starts: StartReport[];
  };
  /** Best fit when non-Turing predictions are allowed too; computed only when the Turing fit does not reach the data. */
  outsideTuring: {
    params: Record<string, number>;
    chiSquare: number;
    maxAbsResidual: number;
    nonTuringConditions: string[];
  } | null;
  /** Conversions and choices made on the user's behalf (spacing → Fourier wavelength, start moved into the Turing region). */
  notes: string[];
  warnings: string[];
  /** Identifies the measurements, so fits of different models can be checked to use the same data. */
  dataFingerprint: string;
  /** Δχ² of the profile intervals. */
  profileDelta: number;
}
