import type { CompiledKinetics, ParameterSpec } from "../types";

/** What a catalogue file provides; {@link defineCatalogueKinetics} fills in the rest. */
export interface CatalogueSpec {
  id: string;
  name: string;
  source: string;
  species: string[];
  parameters: ParameterSpec[];
  /** Reaction terms, mathjs syntax (must agree with `rates`; checked by tests). */
  reactions: string[];
  /** Diagonal diffusivities as expressions in the parameters. */
  diffusion: string[];
  /** One line on the form used (scalings, which species diffuses). */
  form: string;
  rates: CompiledKinetics["rates"];
  jacobian: CompiledKinetics["jacobian"];
  diffusionValues: CompiledKinetics["diffusion"];
  steadyStates?: CompiledKinetics["steadyStates"];
  /** Whether `steadyStates` is an explicit formula (true) or a polynomial root formula (false). */
  steadyStateForm?: "explicit" | "polynomial-roots";
  /** @default true (concentrations); false for voltage-like variables. */
  nonNegative?: boolean;
}

/** A catalogue kinetics: a compiled kinetics plus its documentation fields. */
export interface CatalogueKinetics extends CompiledKinetics {
  form: string;
  steadyStateForm?: "explicit" | "polynomial-roots";
}

export function defineCatalogueKinetics(spec: CatalogueSpec): CatalogueKinetics {
  const n = spec.species.length;
  return {
    id: spec.id,
    name: spec.name,
    source: spec.source,
    form: spec.form,
    species: spec.species,
    parameters: spec.parameters,
    units: "non-dimensional",
    reactionExpressions: spec.reactions,
    diffusionExpressions: Array.from({ length: n }, (_, i) =>
      Array.from({ length: n }, (_, j) => (i === j ? spec.diffusion[i] : "0")),
    ),
    diagonalDiffusion: true,
    nonNegative: spec.nonNegative ?? true,
    rates: spec.rates,
    jacobian: spec.jacobian,
    diffusion: spec.diffusionValues,
    steadyStates: spec.steadyStates,
    steadyStateForm: spec.steadyStateForm,
    jacobianMethod: "analytic",
  };
}

/** Shorthand for a parameter spec. */
export function param(name: string, meaning: string, def: number, min: number, max: number): ParameterSpec {
  return { name, meaning, default: def, min, max, unit: "1" };
}

/** The γ scale of the textbook form u_t = γ f + ∇²u, v_t = γ g + d ∇²v (Murray 2003 §2.3). */
export const GAMMA = param("gamma", "reaction scale γ (∝ domain area in the textbook scaling)", 1, 1e-6, 1e6);

/** Writes diag(1, d) into a 2×2 buffer (textbook form). */
export function writeUnitAndRatio(d: number, out: Float64Array): void {
  out[0] = 1;
  out[1] = 0;
  out[2] = 0;
  out[3] = d;
}
