import { KineticsInputError } from "../kinetics/errors";
import { eigenvalues } from "./eigen";

/**
 * Checks the diffusion matrix (row-major n×n) and returns d_min, the smallest diffusivity
 * used to bound the k grid. A diagonal D needs every D_ii > 0; a full (cross-diffusion) D
 * needs eigenvalues with positive real part, else arbitrarily short waves grow (ill-posed).
 */
export function checkDiffusion(D: ArrayLike<number>, n: number, species: readonly string[]): number {
  let diagonal = true;
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(D[i]))
      throw new KineticsInputError(
        "diffusion",
        `Diffusion matrix entry (${Math.floor(i / n) + 1}, ${(i % n) + 1}) is not finite (got ${D[i]}).`,
      );
    if (i % (n + 1) !== 0 && D[i] !== 0) diagonal = false;
  }
  if (diagonal) {
    let dMin = Infinity;
    for (let i = 0; i < n; i++) {
      const d = D[i * (n + 1)];
      if (!(d > 0))
        throw new KineticsInputError("diffusion", `Diffusivity of ${species[i]} must be positive (got ${d}).`);
      dMin = Math.min(dMin, d);
    }
    return dMin;
  }
  const e = eigenvalues(D, n);
  const minRe = Math.min(...e.re);
  if (!(minRe > 0)) {
    throw new KineticsInputError(
      "diffusion",
      `The diffusion matrix must have eigenvalues with positive real part (smallest is ${minRe.toPrecision(6)}); otherwise short waves grow without bound.`,
    );
  }
  return 0.5 * minRe;
}
