/**
 * The inner loop of a Turing map: for each cell, steady state (closed form, or Newton warm-
 * started from the neighbouring cell), Jacobian, and the class flags with the fastest k > 0
 * peak: exact and grid-free for two species with diagonal D (cell-2x2.ts), otherwise σ(k) on
 * the k grid with the largest local maximum refined by golden section.
 * Buffers are allocated once per call; the per-cell work allocates nothing for catalogue
 * two-species kinetics.
 */
import { KineticsAnalysisError } from "../kinetics/errors";
import type { CompiledKinetics } from "../kinetics/types";
import { CLASS_HOPF, CLASS_INVALID, CLASS_NO_STEADY_STATE, CLASS_PEAK, CLASS_UNSTABLE_K0 } from "./classes";
import { analyseCell2x2 } from "./cell-2x2";
import { checkDiffusion } from "./diffusion-check";
import {
  chooseKMax,
  classifyAtZero,
  classifyPeak,
  createScanWorkspace,
  isInteriorMax,
  refinePeak,
  scanGrid,
  tolerancesFor,
  type Peak,
} from "./dispersion-scan";
import type { MapPlan } from "./map-plan";
import { createNewtonWorkspace, runNewton } from "./newton";
import { findSteadyStates, MAX_STEADY_STATES } from "./steady-states";

/** Rows [y0, y1) of a map, row-major (index (iy − y0)·nx + ix). */
export interface MapRows {
  y0: number;
  y1: number;
  classes: Uint8Array;
  /** 2π/k* in model units; NaN where no k > 0 maximum grows. */
  wavelength: Float64Array;
  sigmaStar: Float64Array;
}

export function computeMapRows(
  kinetics: CompiledKinetics,
  plan: MapPlan,
  y0: number,
  y1: number,
  startedAtMs = Date.now(),
): MapRows {
  const n = kinetics.species.length,
    nx = plan.x.n,
    size = (y1 - y0) * nx;
  const out: MapRows = {
    y0,
    y1,
    classes: new Uint8Array(size),
    wavelength: new Float64Array(size).fill(NaN),
    sigmaStar: new Float64Array(size).fill(NaN),
  };
  const p = Float64Array.from(plan.base);
  const ws = createScanWorkspace(n, plan.wavenumbers);
  const states = new Float64Array(n * MAX_STEADY_STATES);
  const newton = createNewtonWorkspace(n);
  const peak: Peak = { k: 0, sigma: 0, imSigma: 0 };
  let warm = false;
  const deadline = startedAtMs + plan.timeLimitMs;
  for (let iy = y0; iy < y1; iy++) {
    if (Date.now() > deadline)
      throw new KineticsAnalysisError(
        "timeLimitMs",
        `The Turing map exceeded its time limit of ${plan.timeLimitMs} ms.`,
      );
    p[plan.y.index] = plan.y.values[iy];
    for (let ix = 0; ix < nx; ix++) {
      p[plan.x.index] = plan.x.values[ix];
      const cell = (iy - y0) * nx + ix;
      const m = steadyStatesOfCell(kinetics, p, states, newton, warm);
      warm = m > 0 && !kinetics.steadyStates;
      if (m === 0) {
        out.classes[cell] = CLASS_NO_STEADY_STATE;
        continue;
      }
      // Same choice as computeDispersion's "auto": first stable Turing state, else first stable, else first.
      let chosen = -1,
        chosenFlags = 0,
        chosenSigma = NaN,
        chosenK = NaN,
        rank = 0;
      for (let s = 0; s < m; s++) {
        const flags = analyseCell(kinetics, p, states, s, ws, plan.wavenumbers, peak);
        const stable0 = flags >= 0 && (flags & (CLASS_HOPF | CLASS_UNSTABLE_K0)) === 0;
        const r = flags < 0 ? 0 : stable0 && flags & CLASS_PEAK ? 3 : stable0 ? 2 : 1;
        if (r > rank) {
          rank = r;
          chosen = s;
          chosenFlags = flags;
          chosenSigma = peak.sigma;
          chosenK = peak.k;
          if (r === 3) break;
        }
      }
      if (chosen < 0) {
        out.classes[cell] = CLASS_INVALID;
        continue;
      }
      out.classes[cell] = chosenFlags;
      if (chosenK > 0) {
        out.wavelength[cell] = (2 * Math.PI) / chosenK;
        out.sigmaStar[cell] = chosenSigma;
      }
    }
  }
  return out;
}

