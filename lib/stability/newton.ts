/**
 * Damped Newton iteration for R(c) = 0 from one starting point (common practice, no source:
 * full step, halved while the residual norm does not decrease). Works in caller buffers.
 */
import type { CompiledKinetics } from "../kinetics/types";
import { solveLinearInPlace } from "./linear-solve";

export interface NewtonWorkspace {
  x: Float64Array;
  r: Float64Array;
  j: Float64Array;
  step: Float64Array;
  trial: Float64Array;
  rTrial: Float64Array;
}

export function createNewtonWorkspace(n: number): NewtonWorkspace {
  return {
    x: new Float64Array(n),
    r: new Float64Array(n),
    j: new Float64Array(n * n),
    step: new Float64Array(n),
    trial: new Float64Array(n),
    rTrial: new Float64Array(n),
  };
}

/** Most Newton iterations per start. */
export const NEWTON_MAX_ITERATIONS = 80;

function maxAbs(v: Float64Array): number {
  let m = 0;
  for (let i = 0; i < v.length; i++) m = Math.max(m, Math.abs(v[i]));
  return m;
}

/**
 * Runs Newton from `ws.x` (set by the caller); on success `ws.x` holds the root and true is
 * returned. Converged: step ≤ 1e-11·(1 + |x|∞) and residual ≤ 1e-8·(1 + |x|∞).
 */
export function runNewton(kinetics: CompiledKinetics, p: ArrayLike<number>, ws: NewtonWorkspace): boolean {
  const n = ws.x.length;
  kinetics.rates(ws.x, p, ws.r);
  let norm = maxAbs(ws.r);
  if (!Number.isFinite(norm)) return false;
  for (let it = 0; it < NEWTON_MAX_ITERATIONS; it++) {
    kinetics.jacobian(ws.x, p, ws.j);
    for (let i = 0; i < n; i++) ws.step[i] = -ws.r[i];
    if (!solveLinearInPlace(ws.j, ws.step, n)) return false;
    let lambda = 1;
    let accepted = false;
    for (let h = 0; h < 30; h++) {
      for (let i = 0; i < n; i++) ws.trial[i] = ws.x[i] + lambda * ws.step[i];
      kinetics.rates(ws.trial, p, ws.rTrial);
      const tn = maxAbs(ws.rTrial);
      if (Number.isFinite(tn) && (tn < norm || tn === 0)) {
        accepted = true;
        norm = tn;
        break;
      }
      lambda *= 0.5;
    }
    const stepNorm = lambda * maxAbs(ws.step);
    const scale = 1 + maxAbs(ws.x);
    if (!accepted) return norm <= 1e-8 * scale && stepNorm <= 1e-6 * scale;
    ws.x.set(ws.trial);
    ws.r.set(ws.rTrial);
    if (stepNorm <= 1e-11 * scale && norm <= 1e-8 * scale) return true;
    if (norm === 0) return true;
  }
  return norm <= 1e-9 * (1 + maxAbs(ws.x));
}
