/** How a measurement was read: a Fourier wavelength, or a nearest-neighbour spacing of hexagonal spots. */
export type MeasurementKind = "fourier" | "nearest-neighbour";

/** One measured wavelength (or spacing) of one condition. */
export interface WavelengthDatum<TDomain = unknown> {
  /** Condition label, e.g. "control" or "BMP4 10 ng/ml". */
  condition: string;
  /** Measured value, µm: a Fourier wavelength, or the nearest-neighbour spacing a when `kind` says so. */
  wavelengthUm: number;
  /** Its standard uncertainty, µm (same kind as the value). */
  uncertaintyUm: number;
  kind: MeasurementKind;
  /** The tissue's domain, handed unchanged to the predictor (unbounded when omitted). */
  domain?: TDomain;
}

/** A parameter held at a known value (one for all conditions, or one per condition). */
export interface FixedParameter {
  mode: "fixed";
  value: number | Record<string, number>;
}

/** A parameter shared by all conditions, fitted within finite bounds. */
export interface FreeParameter {
  mode: "free";
  start: number;
  lower: number;
  upper: number;
  /** Fit ln θ (for parameters spanning decades; needs lower > 0). @default false */
  log?: boolean;
}

/** A parameter fitted separately for each condition (e.g. a rate a treatment changes). */
export interface PerConditionParameter {
  mode: "per-condition";
  /** One start for every condition, or one per condition. */
  start: number | Record<string, number>;
  lower: number;
  upper: number;
  /** @default false */
  log?: boolean;
}

export type ParameterSetting = FixedParameter | FreeParameter | PerConditionParameter;

/** Options of {@link fitWavelengths}. */
export interface WavelengthFitOptions {
  /** Extra starts: the best Turing points of the box sample, by χ². @default 4 */
  seededStarts?: number;
  /** Points sampled in the parameter box to find the Turing region. @default 64 */
  turingSamples?: number;
  /** Seed for the box sample. @default "morphokin" */
  seed?: string;
  /** Uncertainties are absolute standard deviations (else Cov is scaled by χ²/(n − p)). @default true */
  absoluteUncertainties?: boolean;
  /** Compute 95 % profile-likelihood intervals. @default true */
  profiles?: boolean;
  /** A prediction "reaches" a measurement when |residual| ≤ this many uncertainties. @default 3 */
  reachSigma?: number;
  /** Grid size of the valley traced for a non-identifiable fit (0: none). @default 21 */
  valleyPoints?: number;
}

/** What to fit: measurements, the model's parameters (fixed, free or free per condition), options. */
export interface WavelengthFitSpec<TDomain = unknown> {
  data: WavelengthDatum<TDomain>[];
  parameters: Record<string, ParameterSetting>;
  options?: WavelengthFitOptions;
}

/** A prediction of the model for one condition: the Fourier wavelength 2π/k* and whether the state is Turing-unstable. */
export interface WavelengthPrediction {
  wavelengthUm: number;
  turing: boolean;
}

/**
 * The model, injected: parameter values (by name, per-condition ones already resolved for this
 * condition) → predicted Fourier wavelength, or null when there is no prediction (no steady state,
 * no unstable mode). Must be deterministic.
 */
export type WavelengthPredictor<TDomain = unknown> = (
  params: Readonly<Record<string, number>>,
  condition: string,
  domain: TDomain | undefined,
) => WavelengthPrediction | null;
