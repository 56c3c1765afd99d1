/**
 * Analyses of a kinetics for the lab's pages and scripts: dispersion relation (with the admissible
 * modes of a bounded domain), sensitivities of the predicted wavelength, and a parameter gradient
 * along the tissue. Everything runs in-process and is sized to answer within about a second.
 */
import "server-only";
import { getCatalogueKinetics, type CompiledKinetics } from "@/lib/kinetics";
import {
  computeDispersion,
  computeElasticities,
  computeGradientDispersion,
  enumerateModes,
  leadingEigenvalue,
  predictWavelengthAfterScaling,
  type DispersionResult,
  type DomainSpec,
  type ElasticityResult,
  type GradientResult,
  type ScaledWavelength,
} from "@/lib/stability";
import {
  MAX_GRADIENT_SAMPLES,
  type DispersionRequest,
  type GradientRequest,
  type SensitivityRequest,
} from "@/lib/contracts/kinetics";
import type { LabContext } from "../access";
import { isUuid } from "../access";
import { AppError } from "../errors";
import { getLabKineticsVersion } from "./kinetics";
import { definitionInfo, getCatalogueEntry, type KineticsInfoDto } from "./catalogue";
import { compileStoredKinetics, withKineticsErrors } from "./engine";
import { parseProfileTable } from "./table";

/** Most admissible modes returned for plotting (the fastest are always in the result's `domain`). */
export const MAX_PLOTTED_MODES = 400;
/** Estimated compute one sensitivity or gradient request may take, ms (a design choice: about a second). */
export const ANALYSIS_BUDGET_MS = 1500;

/**
 * Times one dispersion relation and refuses (422) when `count` of them would exceed the budget,
 * so a slow lab kinetics (many species, Newton steady states) cannot hold the server.
 */
function checkBudget(
  compiled: CompiledKinetics,
  parameters: Record<string, number>,
  options: object,
  count: number,
  field: string,
  what: string,
) {
  const time = () => {
    const t0 = performance.now();
    try {
      computeDispersion(compiled, parameters, options);
    } catch {
      // the real call reports the error
    }
    return Math.max(performance.now() - t0, 0.01);
  };
  let each = time();
  // The first evaluation of freshly compiled expressions runs cold (JIT); time a second one before refusing.
  if (each * count > ANALYSIS_BUDGET_MS) each = Math.min(each, time());
  if (each * count > ANALYSIS_BUDGET_MS) {
    const most = Math.max(1, Math.floor(ANALYSIS_BUDGET_MS / each));
    throw new AppError(
      "unprocessable",
      `${field}: ${what} needs ${count} dispersion relations at about ${Math.round(each)} ms each, over the ${ANALYSIS_BUDGET_MS} ms limit of one request; at most ${most} fit.`,
      { field },
    );
  }
}

export interface ResolvedKinetics {
  compiled: CompiledKinetics;
  info: KineticsInfoDto;
}

/** A catalogue id, or a lab kinetics of this lab at a version (latest by default). */
export async function resolveAnalysisKinetics(
  ctx: LabContext,
  ref: string,
  version?: number,
): Promise<ResolvedKinetics> {
  if (isUuid(ref)) {
    const v = await getLabKineticsVersion(ctx, ref, version);
    return {
      compiled: compileStoredKinetics(v.versionId, v.definition),
      info: definitionInfo(ref, v.version, v.definition),
    };
  }
  if (version !== undefined)
    throw new AppError("bad_input", "version: catalogue kinetics have no versions; leave version out", {
      field: "version",
    });
  return withKineticsErrors(() => ({ compiled: getCatalogueKinetics(ref), info: getCatalogueEntry(ref) }));
}

const scalesOf = (r: { lengthScaleUm?: number; timeScaleS?: number }) => ({
  lengthScaleUm: r.lengthScaleUm,
  timeScaleS: r.timeScaleS,
});

export interface DispersionDto extends DispersionResult {
  info: KineticsInfoDto;
  /** Admissible modes of the bounded domain with their growth rate (k model units⁻¹), for marking on the plot. */
  admissibleModes: { k: number; sigma: number; multiplicity: number }[] | null;
  admissibleModesTruncated: boolean;
}

