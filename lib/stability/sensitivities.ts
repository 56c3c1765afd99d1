/**
 * Robustness of the predicted wavelength: elasticities ∂ln λ* / ∂ln p by central differences in
 * ln p (step h: p·e^{±h}), and λ* after scaling one parameter by a factor. λ* is 2π/k* of the
 * fastest-growing k > 0 mode of {@link computeDispersion}; elasticities are unit-free, so
 * model units and µm give the same numbers.
 */
import { KineticsInputError } from "../kinetics/errors";
import { parameterIndex, resolveParameters } from "../kinetics/parameters";
import type { CompiledKinetics } from "../kinetics/types";
import { computeDispersion, type DispersionOptions } from "./compute-dispersion";

export interface ElasticityOptions extends DispersionOptions {
  /** Step in ln p. @default 0.01 */
  logStep?: number;
}

export interface Elasticity {
  name: string;
  value: number;
  /** ∂ln λ* / ∂ln p, or null with the reason. */
  elasticity: number | null;
  reason?: string;
}

export interface ElasticityResult {
  wavelength: number;
  wavelengthUm: number | null;
  logStep: number;
  elasticities: Elasticity[];
}

function wavelengthAt(
  kinetics: CompiledKinetics,
  set: Record<string, number>,
  options: DispersionOptions,
): number | null {
  try {
    return computeDispersion(kinetics, set, options).fastest?.wavelength ?? null;
  } catch {
    return null;
  }
}

/** Elasticity of λ* with respect to every parameter. */
export function computeElasticities(
  kinetics: CompiledKinetics,
  parameters: Record<string, number> = {},
  options: ElasticityOptions = {},
): ElasticityResult {
  const h = options.logStep ?? 0.01;
  if (!(h > 0 && h <= 0.5)) throw new KineticsInputError("logStep", `logStep must be in (0, 0.5] (got ${h}).`);
  const base = computeDispersion(kinetics, parameters, options);
  if (!base.fastest)
    throw new KineticsInputError(
      "parameters",
      "No growing mode at k > 0 here, so the predicted wavelength and its elasticities are undefined.",
    );
  const p = resolveParameters(kinetics, parameters);
  const record = Object.fromEntries(kinetics.parameters.map((s, i) => [s.name, p[i]]));
  const elasticities = kinetics.parameters.map((spec, i): Elasticity => {
    const v = p[i];
    if (v === 0) return { name: spec.name, value: v, elasticity: null, reason: "parameter is 0, so ln p is undefined" };
    const up = v * Math.exp(h),
      down = v * Math.exp(-h);
    if (Math.max(up, down) > spec.max || Math.min(up, down) < spec.min) {
      return {
        name: spec.name,
        value: v,
        elasticity: null,
        reason: `p·e^±${h} leaves the allowed range [${spec.min}, ${spec.max}]`,
      };
    }
    const lu = wavelengthAt(kinetics, { ...record, [spec.name]: up }, options);
    const ld = wavelengthAt(kinetics, { ...record, [spec.name]: down }, options);
    if (lu === null || ld === null)
      return { name: spec.name, value: v, elasticity: null, reason: "no growing mode at one of p·e^±h" };
    // d ln λ / d ln p ≈ (ln λ(p e^h) − ln λ(p e^−h)) / 2h, error O(h²) (common practice, no source)
    return { name: spec.name, value: v, elasticity: (Math.log(lu) - Math.log(ld)) / (2 * h) };
  });
  return { wavelength: base.fastest.wavelength, wavelengthUm: base.fastest.wavelengthUm, logStep: h, elasticities };
}

export interface ScaledWavelength {
  name: string;
  factor: number;
  before: { value: number; wavelength: number | null; wavelengthUm: number | null };
  after: { value: number; wavelength: number | null; wavelengthUm: number | null; classes: string[] };
  /** λ*(after) / λ*(before), or null when either is undefined. */
  ratio: number | null;
}

/** λ* after multiplying parameter `name` by `factor` (the new value must stay in range). */
export function predictWavelengthAfterScaling(
  kinetics: CompiledKinetics,
  parameters: Record<string, number>,
  name: string,
  factor: number,
  options: DispersionOptions = {},
): ScaledWavelength {
  if (!(Number.isFinite(factor) && factor > 0))
    throw new KineticsInputError("factor", `factor must be a positive finite number (got ${factor}).`);
  const i = parameterIndex(kinetics, name, "name");
  const p = resolveParameters(kinetics, parameters);
  const before = computeDispersion(kinetics, parameters, options);
  const after = computeDispersion(kinetics, { ...parameters, [name]: p[i] * factor }, options);
  const lb = before.fastest?.wavelength ?? null,
    la = after.fastest?.wavelength ?? null;
  return {
    name,
    factor,
    before: { value: p[i], wavelength: lb, wavelengthUm: before.fastest?.wavelengthUm ?? null },
    after: {
      value: p[i] * factor,
      wavelength: la,
      wavelengthUm: after.fastest?.wavelengthUm ?? null,
      classes: after.classification.classes,
    },
    ratio: lb !== null && la !== null ? la / lb : null,
  };
}
