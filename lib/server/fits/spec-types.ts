/**
 * The stored fit spec: the command line's FIT.json (`cli fit --spec`, `cli compare --spec`),
 * written by the server from a fit request. Types only, so pages and the child entry may import it.
 */
import "server-only";
import type { ParameterSetting, WavelengthDatum, WavelengthFitOptions } from "@/lib/fitting";
import type { KineticsDefinition } from "@/lib/kinetics/definition-schema";
import type { DomainSpec } from "@/lib/stability";

export interface StoredFitModel {
  label: string;
  /** Catalogue id, or `lab:<id>@v<version>` for a lab kinetics (whose definition is stored beside it). */
  kinetics: string;
  lengthScaleUm?: number;
  timeScaleS?: number;
  gridSize?: number;
  /** Every parameter of the kinetics, fixed ones included (the defaults the request left out are written down). */
  parameters: Record<string, ParameterSetting>;
  /** Lab kinetics only: the definition of the version fitted. */
  definition?: KineticsDefinition;
}

export interface StoredFitSpec {
  data: WavelengthDatum<DomainSpec>[];
  options: WavelengthFitOptions;
  models: StoredFitModel[];
  /** A one-model fit also carries its model at the top level, so `cli fit --spec` reads it as is. */
  kinetics?: string;
  lengthScaleUm?: number;
  timeScaleS?: number;
  gridSize?: number;
  parameters?: Record<string, ParameterSetting>;
}

/** Where each datum came from. */
export interface FitDatumSource {
  index: number;
  source: "readout" | "typed";
  condition: string;
  kind: "fourier" | "nearest-neighbour";
  readoutId: string | null;
  /** Which number of the readout was used, in words. */
  measure: string | null;
  filename: string | null;
  specimenLabel: string | null;
  studyId: string | null;
  studyName: string | null;
  /** SHA-256 of the readout's input file, and the software that read it. */
  inputSha256: string | null;
  readoutSoftwareVersion: string | null;
  /** The readout's specimen (fits made before specimen pooling do not record it). */
  specimenId?: string | null;
  /**
   * Index of the fitted datum this source fed (spec.data); several images of one specimen feed one
   * datum, a repeated file none (null). Absent on fits made before specimen pooling: then it is `index`.
   */
  datumIndex?: number | null;
  /** Why a source was not counted, in words. */
  note?: string;
}

export interface FitKineticsSource {
  label: string;
  kind: "catalogue" | "lab";
  id: string;
  version: number | null;
  name: string;
  /** Published source of the kinetics (the methods paragraph cites it). */
  source: string;
  units: "dimensional" | "non-dimensional";
  /** SHA-256 of the lab definition fitted. */
  definitionSha256: string | null;
}

export interface FitProvenance {
  data: FitDatumSource[];
  kinetics: FitKineticsSource[];
  /** Options as given and as defaulted by the fitting core. */
  settings: Record<string, unknown>;
  softwareVersion: string;
  /** SHA-256 of the stored spec (canonical JSON), the same as the fit's `inputSha256`. */
  specSha256: string;
  runner: "child-process" | "in-process";
}
