import type { Worker } from "node:worker_threads";
import { createSpectralBasis } from "../simulation/spectral-basis";
import { runDiffusionStage, type StageMode } from "../simulation/diffusion-stage";
import type { DiffusionExecutor, DiffusionLayout } from "../simulation/executor";
import { startWorker } from "./start-worker";

/** Options of {@link createWorkerExecutor}. */
export interface WorkerExecutorOptions {
  /** Worker threads besides the calling thread. @default 1 (two cores in all) */
  workers?: number;
}

/** Control words per worker in the shared Int32Array: generation, mode, work index, done generation. */
const WORDS = 4;
const STOP = -1;
/** Busy-wait iterations before sleeping (~0.1–0.5 ms). */
const SPIN_LOOPS = 200_000;

/**
 * Runs the spectral stage of different species on different threads: species s goes to thread
 * s mod (workers + 1), thread 0 being the caller. Buffers live in SharedArrayBuffer; each step
 * the caller bumps a generation word, wakes the workers with Atomics.notify, does its own
 * species and waits (Atomics.wait, allowed on Node's main thread) until every worker echoes
 * the generation. Results are bit-identical to the serial executor (same code, same order per species).
 */
export function createWorkerExecutor(options: WorkerExecutorOptions = {}): DiffusionExecutor {
  const workerCount = options.workers ?? 1;
  // One block of WORDS per worker, then one failure word set by a worker that throws.
  const ctrl = new Int32Array(new SharedArrayBuffer(4 * (WORDS * Math.max(1, workerCount) + 1)));
  const failIndex = ctrl.length - 1;
  const maxAbsOut = new Float64Array(new SharedArrayBuffer(8 * Math.max(1, workerCount)));
  const threads: Worker[] = [];
  let own: number[] = [];
  let layout: DiffusionLayout | null = null;
  let basis: ReturnType<typeof createSpectralBasis> | null = null;
  let generation = 0;
  const stopThreads = () => {
    generation++;
    for (let w = 0; w < threads.length; w++) {
      ctrl[w * WORDS + 1] = STOP;
      Atomics.store(ctrl, w * WORDS, generation);
      Atomics.notify(ctrl, w * WORDS);
    }
    for (const t of threads) void t.terminate();
    threads.length = 0;
  };
  return {
    allocate: (length) => new Float64Array(new SharedArrayBuffer(8 * length)),
    prepare(l) {
      stopThreads(); // an executor reused for a second run restarts its threads
      ctrl.fill(0);
      generation = 0;
      layout = l;
      basis = createSpectralBasis(l.grid);
      const n = l.buffers.length;
      const active = Math.min(workerCount, n - 1);
      own = [];
      for (let s = 0; s < n; s++) if (s % (active + 1) === 0) own.push(s);
      for (let w = 0; w < active; w++) {
        const species = [];
        for (let s = 0; s < n; s++) if (s % (active + 1) === w + 1) species.push(s);
        threads.push(spawnDiffusionWorker({ layout: l, species, ctrl, maxAbsOut, slot: w, failIndex }));
      }
    },
    run(mode: StageMode, workIndex: 0 | 1) {
      const l = layout!;
      generation++;
      for (let w = 0; w < threads.length; w++) {
        ctrl[w * WORDS + 1] = mode;
        ctrl[w * WORDS + 2] = workIndex;
        Atomics.store(ctrl, w * WORDS, generation);
        Atomics.notify(ctrl, w * WORDS);
      }
      let maxAbs = 0;
      const take = (m: number) => {
        if (!(m <= maxAbs)) maxAbs = Number.isNaN(maxAbs) ? maxAbs : m; // NaN sticks
      };
      for (const s of own) take(runDiffusionStage(basis!, l.coefficients[s], l.buffers[s], mode, workIndex));
      for (let w = 0; w < threads.length; w++) {
        awaitWord(ctrl, w * WORDS + 3, generation, failIndex);
        take(maxAbsOut[w]);
      }
      return maxAbs;
    },
    dispose() {
      stopThreads();
      layout = null;
      basis = null;
    },
  };
}

/**
 * Waits until ctrl[index] === value: spins briefly (a step's stages take milliseconds, and a
 * futex wake-up costs tens of microseconds), then sleeps in Atomics.wait, re-checking the
 * failure word every 100 ms (the main thread cannot see a worker's "error" event while it blocks).
 */
export function awaitWord(ctrl: Int32Array, index: number, value: number, failIndex: number): void {
  for (let spin = 0; spin < SPIN_LOOPS; spin++) if (Atomics.load(ctrl, index) === value) return;
  for (;;) {
    const seen = Atomics.load(ctrl, index);
    if (seen === value) return;
    if (Atomics.load(ctrl, failIndex) !== 0) {
      throw new Error("A simulation worker thread failed (its error is printed above); the run cannot continue.");
    }
    Atomics.wait(ctrl, index, seen, 100);
  }
}

/** Starts diffusion-worker; any throw there (start-up or a stage) sets the shared failure word so run() stops waiting. */
function spawnDiffusionWorker(workerData: { ctrl: Int32Array; failIndex: number; [key: string]: unknown }): Worker {
  const worker = startWorker("diffusion-worker", {
    ...workerData,
    failure: { words: workerData.ctrl, index: workerData.failIndex },
  });
  worker.on("error", (err) => console.error("simulation worker failed:", err));
  return worker;
}
