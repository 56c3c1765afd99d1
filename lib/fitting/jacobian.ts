import { Matrix } from "ml-matrix";
import type { ParameterSpace } from "./parameter-space";

/** Residuals as a function of solver coordinates. */
export type ResidualFunction = (u: readonly number[]) => Float64Array;

/** Relative step for central differences: ε^(1/3) balances truncation O(h²) against rounding O(ε/h). */
const CENTRAL_STEP = Math.cbrt(Number.EPSILON);

function allFinite(r: Float64Array): boolean {
  for (let i = 0; i < r.length; i++) if (!Number.isFinite(r[i])) return false;
  return true;
}

/**
 * Jacobian ∂rᵢ/∂uⱼ (n × p) by central differences, h = ε^(1/3)·max(|uⱼ|, typicalⱼ). Where a step
 * would leave the box, or lands on an inadmissible point, the second-order one-sided formula
 * (−3f(u) + 4f(u+h) − f(u+2h))/(2h) is used on the side that stays inside (a standard
 * finite-difference stencil; Fornberg 1988, Math. Comp. 51:699). Columns that cannot be
 * differenced at all are left at zero.
 */
export function computeJacobian(
  f: ResidualFunction,
  u: readonly number[],
  r0: Float64Array,
  space: ParameterSpace,
  typical: readonly number[],
): { jacobian: Matrix; evaluations: number } {
  const n = r0.length;
  const p = u.length;
  const J = new Matrix(n, p);
  let evaluations = 0;
  const at = (j: number, delta: number): Float64Array | null => {
    const v = u.slice();
    v[j] += delta;
    evaluations++;
    const r = f(v);
    return allFinite(r) ? r : null;
  };
  for (let j = 0; j < p; j++) {
    const h = CENTRAL_STEP * Math.max(Math.abs(u[j]), typical[j]);
    const roomUp = u[j] + h <= space.upperU[j];
    const roomDown = u[j] - h >= space.lowerU[j];
    const plus = roomUp ? at(j, h) : null;
    const minus = roomDown ? at(j, -h) : null;
    if (plus && minus) {
      for (let i = 0; i < n; i++) J.set(i, j, (plus[i] - minus[i]) / (2 * h));
      continue;
    }
    const side = plus ? 1 : minus ? -1 : u[j] + 2 * h <= space.upperU[j] ? 1 : -1;
    const near = plus ?? minus ?? at(j, side * h);
    const far =
      near && (side > 0 ? u[j] + 2 * h <= space.upperU[j] : u[j] - 2 * h >= space.lowerU[j])
        ? at(j, 2 * side * h)
        : null;
    if (near && far) {
      for (let i = 0; i < n; i++) J.set(i, j, (side * (-3 * r0[i] + 4 * near[i] - far[i])) / (2 * h));
    } else if (near) {
      for (let i = 0; i < n; i++) J.set(i, j, (side * (near[i] - r0[i])) / h);
    }
  }
  return { jacobian: J, evaluations };
}

/** Analytic Jacobian in natural units → solver coordinates (chain rule: ∂θ/∂u = θ for log scale). */
export function jacobianToInternal(
  jacobianNatural: number[][],
  theta: readonly number[],
  space: ParameterSpace,
): Matrix {
  const J = new Matrix(jacobianNatural);
  for (let j = 0; j < space.size; j++) {
    if (!space.log[j]) continue;
    for (let i = 0; i < J.rows; i++) J.set(i, j, J.get(i, j) * theta[j]);
  }
  return J;
}
