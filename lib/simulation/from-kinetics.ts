import type { CompiledKinetics } from "../kinetics/types";
import { decomposeDiffusion, isDiagonalMatrix } from "./cross-diffusion";
import type { ReactionSystem } from "./reaction-system";

/**
 * Wraps a kinetics of the kinetics engine as a {@link ReactionSystem}. Parameters are looked up
 * by name in the solver's params (numbers or per-cell arrays), falling back to the kinetics'
 * defaults; the per-cell loop reuses three small buffers, so nothing is allocated per cell.
 */
export function createReactionSystemFromKinetics(kinetics: CompiledKinetics): ReactionSystem {
  const n = kinetics.species.length;
  const specs = kinetics.parameters;
  const c = new Float64Array(n),
    r = new Float64Array(n),
    p = new Float64Array(specs.length);
  const spatialIndex: number[] = [];
  const spatialValues: Float64Array[] = [];
  return {
    species: n,
    speciesNames: kinetics.species,
    evaluate(fields, params, out, range) {
      spatialIndex.length = 0;
      spatialValues.length = 0;
      specs.forEach((spec, j) => {
        const v = params[spec.name];
        if (v === undefined) p[j] = spec.default;
        else if (typeof v === "number") p[j] = v;
        else {
          spatialIndex.push(j);
          spatialValues.push(v);
        }
      });
      const start = range?.start ?? 0,
        end = range?.end ?? fields[0].length,
        q = spatialIndex.length;
      for (let i = start; i < end; i++) {
        for (let s = 0; s < n; s++) c[s] = fields[s][i];
        for (let t = 0; t < q; t++) p[spatialIndex[t]] = spatialValues[t][i];
        kinetics.rates(c, p, r);
        for (let s = 0; s < n; s++) out[s][i] = r[s];
      }
    },
    jacobian(state, params, out) {
      specs.forEach((spec, j) => (p[j] = params[spec.name] ?? spec.default));
      kinetics.jacobian(state, p, out);
    },
  };
}

/**
 * Diffusivities of `kinetics` at parameter vector `p` (its own units: µm²/s when dimensional,
 * model units otherwise): one per species when D is diagonal, else the full matrix, checked here
 * so a matrix the solver cannot take (complex or negative eigenvalues, not diagonalisable) is
 * refused before a run starts (cross-diffusion.ts).
 */
export function readKineticsDiffusion(kinetics: CompiledKinetics, p: ArrayLike<number>): number[] | number[][] {
  const n = kinetics.species.length;
  const d = new Float64Array(n * n);
  kinetics.diffusion(p, d);
  const matrix = Array.from({ length: n }, (_, i) => Array.from(d.subarray(i * n, (i + 1) * n)));
  if (isDiagonalMatrix(matrix)) return matrix.map((row, i) => row[i]);
  decomposeDiffusion(matrix, "kinetics.diffusion");
  return matrix;
}

/** The first closed-form homogeneous steady state of `kinetics` at `p`, or null when none is known. */
export function readKineticsSteadyState(kinetics: CompiledKinetics, p: ArrayLike<number>): number[] | null {
  if (!kinetics.steadyStates) return null;
  const n = kinetics.species.length;
  const out = new Float64Array(4 * n);
  return kinetics.steadyStates(p, out) > 0 ? Array.from(out.subarray(0, n)) : null;
}