/**
 * Flags of state s (−1 when the cell cannot be evaluated); `peak` receives the fastest
 * growing k > 0 maximum (k = NaN when none).
 */
function analyseCell(
  kinetics: CompiledKinetics,
  p: Float64Array,
  states: Float64Array,
  s: number,
  ws: ReturnType<typeof createScanWorkspace>,
  grid: number,
  peak: Peak,
): number {
  const n = ws.n;
  kinetics.jacobian(states.subarray(s * n, s * n + n), p, ws.J);
  kinetics.diffusion(p, ws.D);
  let dMin: number;
  if (n === 2 && kinetics.diagonalDiffusion) {
    dMin = Math.min(ws.D[0], ws.D[3]);
    if (!(dMin > 0)) return -1;
    const J = ws.J;
    if (!(Number.isFinite(J[0]) && Number.isFinite(J[1]) && Number.isFinite(J[2]) && Number.isFinite(J[3]))) return -1;
    return analyseCell2x2(J, ws.D[0], ws.D[3], peak);
  } else {
    try {
      dMin = checkDiffusion(ws.D, n, kinetics.species);
    } catch {
      return -1;
    }
  }
  for (let i = 0; i < n * n; i++) if (!Number.isFinite(ws.J[i])) return -1;
  const { tol, imTol } = tolerancesFor(ws.J, n);
  let extra = NaN;
  if (n === 2 && kinetics.diagonalDiffusion) {
    const km2 = (ws.D[3] * ws.J[0] + ws.D[0] * ws.J[3]) / (2 * ws.D[0] * ws.D[3]);
    if (km2 > 0) extra = Math.sqrt(km2);
  }
  scanGrid(ws, chooseKMax(ws.J, n, dMin), grid, extra);
  let flags = classifyAtZero(ws, tol, imTol);
  let bestK = NaN,
    bestSigma = -Infinity,
    bestIm = 0;
  for (let i = 1; i < ws.size - 1; i++) {
    if (!isInteriorMax(ws, i) || !(ws.re[i] > -Math.abs(tol))) continue;
    refinePeak(ws, i, peak);
    const f = classifyPeak(peak, tol, imTol);
    if (f) {
      flags |= f;
      if (peak.sigma > bestSigma) {
        bestSigma = peak.sigma;
        bestK = peak.k;
        bestIm = peak.imSigma;
      }
    }
  }
  peak.k = bestK;
  peak.sigma = bestSigma;
  peak.imSigma = bestIm;
  return flags;
}

function steadyStatesOfCell(
  kinetics: CompiledKinetics,
  p: Float64Array,
  out: Float64Array,
  newton: ReturnType<typeof createNewtonWorkspace>,
  warm: boolean,
): number {
  const n = kinetics.species.length;
  let m = 0;
  if (kinetics.steadyStates) {
    const raw = kinetics.steadyStates(p, out);
    for (let s = 0; s < raw; s++) {
      let ok = true;
      for (let i = 0; i < n; i++) {
        const v = out[s * n + i];
        if (!Number.isFinite(v) || (kinetics.nonNegative && v < 0)) ok = false;
      }
      if (ok) {
        if (m !== s) out.copyWithin(m * n, s * n, s * n + n);
        m++;
      }
    }
    return m;
  }
  if (warm) {
    // Start from the previous cell's state (newton.x still holds it): one Newton run suffices on smooth maps.
    if (runNewton(kinetics, p, newton) && (!kinetics.nonNegative || newton.x.every((v) => v >= 0))) {
      out.set(newton.x);
      return 1;
    }
  }
  try {
    const found = findSteadyStates(kinetics, p);
    for (const st of found.slice(0, MAX_STEADY_STATES)) out.set(st.values, n * m++);
    newton.x.set(found[0].values);
  } catch {
    return 0;
  }
  return m;
}
