import type { ResidualFunction } from "./jacobian";
import type { ParameterSpace } from "./parameter-space";
import { polishLevenbergMarquardt, type JacobianProvider, type PolishOptions } from "./polish-levenberg-marquardt";
import { CONVERGED_REASONS } from "./types";

/** Everything a re-optimisation needs, in solver coordinates. */
export interface SolverContext {
  f: ResidualFunction;
  space: ParameterSpace;
  typical: number[];
  polish: PolishOptions;
  jacobian?: JacobianProvider;
}

/** A re-optimised point with one coordinate held fixed. */
export interface ConditionalFit {
  /** Full coordinate vector (the fixed one included). */
  u: number[];
  chiSquare: number;
  converged: boolean;
}

/**
 * Re-optimise every coordinate but `j`, which is held at `value` (solver coordinates), starting
 * from `warm`: the inner step of profile likelihood and of valley tracing. With a single
 * parameter there is nothing to re-optimise and χ² is simply evaluated.
 */
export function fitWithFixed(ctx: SolverContext, j: number, value: number, warm: readonly number[]): ConditionalFit {
  const insert = (w: readonly number[]) => [...w.slice(0, j), value, ...w.slice(j)];
  const drop = <T>(v: readonly T[]) => [...v.slice(0, j), ...v.slice(j + 1)];
  if (ctx.space.size === 1) {
    const r = ctx.f([value]);
    const chi = r.reduce((s, x) => s + x * x, 0);
    return { u: [value], chiSquare: Number.isFinite(chi) ? chi : Infinity, converged: Number.isFinite(chi) };
  }
  const sub: ParameterSpace = {
    size: ctx.space.size - 1,
    log: drop(ctx.space.log),
    lowerU: drop(ctx.space.lowerU),
    upperU: drop(ctx.space.upperU),
  };
  const f: ResidualFunction = (w) => ctx.f(insert(w));
  const full = ctx.jacobian;
  const jacobian: JacobianProvider | undefined = full
    ? (w, r) => {
        const { jacobian: J, evaluations } = full(insert(w), r);
        return { jacobian: J.clone().removeColumn(j), evaluations };
      }
    : undefined;
  const res = polishLevenbergMarquardt(f, drop(warm), sub, drop(ctx.typical), ctx.polish, jacobian);
  return { u: insert(res.u), chiSquare: res.chiSquare, converged: CONVERGED_REASONS.includes(res.reason) };
}