export async function analyseDispersion(ctx: LabContext, req: DispersionRequest): Promise<DispersionDto> {
  const { compiled, info } = await resolveAnalysisKinetics(ctx, req.kinetics, req.version);
  return withKineticsErrors(() => {
    const domain = req.domain && req.domain.kind !== "unbounded" ? (req.domain as DomainSpec) : undefined;
    const r = computeDispersion(compiled, req.parameters ?? {}, { ...scalesOf(req), domain, gridSize: req.gridSize });
    let modes: DispersionDto["admissibleModes"] = null;
    let truncated = false;
    if (r.domain) {
      const all = enumerateModes(r.domain.domain, r.kMax);
      truncated = all.length > MAX_PLOTTED_MODES;
      modes = growthOfModes(r, all.slice(0, MAX_PLOTTED_MODES));
    }
    return { ...r, info, admissibleModes: modes, admissibleModesTruncated: truncated };
  });
}

/** σ_max(k) = max Re eig(J − k²D) at each mode (SCIENCE.md §1). */
function growthOfModes(r: DispersionResult, modes: { k: number; multiplicity: number }[]) {
  const n = r.jacobian.length;
  const J = r.jacobian.flat(),
    D = r.diffusion.flat();
  const m = new Float64Array(n * n),
    out = new Float64Array(2);
  return modes.map(({ k, multiplicity }) => {
    for (let i = 0; i < n * n; i++) m[i] = J[i] - k * k * D[i];
    leadingEigenvalue(m, n, out);
    return { k, sigma: out[0], multiplicity };
  });
}

export interface SensitivityDto {
  info: KineticsInfoDto;
  /** null (with `reason`) when no mode at k > 0 grows, so λ* is undefined. */
  elasticities: ElasticityResult | null;
  reason: string | null;
  scaled: ScaledWavelength | null;
}

export async function analyseSensitivities(ctx: LabContext, req: SensitivityRequest): Promise<SensitivityDto> {
  const { compiled, info } = await resolveAnalysisKinetics(ctx, req.kinetics, req.version);
  return withKineticsErrors(() => {
    const parameters = req.parameters ?? {};
    const options = scalesOf(req);
    checkBudget(
      compiled,
      parameters,
      options,
      2 * compiled.parameters.length + 3,
      "parameters",
      `the elasticities of ${compiled.parameters.length} parameters`,
    );
    const base = computeDispersion(compiled, parameters, options);
    const scaled = req.scale
      ? predictWavelengthAfterScaling(compiled, parameters, req.scale.name, req.scale.factor, options)
      : null;
    if (!base.fastest)
      return {
        info,
        elasticities: null,
        reason: `No mode at k > 0 grows here (${base.classification.label}), so the predicted wavelength and its elasticities are undefined.`,
        scaled,
      };
    return { info, elasticities: computeElasticities(compiled, parameters, options), reason: null, scaled };
  });
}

export interface GradientDto extends GradientResult {
  info: KineticsInfoDto;
  length: number;
}

export async function analyseGradient(ctx: LabContext, req: GradientRequest): Promise<GradientDto> {
  const samples = req.samples ?? 101;
  if (samples > MAX_GRADIENT_SAMPLES)
    throw new AppError("too_large", `samples: ${samples} positions asked; the limit is ${MAX_GRADIENT_SAMPLES}.`, {
      field: "samples",
    });
  const { compiled, info } = await resolveAnalysisKinetics(ctx, req.kinetics, req.version);
  const profile =
    req.profile.kind === "table" ? { kind: "table" as const, ...parseProfileTable(req.profile.text) } : req.profile;
  checkBudget(compiled, req.parameters ?? {}, scalesOf(req), samples, "samples", `a gradient of ${samples} positions`);
  return withKineticsErrors(() => ({
    ...computeGradientDispersion(compiled, req.parameters ?? {}, {
      ...scalesOf(req),
      parameter: req.parameter,
      profile,
      length: req.length,
      samples,
    }),
    info,
    length: req.length,
  }));
}
