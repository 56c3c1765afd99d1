import { readFileSync } from "node:fs";
import {
  compareFits,
  fitWavelengths,
  type LabelledFit,
  type ParameterSetting,
  type WavelengthDatum,
  type WavelengthFitOptions,
} from "../../fitting";
import { createKineticsPredictor } from "../../fitting/kinetics-predictor";
import { getCatalogueKinetics } from "../../kinetics";
import type { DomainSpec } from "../../stability";
import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";

/** One model of a fit file: a catalogue kinetics, its scales and its parameter settings. */
interface ModelEntry {
  label?: string;
  kinetics: string;
  lengthScaleUm?: number;
  timeScaleS?: number;
  gridSize?: number;
  parameters: Record<string, ParameterSetting>;
}

/** FIT.json: measurements, options, and either one model (top level) or `models` to compare. */
interface FitFile extends Partial<ModelEntry> {
  data: WavelengthDatum<DomainSpec>[];
  options?: WavelengthFitOptions;
  models?: ModelEntry[];
}

function readSpec(args: string[]): FitFile {
  const { options } = parseOptions(args);
  if (typeof options.spec !== "string") throw new CliError("--spec <FIT.json> is required.");
  try {
    return JSON.parse(readFileSync(options.spec, "utf8")) as FitFile;
  } catch (err) {
    throw new CliError(`--spec: cannot read JSON: ${(err as Error).message}`);
  }
}

function fitOne(file: FitFile, m: ModelEntry) {
  const kinetics = getCatalogueKinetics(m.kinetics, "kinetics");
  const predictor = createKineticsPredictor(kinetics, {
    lengthScaleUm: m.lengthScaleUm,
    timeScaleS: m.timeScaleS,
    gridSize: m.gridSize,
  });
  return fitWavelengths({ data: file.data, parameters: m.parameters, options: file.options }, predictor);
}

const FILE_HELP = `FIT.json:
  { "kinetics": "<catalogue id>", "lengthScaleUm": 10, "gridSize": 200,
    "data": [{ "condition": "control", "wavelengthUm": 120, "uncertaintyUm": 4,
               "kind": "fourier" | "nearest-neighbour", "domain": { "kind": "interval", "length": 900 } }],
    "parameters": { "d":  { "mode": "free", "start": 30, "lower": 5, "upper": 200, "log": true },
                    "b":  { "mode": "fixed", "value": { "control": 0.9, "treated": 1.1 } },
                    "gamma": { "mode": "per-condition", "start": 1, "lower": 0.1, "upper": 10 } },
    "options": { "seededStarts": 4, "turingSamples": 64, "profiles": true, "reachSigma": 3 } }
  Nearest-neighbour spacings are converted to Fourier wavelengths as (√3/2)·a (hexagonal spots).
  A parameter "lengthScaleUm" may itself be fixed or free (non-dimensional kinetics).`;

const fit: CliCommand = {
  name: "fit",
  summary: "Fit a kinetics' predicted wavelength 2π/k* to measured wavelengths",
  help: `Usage: cli fit --spec FIT.json [--json]

Weighted least squares of predicted (Turing-unstable) against measured Fourier wavelengths:
parameters with standard errors and 95 % profile-likelihood intervals, χ², reduced χ², AICc,
BIC, residuals per measurement, identifiability and a verdict.

${FILE_HELP}`,
  async run(args) {
    const file = readSpec(args);
    try {
      if (!file.kinetics || !file.parameters)
        throw new CliError('FIT.json needs "kinetics" and "parameters" (or use `cli compare` with "models").');
      const r = fitOne(file, file as ModelEntry);
      const lines = [
        `verdict: ${r.verdict} — ${r.verdictReason}`,
        ...r.parameters.map((p) => {
          const ci = p.interval95
            ? ` 95 % [${p.interval95.lower.value ?? "open"}, ${p.interval95.upper.value ?? "open"}]`
            : "";
          return `  ${p.name} = ${p.value.toPrecision(6)} ± ${p.standardError?.toPrecision(3) ?? "n/a"}${ci}`;
        }),
        `χ² = ${r.chiSquare.toPrecision(5)}, reduced χ² = ${r.reducedChiSquare?.toPrecision(4) ?? "n/a"}, AICc = ${r.aicc?.toPrecision(5) ?? "n/a"}, BIC = ${r.bic.toPrecision(5)}`,
        `identifiable: ${r.identifiability.identifiable ? "yes" : `no — ${r.identifiability.reasons.join(" ")}`}`,
        ...r.notes.map((n) => `note: ${n}`),
        ...r.warnings.map((w) => `warning: ${w}`),
      ];
      return { json: { kinetics: file.kinetics, ...r }, text: lines.join("\n") };
    } catch (err) {
      throw toCliError(err);
    }
  },
};

const compare: CliCommand = {
  name: "compare",
  summary: "Fit several kinetics to the same wavelengths and rank them by AICc",
  help: `Usage: cli compare --spec FIT.json [--json]

FIT.json holds "data", "options" and "models": [{ "label", "kinetics", "lengthScaleUm",
"parameters" }, …]; each model is fitted as by \`cli fit\` and the fits are ranked by AICc with
Akaike weights.

${FILE_HELP}`,
  async run(args) {
    const file = readSpec(args);
    try {
      if (!Array.isArray(file.models) || file.models.length === 0)
        throw new CliError('FIT.json needs "models": a list of { kinetics, parameters } to compare.');
      const fits: LabelledFit[] = file.models.map((m, i) => ({
        label: m.label ?? `${m.kinetics}#${i + 1}`,
        result: fitOne(file, m),
      }));
      const cmp = compareFits(fits);
      const text = cmp.ranking
        .map(
          (r) =>
            `${r.rank}. ${r.label}: AICc ${r.aicc?.toPrecision(5) ?? "n/a"}, Δ ${r.deltaAicc?.toPrecision(3) ?? "n/a"}, weight ${r.akaikeWeight?.toPrecision(3) ?? "n/a"} (${r.verdict})`,
        )
        .concat(cmp.notes.map((n) => `note: ${n}`))
        .join("\n");
      return { json: { ...cmp, fits: fits.map((f) => ({ label: f.label, ...f.result })) }, text };
    } catch (err) {
      throw toCliError(err);
    }
  },
};

export default [fit, compare];
