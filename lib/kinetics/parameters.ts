import { KineticsInputError } from "./errors";
import type { CompiledKinetics } from "./types";

/**
 * Builds the parameter vector of `kinetics` from defaults overridden by `values`.
 * Every value must be finite and inside the parameter's [min, max]; unknown names are refused.
 * @param field name of the input field for error messages
 * @default field "parameters"
 */
export function resolveParameters(
  kinetics: Pick<CompiledKinetics, "parameters">,
  values: Readonly<Record<string, number>> = {},
  field = "parameters",
): Float64Array {
  const p = new Float64Array(kinetics.parameters.length);
  kinetics.parameters.forEach((spec, i) => (p[i] = spec.default));
  for (const [name, value] of Object.entries(values)) {
    const i = kinetics.parameters.findIndex((s) => s.name === name);
    const f = `${field}.${name}`;
    if (i < 0) {
      const known = kinetics.parameters.map((s) => s.name).join(", ");
      throw new KineticsInputError(f, `Unknown parameter "${name}"; this kinetics has: ${known}.`);
    }
    checkParameterValue(kinetics.parameters[i], value, f);
    p[i] = value;
  }
  return p;
}

/** Throws unless `value` is finite and within the spec's range. */
export function checkParameterValue(
  spec: CompiledKinetics["parameters"][number],
  value: unknown,
  field: string,
): asserts value is number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new KineticsInputError(field, `Parameter ${spec.name} must be a finite number (got ${String(value)}).`);
  }
  if (value < spec.min || value > spec.max) {
    throw new KineticsInputError(
      field,
      `Parameter ${spec.name} = ${value} is outside its allowed range [${spec.min}, ${spec.max}].`,
    );
  }
}

/** Index of a parameter by name, or a clear error naming the field. */
export function parameterIndex(kinetics: Pick<CompiledKinetics, "parameters">, name: string, field: string): number {
  const i = kinetics.parameters.findIndex((s) => s.name === name);
  if (i < 0) {
    const known = kinetics.parameters.map((s) => s.name).join(", ");
    throw new KineticsInputError(field, `Unknown parameter "${name}"; this kinetics has: ${known}.`);
  }
  return i;
}

/** The parameter vector as a plain name → value object (for results). */
export function parametersToRecord(
  kinetics: Pick<CompiledKinetics, "parameters">,
  p: ArrayLike<number>,
): Record<string, number> {
  const out: Record<string, number> = {};
  kinetics.parameters.forEach((s, i) => (out[s.name] = p[i]));
  return out;
}
