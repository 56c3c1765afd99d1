/**
 * From a fit request to the stored spec (the command line's FIT.json) and its provenance, checked
 * before any job starts: unknown kinetics or parameters, a non-dimensional kinetics without a
 * length scale, bounds outside the kinetics' allowed range, and everything the fitting core
 * refuses (no data, mixed kinds in a condition, a start outside its bounds, all parameters fixed,
 * no Turing region in the box) answer 400/422 with the field named.
 */
import "server-only";
import { createHash } from "node:crypto";
import { addReplicateSpread, FitError, type ParameterSetting } from "@/lib/fitting";
import { resolveWavelengthSpec } from "@/lib/fitting/resolve-wavelength-spec";
import { createKineticsPredictor, SCALE_PARAMETERS } from "@/lib/fitting/kinetics-predictor";
import { sampleTuringBox } from "@/lib/fitting/sample-turing-box";
import { createWavelengthModel } from "@/lib/fitting/wavelength-model";
import { getCatalogueKinetics, type CompiledKinetics } from "@/lib/kinetics";
import type { FitCreate, FitModelInput } from "@/lib/contracts/fit";
import { isUuid, type LabContext } from "../access";
import { toAppError } from "../core-errors";
import { AppError } from "../errors";
import { getLabKineticsVersion } from "../kinetics/kinetics";
import { compileStoredKinetics } from "../kinetics/engine";
import { poolBySpecimen } from "./specimen-pool";
import { resolveFitData } from "./fit-data";
import type { FitKineticsSource, FitProvenance, StoredFitModel, StoredFitSpec } from "./spec-types";

export const sha256Of = (text: string) => createHash("sha256").update(text).digest("hex");

