/**
 * The verification-run line of the side-by-side bench: Schnakenberg (a = 0.1, b = 0.9, γ = 1,
 * d = 20) on a periodic 128² grid of side 64, from the steady state plus noise ± 0.01, to t = 2000,
 * as `numpy_reference.py sim 0 128 64 2000` runs it (first-order IMEX, fixed steps of 0.1). Morphokin
 * runs as a verification run does: adaptive steps, stopping when stationary. Both final
 * wavelengths are printed: Morphokin's read by the readout runs use (lib/cli/simulate-output.ts),
 * numpy's as its script computes it (L / argmax k of the radial power), and Morphokin's the numpy way too.
 */
import { readPattern } from "@/lib/cli/simulate-output";
import {
  schnakenbergReaction,
  schnakenbergSteadyState,
  simulateReactionDiffusion,
  type DiffusionExecutor,
  type SimulationOptions,
  type SimulationResult,
} from "@/lib/simulation";
import { createWorkerExecutor } from "@/lib/parallel";
import type { BenchRow } from "./run";

const N = 128,
  L = 64,
  T = 2000;
/** One cold run a side by default, as the numpy reference is run (`sim 0 …`); SIDE_BY_SIDE_SIM_REPS=3 for medians. */
export const SIM_REPS = Number(process.env.SIDE_BY_SIDE_SIM_REPS ?? 0);
export const SIM_NUMPY_ARGS = ["sim", String(SIM_REPS), String(N), String(L), String(T)];

const [us, vs] = schnakenbergSteadyState(0.1, 0.9);
const options = (endTimeS: number, seed: number): SimulationOptions => ({
  grid: { lengthUm: [L, L], cells: [N, N], boundary: "periodic" },
  diffusionUm2PerS: [1, 20],
  params: { a: 0.1, b: 0.9, gamma: 1 },
  initial: { kind: "steady-state-noise", steadyState: [us, vs], noiseAmplitude: 0.01, seed },
  endTimeS,
  adaptive: {},
  stopWhenStationary: true,
});

/** numpy_reference.py's wavelength: L / k at the peak of the ring-averaged power, k ≥ 1 (integer rings). */
function numpyStyleWavelength(u: Float64Array): number {
  let mean = 0;
  for (const v of u) mean += v / u.length;
  const sums = new Float64Array(N),
    counts = new Float64Array(N);
  // A direct 2-D DFT in two passes (rows, then the half spectrum's columns): about 3 million terms
  // on 128², well under a second, and independent of the FFT code under test.
  const re = new Float64Array(N * N),
    im = new Float64Array(N * N);
  for (let y = 0; y < N; y++)
    for (let k = 0; k < N; k++) {
      let r = 0,
        i = 0;
      for (let x = 0; x < N; x++) {
        const a = (-2 * Math.PI * k * x) / N,
          v = u[y * N + x] - mean;
        r += v * Math.cos(a);
        i += v * Math.sin(a);
      }
      re[y * N + k] = r;
      im[y * N + k] = i;
    }
  for (let k = 0; k <= N / 2; k++)
    for (let q = 0; q < N; q++) {
      let r = 0,
        i = 0;
      for (let y = 0; y < N; y++) {
        const a = (-2 * Math.PI * q * y) / N,
          c = Math.cos(a),
          s = Math.sin(a);
        r += re[y * N + k] * c - im[y * N + k] * s;
        i += re[y * N + k] * s + im[y * N + k] * c;
      }
      const fy = q <= N / 2 ? q : q - N;
      const ring = Math.round(Math.hypot(fy, k));
      if (ring < N) {
        sums[ring] += r * r + i * i;
        counts[ring] += 1;
      }
    }
  let best = 1;
  for (let k = 1; k < N / 2; k++) if (sums[k] / counts[k] > sums[best] / counts[best]) best = k;
  return L / best;
}

export interface NumpySimFigure {
  median: number;
  min: number;
  max: number;
  wavelength?: unknown;
}

/** One thread, then two (the server's default SIMULATION_THREADS = 2: species on two threads). */
export function simRows(np: NumpySimFigure | null): BenchRow[] {
  const rows = [simRow(np, 1)];
  const executor = createWorkerExecutor({ workers: 1 });
  try {
    rows.push(simRow(np, 2, executor));
  } finally {
    executor.dispose();
  }
  return rows;
}

function simRow(np: NumpySimFigure | null, threads: 1 | 2, executor?: DiffusionExecutor): BenchRow {
  simulateReactionDiffusion(schnakenbergReaction, { ...options(20, 1), executor }); // warm-up (JIT), not timed
  const times: number[] = [],
    cpu: number[] = [];
  let last: SimulationResult | null = null;
  for (let i = 0; i < Math.max(1, SIM_REPS); i++) {
    const c0 = process.cpuUsage(),
      t0 = performance.now();
    last = simulateReactionDiffusion(schnakenbergReaction, { ...options(T, 12345 + i), executor });
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  const ms = times[Math.floor(times.length / 2)];
  const r = last!;
  const ro = readPattern(r);
  const said = ro.periodFound
    ? `λ = ${ro.wavelengthUm!.toFixed(3)} (readout), ${numpyStyleWavelength(r.fields[0]).toFixed(3)} (numpy's way), ${ro.symmetry}`
    : "no significant period";
  const a = r.adaptive!;
  const ours = `Morphokin ${(ms / 1000).toFixed(2)} s (CPU ${(cpu[0] / 1000).toFixed(2)} s), ${r.stopReason} at t = ${r.timeS.toFixed(0)}, ${a.acceptedSteps} steps + ${a.rejectedSteps} rejected, ${said}`;
  const theirs = np ? `numpy ${np.median.toFixed(2)} s, λ = ${Number(np.wavelength).toFixed(3)}` : "";
  const name = `side by side: verification run 128² periodic, ${threads} thread${threads === 2 ? "s" : ""}`;
  const goal = "≤ 0.5, λ within 2 %";
  return np
    ? { name, value: ms / (np.median * 1000), unit: "× numpy", target: goal, note: `${ours}; ${theirs}` }
    : { name, value: ms, unit: "ms", target: goal, note: `${ours}; no numpy here, Morphokin alone` };
}
