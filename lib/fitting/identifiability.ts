import { SINGULAR_RATIO_LIMIT, type CovarianceReport } from "./covariance";
import type { ProfileLikelihood } from "./profile-likelihood";

/** Whether the data pin the parameters down, with the reasons in plain language. */
export interface Identifiability {
  identifiable: boolean;
  /** One sentence per problem found; empty when identifiable. */
  reasons: string[];
  /** Smallest / largest singular value of the relative-sensitivity Jacobian. */
  singularRatio: number;
  /** Indices of parameters whose profile never rose by the threshold on either side. */
  flatParameters: number[];
}

const fmt = (v: number) => Number(v.toPrecision(4)).toString();

/**
 * The three tests of SCIENCE.md §7: n ≤ p; a singular value of J below 1e-8 of the largest;
 * a flat profile. Each failure is described in words a bench scientist can act on.
 */
export function assessIdentifiability(
  n: number,
  names: readonly string[],
  cov: CovarianceReport,
  profiles: readonly ProfileLikelihood[] | null,
  delta: number,
): Identifiability {
  const p = names.length;
  const reasons: string[] = [];
  if (n <= p) {
    reasons.push(
      `${n} measurement${n === 1 ? "" : "s"} cannot determine ${p} free parameter${p === 1 ? "" : "s"}: at least ${p + 1} are needed to fit and judge the fit.`,
    );
  }
  if (cov.nullDirections.length > 0) {
    const dir = cov.nullDirections[0];
    const parts = dir
      .map((c, j) => ({ c, j }))
      .filter(({ c }) => Math.abs(c) >= 0.1)
      .map(({ c, j }) => `${names[j]} by ${c > 0 ? "+" : "−"}${fmt(Math.abs(c))}`);
    reasons.push(
      `The data cannot tell apart solutions along one combination of parameters (smallest singular value of the sensitivity matrix is ${fmt(cov.singularRatio)} of the largest, below ${SINGULAR_RATIO_LIMIT}): changing ${parts.join(" and ")} (relative changes) leaves every prediction unchanged.`,
    );
  }
  const flatParameters: number[] = [];
  profiles?.forEach((prof, j) => {
    if (!prof.flat) return;
    flatParameters.push(j);
    const lo = prof.points[0].value;
    const hi = prof.points[prof.points.length - 1].value;
    reasons.push(
      `χ² does not rise by ${fmt(delta)} anywhere between ${names[j]} = ${fmt(lo)} and ${fmt(hi)}: the data do not bound ${names[j]}.`,
    );
  });
  return { identifiable: reasons.length === 0, reasons, singularRatio: cov.singularRatio, flatParameters };
}
