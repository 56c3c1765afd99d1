import { EigenvalueDecomposition, Matrix, inverse } from "ml-matrix";
import { failOption } from "./errors";
import type { CellRange, FieldArray, ReactionParams, ReactionSystem } from "./reaction-system";

/**
 * Cross-diffusion ∂c/∂t = R(c) + D∇²c with a full n×n matrix D. When D = VΛV⁻¹ with real
 * eigenvalues λ ≥ 0 (the usual well-posedness condition for linear cross-diffusion; e.g.
 * Vanag V.K. & Epstein I.R. (2009) Phys. Chem. Chem. Phys. 11:897), the mode coordinates
 * w = V⁻¹c satisfy ∂w/∂t = V⁻¹R(Vw) + Λ∇²w: diagonal diffusion, so every scheme and basis of
 * the solver applies unchanged, with the reactions evaluated at c = Vw and mapped back by V⁻¹.
 * The map acts cell by cell on species, so it commutes with the spatial transforms and with the
 * boundary conditions.
 */
export interface DiffusionModes {
  /** Eigenvalues λ_s of D (µm²/s), the diffusivities of the mode coordinates. */
  diffusivities: number[];
  /** V, row-major n×n: c = V w. Columns scaled to unit largest entry. */
  toSpecies: Float64Array;
  /** V⁻¹, row-major n×n: w = V⁻¹ c. */
  toModes: Float64Array;
}

/** Largest condition number ‖V‖·‖V⁻¹‖ accepted: beyond it D is treated as not diagonalisable (design choice). */
export const MAX_MODE_CONDITION = 1e8;

/** True when every off-diagonal entry of the row-major matrix is zero. */
export function isDiagonalMatrix(d: readonly (readonly number[])[]): boolean {
  return d.every((row, i) => row.every((v, j) => i === j || v === 0));
}

/** Eigen-decomposition of a cross-diffusion matrix, refusing the cases the solver cannot take. */
export function decomposeDiffusion(d: readonly (readonly number[])[], field = "diffusionUm2PerS"): DiffusionModes {
  const n = d.length;
  const scale = Math.max(...d.flat().map(Math.abs), 0);
  const eig = new EigenvalueDecomposition(new Matrix(d.map((r) => [...r])));
  const re = eig.realEigenvalues,
    im = eig.imaginaryEigenvalues;
  const tiny = 1e-12 * Math.max(scale, 1e-300);
  if (im.some((v) => Math.abs(v) > tiny)) {
    const pairs = re
      .map((r, i) =>
        Math.abs(im[i]) > tiny
          ? `${r.toPrecision(4)} ${im[i] < 0 ? "−" : "+"} ${Math.abs(im[i]).toPrecision(4)}i`
          : null,
      )
      .filter(Boolean);
    failOption(
      field,
      `${field}: the cross-diffusion matrix has complex eigenvalues (${pairs.join(", ")}); the solver needs real eigenvalues (a matrix diagonalisable over the reals).`,
    );
  }
  const lambda = re.map((v) => (Math.abs(v) <= tiny ? 0 : v));
  const negative = lambda.findIndex((v) => v < 0);
  if (negative >= 0) {
    failOption(
      field,
      `${field}: the cross-diffusion matrix has a negative eigenvalue (${lambda[negative].toPrecision(4)}): that is backward diffusion, an ill-posed problem whose short waves grow without bound; no scheme can simulate it.`,
    );
  }
  const V = eig.eigenvectorMatrix;
  for (let j = 0; j < n; j++) {
    let m = 0;
    for (let i = 0; i < n; i++) m = Math.max(m, Math.abs(V.get(i, j)));
    for (let i = 0; i < n; i++) V.set(i, j, V.get(i, j) / m);
  }
  let Vinv: Matrix;
  try {
    Vinv = inverse(V);
  } catch {
    failOption(
      field,
      `${field}: the cross-diffusion matrix is not diagonalisable (its eigenvectors are dependent); the solver needs n independent eigenvectors.`,
    );
  }
  const norm1 = (M: Matrix) =>
    Math.max(...Array.from({ length: n }, (_, j) => M.getColumn(j).reduce((s, v) => s + Math.abs(v), 0)));
  const cond = norm1(V) * norm1(Vinv);
  if (!(cond <= MAX_MODE_CONDITION)) {
    failOption(
      field,
      `${field}: the cross-diffusion matrix is nearly not diagonalisable (eigenvector condition number ${cond.toExponential(2)} > ${MAX_MODE_CONDITION.toExponential(0)}); the mode coordinates would lose too many digits.`,
    );
  }
  return {
    diffusivities: lambda,
    toSpecies: Float64Array.from(V.to1DArray()),
    toModes: Float64Array.from(Vinv.to1DArray()),
  };
}

/** out[s][i] = Σ_j M[s][j] src[j][i] for cells of `range`; src and out must be different arrays. */
export function mixSpecies(
  M: Float64Array,
  src: readonly FieldArray[],
  out: readonly FieldArray[],
  start = 0,
  end = src[0].length,
): void {
  const n = src.length;
  for (let s = 0; s < n; s++) {
    const o = out[s];
    for (let i = start; i < end; i++) o[i] = 0;
    for (let j = 0; j < n; j++) {
      const m = M[s * n + j],
        f = src[j];
      if (m === 0) continue;
      for (let i = start; i < end; i++) o[i] += m * f[i];
    }
  }
}

/** Applies M to fields in place (cell by cell), through one scratch copy. */
export function mixSpeciesInPlace(M: Float64Array, fields: readonly Float64Array[]): void {
  const copy = fields.map((f) => Float64Array.from(f));
  mixSpecies(M, copy, fields);
}

/**
 * The reaction system of the mode coordinates: evaluate(w) = V⁻¹ R(V w). Allocates two scratch
 * sets of `cellCount` values per species once; nothing per step.
 */
export function createModeReactionSystem(
  system: ReactionSystem,
  modes: DiffusionModes,
  cellCount: number,
): ReactionSystem {
  const n = system.species;
  const c = Array.from({ length: n }, () => new Float64Array(cellCount));
  const r = Array.from({ length: n }, () => new Float64Array(cellCount));
  return {
    species: n,
    speciesNames: system.speciesNames,
    evaluate(fields: readonly FieldArray[], params: ReactionParams, out: readonly FieldArray[], range?: CellRange) {
      const start = range?.start ?? 0,
        end = range?.end ?? fields[0].length;
      mixSpecies(modes.toSpecies, fields, c, start, end);
      system.evaluate(c, params, r, { start, end });
      mixSpecies(modes.toModes, r, out, start, end);
    },
  };
}
