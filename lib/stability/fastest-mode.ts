/**
 * The fastest-growing mode alone, for two species with diagonal diffusion on an unbounded
 * domain: the one number a wavelength fit needs thousands of times. It runs exactly the
 * arithmetic of {@link computeDispersion} for that mode (same steady states and "auto" choice,
 * same k grid with the det-minimising k merged in, same golden-section refinement, same
 * tolerances), so k* and the flags are identical to computeDispersion's, bit for bit; it only
 * skips what a fit does not read (band edges, the curve, the peaks list, Turing conditions) and
 * reuses one workspace.
 *
 * Why not the closed-form k* of {@link analyseCell2x2}: it is exact, while golden section on the
 * flat top of σ(k) resolves k* only to ~√ε relative (measured 0.6–2·10⁻⁸ on the catalogue's
 * two-species kinetics); a fit whose profiles sit on the edge of the Turing region amplifies
 * such differences, so the fast path must reproduce computeDispersion, not improve on it.
 */
import type { CompiledKinetics } from "../kinetics/types";
import { CLASS_HOPF, CLASS_PEAK, CLASS_UNSTABLE_K0 } from "./classes";
import {
  chooseKMax,
  classifyAtZero,
  classifyPeak,
  createScanWorkspace,
  refinePeak,
  scanGrid,
  tolerancesFor,
  type Peak,
  type ScanWorkspace,
} from "./dispersion-scan";
import { findSteadyStates, MAX_STEADY_STATES } from "./steady-states";

/** The fastest mode of the analysed steady state (model units). */
export interface FastestMode {
  /** Index of the analysed state among the found ones ("auto" choice of computeDispersion). */
  stateIndex: number;
  /** Class flags of that state (CLASS_PEAK, CLASS_HOPF, CLASS_UNSTABLE_K0), as computeDispersion's. */
  flags: number;
  /** Fastest-growing k > 0 (model units⁻¹), or NaN when no k > 0 mode grows. */
  kStar: number;
  /** σ(k*) (model time units⁻¹), or NaN when none grows. */
  sigmaStar: number;
  /** |Im σ(k*)|, or NaN when none grows (0 for a real mode). */
  imSigmaStar: number;
  /** `turing` for a real peak, `wave` for a complex one (as computeDispersion's GrowthPeak.kind), null when none grows. */
  kind: "turing" | "wave" | null;
}

/** A reusable scan workspace for {@link computeFastestMode} (two species, `gridSize` wavenumbers). */
export function createFastestModeWorkspace(gridSize = 200): ScanWorkspace {
  return createScanWorkspace(2, gridSize);
}

/**
 * k*, σ(k*) and class flags of a two-species, diagonal-D kinetics at the resolved parameter
 * vector `p` (order of `kinetics.parameters`) on a grid of `gridSize` wavenumbers, equal to
 * computeDispersion(kinetics, …, { gridSize }).fastest and .classification.flags.
 * Returns null when the fast path does not apply (not 2 species, D not diagonal, gridSize
 * outside 16…100000, a workspace of another size) or the point is irregular (no steady state,
 * a non-positive or non-finite diffusivity, a non-finite Jacobian): the caller then uses
 * computeDispersion, which reports those cases with its own errors.
 * @param ws optional workspace from {@link createFastestModeWorkspace}(gridSize), reused across calls
 */