/** JSON with object keys sorted, so equal specs hash equally. */
export function canonicalJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonicalJson).join(",")}]`;
  if (v && typeof v === "object")
    return `{${Object.keys(v)
      .sort()
      .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
      .map((k) => `${JSON.stringify(k)}:${canonicalJson((v as Record<string, unknown>)[k])}`)
      .join(",")}}`;
  return JSON.stringify(v);
}

const cannot = (field: string, message: string) => new AppError("unprocessable", `${field}: ${message}`, { field });

/** A FitError of model `i` as a 422 naming the field under `models[i].` (data fields stay `data[j]`). */
export function fitErrorToApp(err: unknown, i: number | null): unknown {
  if (!(err instanceof FitError)) return err;
  const field =
    err.field && i !== null && !err.field.startsWith("data")
      ? `models[${i}].${err.field}`
      : (err.field ?? (i === null ? "data" : `models[${i}]`));
  const message =
    err.field && err.message.startsWith(err.field)
      ? `${field}${err.message.slice(err.field.length)}`
      : `${field}: ${err.message}`;
  return toAppError(new FitError(err.code, message, field));
}

interface ResolvedModel {
  stored: StoredFitModel;
  compiled: CompiledKinetics;
  source: FitKineticsSource;
}

async function resolveModel(ctx: LabContext, input: FitModelInput, i: number): Promise<ResolvedModel> {
  const f = `models[${i}]`;
  let compiled: CompiledKinetics;
  let source: Omit<FitKineticsSource, "label">;
  let stored: Pick<StoredFitModel, "kinetics" | "definition">;
  if (isUuid(input.kinetics)) {
    let v;
    try {
      v = await getLabKineticsVersion(ctx, input.kinetics, input.version);
    } catch (err) {
      if (err instanceof AppError && err.code === "not_found")
        throw cannot(
          `${f}.${input.version ? "version" : "kinetics"}`,
          input.version ? `this lab kinetics has no version ${input.version}` : "no kinetics with this id in this lab",
        );
      throw err;
    }
    compiled = compileStoredKinetics(v.versionId, v.definition);
    source = {
      kind: "lab",
      id: input.kinetics,
      version: v.version,
      name: v.definition.name,
      source: v.definition.source ?? "",
      units: v.definition.units ?? "non-dimensional",
      definitionSha256: sha256Of(canonicalJson(v.definition)),
    };
    stored = { kinetics: `lab:${input.kinetics}@v${v.version}`, definition: v.definition };
  } else {
    if (input.version !== undefined)
      throw new AppError("bad_input", `${f}.version: catalogue kinetics have no versions; leave version out`, {
        field: `${f}.version`,
      });
    try {
      compiled = getCatalogueKinetics(input.kinetics);
    } catch {
      throw cannot(`${f}.kinetics`, `no kinetics “${input.kinetics}” in the catalogue or this lab`);
    }
    const c = compiled as CompiledKinetics & { source: string };
    source = {
      kind: "catalogue",
      id: compiled.id,
      version: null,
      name: compiled.name,
      source: c.source,
      units: compiled.units,
      definitionSha256: null,
    };
    stored = { kinetics: compiled.id };
  }
  const names = compiled.parameters.map((p) => p.name);
  const parameters: Record<string, ParameterSetting> = {};
  for (const [name, s] of Object.entries(input.parameters)) {
    const spec = compiled.parameters.find((p) => p.name === name);
    if (!spec && !(SCALE_PARAMETERS as readonly string[]).includes(name))
      throw cannot(
        `${f}.parameters.${name}`,
        `${compiled.name} has no parameter “${name}” (its parameters: ${names.join(", ")}; or lengthScaleUm, timeScaleS)`,
      );
    if (spec && s.mode !== "fixed" && (s.lower < spec.min || s.upper > spec.max)) {
      throw cannot(
        `${f}.parameters.${name}.${s.lower < spec.min ? "lower" : "upper"}`,
        `the bounds [${s.lower}, ${s.upper}] leave the allowed range of ${name}, [${spec.min}, ${spec.max}]`,
      );
    }
    parameters[name] = s as ParameterSetting;
  }
  // Parameters left out are fixed at their defaults, written down so the record is complete.
  for (const p of compiled.parameters)
    if (!(p.name in parameters)) parameters[p.name] = { mode: "fixed", value: p.default };
  const lengthFitted = "lengthScaleUm" in input.parameters;
  if (compiled.units === "non-dimensional" && input.lengthScaleUm === undefined && !lengthFitted) {
    throw cannot(
      `${f}.lengthScaleUm`,
      `${compiled.name} is non-dimensional; give a length scale ℓ (µm per model length) or fit lengthScaleUm as a parameter, so its wavelength can be compared in µm`,
    );
  }
  const label = input.label ?? (source.kind === "lab" ? `${source.name} v${source.version}` : source.name);
  return {
    compiled,
    source: { label, ...source },
    stored: {
      label,
      ...stored,
      parameters,
      ...(input.lengthScaleUm !== undefined ? { lengthScaleUm: input.lengthScaleUm } : {}),
      ...(input.timeScaleS !== undefined ? { timeScaleS: input.timeScaleS } : {}),
      ...(input.gridSize !== undefined ? { gridSize: input.gridSize } : {}),
    },
  };
}

/** Runs the fitting core's own checks and its Turing-region sample (the same seeded points the fit will use). */
function precheck(spec: StoredFitSpec, model: ResolvedModel, i: number): void {
  try {
    const checked = resolveWavelengthSpec({
      data: spec.data,
      parameters: model.stored.parameters,
      options: spec.options,
    });
    const predictor = createKineticsPredictor(model.compiled, {
      lengthScaleUm: model.stored.lengthScaleUm,
      timeScaleS: model.stored.timeScaleS,
      gridSize: model.stored.gridSize,
    });
    const wm = createWavelengthModel(checked, predictor);
    const samples = sampleTuringBox(checked.slots, checked.options.turingSamples, checked.options.seed, wm);
    if (!samples.some((s) => s.turing && Number.isFinite(s.chiSquareTuring))) {
      const first = wm.failures().firstMessage;
      throw new FitError(
        "no_turing_region",
        `no Turing region within the bounds of ${model.source.label}: none of the ${samples.length} sampled points (the start and ${samples.length - 1} seeded points in the box) is Turing-unstable in every condition; widen the bounds or free other parameters${first ? ` (the predictor reported: ${first})` : ""}`,
        "parameters",
      );
    }
  } catch (err) {
    throw fitErrorToApp(err, err instanceof FitError && err.field?.startsWith("data") ? null : i);
  }
}

export interface BuiltFit {
  kind: "fit" | "comparison";
  spec: StoredFitSpec;
  provenance: FitProvenance;
  inputSha256: string;
}

/** Validates a request and writes the stored spec; throws 400/422 naming the field. */
export async function buildFitSpec(
  ctx: LabContext,
  input: FitCreate,
  softwareVersion: string,
  runner: FitProvenance["runner"],
): Promise<BuiltFit> {
  const raw = await resolveFitData(ctx, input.data);
  // Specimens are the replicates (default); counting every image is a choice.
  const replicates = input.replicates ?? "specimens";
  const pooled = replicates === "specimens" ? poolBySpecimen(raw.data, raw.sources) : null;
  const resolved = pooled ?? { data: raw.data, sources: raw.sources };
  const sources = resolved.sources;
  const uncertainty = input.uncertainty ?? "with-specimen-spread";
  const spread = uncertainty === "with-specimen-spread" ? addReplicateSpread(resolved.data) : null;
  const data = spread ? spread.data : resolved.data;
  const models: ResolvedModel[] = [];
  for (const [i, mi] of input.models.entries()) models.push(await resolveModel(ctx, mi, i));
  const labels = new Set<string>();
  models.forEach((m, i) => {
    if (labels.has(m.stored.label))
      throw new AppError(
        "bad_input",
        `models[${i}].label: “${m.stored.label}” is used twice; give each kinetics its own label`,
        { field: `models[${i}].label` },
      );
    labels.add(m.stored.label);
  });
  const options = { ...(input.options ?? {}) };
  const spec: StoredFitSpec = { data, options, models: models.map((m) => m.stored) };
  if (models.length === 1) {
    const { label: _label, definition: _definition, ...top } = models[0].stored;
    Object.assign(spec, top);
  }
  models.forEach((m, i) => precheck(spec, m, i));
  const inputSha256 = sha256Of(canonicalJson(spec));
  const defaults = resolveWavelengthSpec({ data, parameters: models[0].stored.parameters, options }).options;
  return {
    kind: models.length === 1 ? "fit" : "comparison",
    spec,
    inputSha256,
    provenance: {
      data: sources,
      kinetics: models.map((m) => m.source),
      settings: {
        ...defaults,
        uncertainty,
        replicates,
        ...(pooled
          ? {
              replicateCounts: `${pooled.counts.specimens} specimens · ${pooled.counts.images} images${pooled.counts.repeatedFiles ? ` · ${pooled.counts.repeatedFiles} repeated file${pooled.counts.repeatedFiles > 1 ? "s" : ""} counted once` : ""}`,
            }
          : {}),
        ...(spread
          ? {
              specimenSpreadUm: spread.spreads
                .map((x) => `${x.condition}: SD ${x.sdUm.toPrecision(3)} µm (n = ${x.n})`)
                .join("; "),
            }
          : {}),
      },
      softwareVersion,
      specSha256: inputSha256,
      runner,
    },
  };
}
