/**
 * Closed-form Turing conditions for two species with diagonal diffusion
 * (Murray J.D. 2003, Mathematical Biology II, 3rd ed., §2.3):
 *   f_u + g_v < 0,  det J > 0,  D_v f_u + D_u g_v > 0,  (D_v f_u + D_u g_v)² > 4 D_u D_v det J;
 * the critical ratio d_c = D_v/D_u solves f_u² d² + 2(2 f_v g_u − f_u g_v) d + g_v² = 0 with
 * d f_u + g_v > 0, and at threshold k_c² = (d_c f_u + g_v)/(2 d_c D_u).
 */
import { solveQuadraticReal } from "../kinetics/cubic";

export interface TuringCondition {
  /** The inequality, e.g. "f_u + g_v < 0". */
  name: string;
  /** Its left-hand side minus right-hand side, in the sign convention of the name. */
  value: number;
  satisfied: boolean;
}

export interface TwoSpeciesTuringConditions {
  conditions: TuringCondition[];
  allSatisfied: boolean;
  /** D_v/D_u now. */
  diffusionRatio: number;
  /** Critical ratio d_c = D_v/D_u at the Turing threshold (with D_u fixed), or null when undefined (J not stable). */
  criticalRatio: number | null;
  /** Turing instability needs D_v/D_u above d_c when f_u > 0 (u activates), below it when f_u < 0 (v activates). */
  unstableWhenRatio: "above" | "below" | null;
  /** Critical wavenumber at the threshold (model units⁻¹), or null. */
  criticalWavenumber: number | null;
  /** k minimising det(J − k²D) at the current D: k_m² = (D_v f_u + D_u g_v)/(2 D_u D_v), or null when ≤ 0. */
  detMinimumWavenumber: number | null;
}

/** J = [f_u, f_v, g_u, g_v] row-major, Du and Dv the diagonal of D. */
export function computeTuringConditions(J: ArrayLike<number>, Du: number, Dv: number): TwoSpeciesTuringConditions {
  const fu = J[0],
    fv = J[1],
    gu = J[2],
    gv = J[3];
  const tr = fu + gv,
    det = fu * gv - fv * gu;
  const cross = Dv * fu + Du * gv;
  const disc = cross * cross - 4 * Du * Dv * det;
  const conditions: TuringCondition[] = [
    { name: "f_u + g_v < 0", value: tr, satisfied: tr < 0 },
    { name: "f_u g_v − f_v g_u > 0", value: det, satisfied: det > 0 },
    { name: "D_v f_u + D_u g_v > 0", value: cross, satisfied: cross > 0 },
    { name: "(D_v f_u + D_u g_v)² − 4 D_u D_v det J > 0", value: disc, satisfied: disc > 0 },
  ];
  let criticalRatio: number | null = null;
  let criticalWavenumber: number | null = null;
  if (tr < 0 && det > 0) {
    const roots = new Float64Array(2);
    const m = solveQuadraticReal(fu * fu, 2 * (2 * fv * gu - fu * gv), gv * gv, roots);
    for (let i = 0; i < m; i++) {
      const d = roots[i];
      if (d > 0 && d * fu + gv > 0 && (criticalRatio === null || d < criticalRatio)) criticalRatio = d;
    }
    if (criticalRatio !== null) criticalWavenumber = Math.sqrt((criticalRatio * fu + gv) / (2 * criticalRatio * Du));
  }
  const km2 = cross / (2 * Du * Dv);
  return {
    conditions,
    allSatisfied: conditions.every((c) => c.satisfied),
    diffusionRatio: Dv / Du,
    criticalRatio,
    unstableWhenRatio: criticalRatio === null ? null : fu > 0 ? "above" : "below",
    criticalWavenumber,
    detMinimumWavenumber: km2 > 0 ? Math.sqrt(km2) : null,
  };
}