export function computeFastestMode(
  kinetics: CompiledKinetics,
  p: ArrayLike<number>,
  gridSize = 200,
  ws?: ScanWorkspace,
): FastestMode | null {
  if (kinetics.species.length !== 2 || !kinetics.diagonalDiffusion) return null;
  if (!Number.isInteger(gridSize) || gridSize < 16 || gridSize > 100_000) return null;
  const w = ws ?? createScanWorkspace(2, gridSize);
  if (w.n !== 2 || w.k.length < gridSize + 1) return null;
  const states = steadyStateValues(kinetics, p);
  if (states === null) return null;
  const peak: Peak = { k: 0, sigma: 0, imSigma: 0 };
  // computeDispersion's "auto" choice (pickSteadyState): first state stable at k = 0 and Turing, else first stable, else first.
  let chosen: FastestMode | null = null;
  let rank = 0;
  for (let s = 0; s < states.length; s++) {
    kinetics.jacobian(states[s], p, w.J);
    kinetics.diffusion(p, w.D);
    const J = w.J,
      D = w.D;
    if (!(D[0] > 0 && D[3] > 0 && Number.isFinite(D[0]) && Number.isFinite(D[3]) && D[1] === 0 && D[2] === 0))
      return null;
    if (!(Number.isFinite(J[0]) && Number.isFinite(J[1]) && Number.isFinite(J[2]) && Number.isFinite(J[3])))
      return null;
    // From here on, the steps of analyseState in the same order and with the same helpers.
    const dMin = Math.min(D[0], D[3]);
    const kMax = chooseKMax(J, 2, dMin);
    const { tol, imTol } = tolerancesFor(J, 2);
    let extra = NaN;
    const km2 = (D[3] * J[0] + D[0] * J[3]) / (2 * D[0] * D[3]);
    if (km2 > 0) extra = Math.sqrt(km2);
    scanGrid(w, kMax, gridSize, extra);
    let flags = classifyAtZero(w, tol, imTol);
    let bestK = NaN,
      bestSigma = NaN,
      bestIm = NaN;
    let kind: FastestMode["kind"] = null;
    const re = w.re;
    for (let i = 1; i < w.size - 1; i++) {
      // isInteriorMax(w, i), written out: this loop runs over the whole grid on every call.
      if (!(re[i] >= re[i - 1] && re[i] > re[i + 1]) || !(re[i] > -Math.abs(tol))) continue;
      refinePeak(w, i, peak);
      const flag = classifyPeak(peak, tol, imTol);
      if (!flag) continue;
      flags |= flag;
      // computeDispersion's fastest: the first peak of largest σ.
      if (Number.isNaN(bestSigma) || peak.sigma > bestSigma) {
        bestK = peak.k;
        bestSigma = peak.sigma;
        bestIm = peak.imSigma;
        kind = peak.imSigma > imTol ? "wave" : "turing";
      }
    }
    const stable0 = (flags & (CLASS_HOPF | CLASS_UNSTABLE_K0)) === 0;
    const r = stable0 && flags & CLASS_PEAK ? 3 : stable0 ? 2 : 1;
    if (r > rank) {
      rank = r;
      chosen = { stateIndex: s, flags, kStar: bestK, sigmaStar: bestSigma, imSigmaStar: bestIm, kind };
      if (r === 3) break;
    }
  }
  return chosen;
}

/**
 * The states findSteadyStates would return (values only, same order, same filtering and the same
 * clamping of round-off negatives), without their eigenvalues; null when there is none.
 */
function steadyStateValues(kinetics: CompiledKinetics, p: ArrayLike<number>): number[][] | null {
  if (!kinetics.steadyStates) {
    try {
      return findSteadyStates(kinetics, p).map((s) => s.values);
    } catch {
      return null;
    }
  }
  const n = kinetics.species.length;
  const buf = new Float64Array(n * MAX_STEADY_STATES);
  const m = kinetics.steadyStates(p, buf);
  const out: number[][] = [];
  for (let s = 0; s < m; s++) {
    const c = new Array<number>(n);
    let ok = true;
    for (let i = 0; i < n; i++) {
      let x = buf[s * n + i];
      if (!Number.isFinite(x)) ok = false;
      else if (kinetics.nonNegative) {
        if (x < 0 && x > -1e-9 * (1 + Math.abs(x))) x = 0;
        if (!(x >= 0)) ok = false;
      }
      c[i] = x;
    }
    if (ok) out.push(c);
  }
  return out.length > 0 ? out : null;
}
