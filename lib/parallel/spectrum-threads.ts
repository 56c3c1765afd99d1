/**
 * A SpectrumExecutor that splits the readout's 2-D FFT with one worker thread: the worker takes
 * the second half of the rows, then the second half of the columns, while the calling thread
 * does the first halves; between the two stages both wait for each other. A pass over an image's
 * rows (splitRows: the whole-frame residual pass) is split the same way. Like the solver's
 * executor (worker-executor.ts) it stays synchronous: the caller wakes the worker through a
 * shared word and blocks in Atomics.wait (allowed on Node's main thread), and the worker takes
 * the job's buffers with receiveMessageOnPort(parentPort), so readWavelength stays synchronous.
 * Every row and column is one transform by the same code on either thread: the numbers are
 * bit-identical to one thread (tests/lib/parallel/spectrum-threads.test.ts).
 */
import type { Worker } from "node:worker_threads";
import {
  halfSpectrumLength,
  transformColumnsToPower,
  transformRows,
  type HalfPowerJob,
  type RowKernel,
  type SpectrumExecutor,
} from "../fft";
import { startWorker } from "./start-worker";
import { awaitWord } from "./worker-executor";

/** Control words: [0] generation (caller → worker), [1] stage done (worker → caller), [2] failure, [3] a row kernel's result. */
const GEN = 0,
  DONE = 1,
  FAIL = 2,
  RESULT = 3;

export interface SpectrumThreads extends SpectrumExecutor {
  splitRows: NonNullable<SpectrumExecutor["splitRows"]>;
  /** Stops the worker thread; later jobs run on the calling thread. */
  dispose(): void;
}

/** Starts the worker thread (it does not keep the process alive). */
export function createSpectrumThreads(): SpectrumThreads {
  const ctrl = new Int32Array(new SharedArrayBuffer(4 * 4));
  let worker: Worker | null = startWorker("spectrum-worker", { ctrl, failure: { words: ctrl, index: FAIL } });
  worker.unref();
  worker.on("error", (err) => console.error("spectrum worker failed:", err));
  let generation = 0;
  // The working buffers (half spectrum, the worker's rows) are reused by the next job of the same
  // size, as in realPowerSpectrum2d: fresh ones cost their page faults every readout. WeakRefs, so
  // they never keep memory the collector wants back. The power array is the caller's and new,
  // unless the caller keeps nothing of it (reusePower): then it is reused too.
  const kept: Array<WeakRef<SharedArrayBuffer> | null> = [null, null, null];
  const reuse = (slot: number, byteLength: number): SharedArrayBuffer => {
    const old = kept[slot]?.deref();
    if (old && old.byteLength === byteLength) return old;
    const fresh = new SharedArrayBuffer(byteLength);
    kept[slot] = new WeakRef(fresh);
    return fresh;
  };
  /** Starts a stage on the worker (it echoes the generation in DONE when finished). */
  const start = () => {
    Atomics.store(ctrl, GEN, ++generation);
    Atomics.notify(ctrl, GEN);
  };
  return {
    halfPower(job: HalfPowerJob): Float32Array | null {
      if (!worker || Atomics.load(ctrl, FAIL) !== 0) return null;
      const { src, srcWidth, srcHeight, width, height } = job;
      const halfWidth = width / 2 + 1;
      const bytes = job.precision === "float64" ? 8 : 4;
      const halfBuffer = reuse(0, bytes * halfSpectrumLength(width, height));
      const half = bytes === 8 ? new Float64Array(halfBuffer) : new Float32Array(halfBuffer);
      const power = new Float32Array(
        job.reusePower ? reuse(2, 4 * halfWidth * height) : new SharedArrayBuffer(4 * halfWidth * height),
      );
      // Rows are transformed in pairs, so the split falls on an even row; the worker's rows are
      // copied into shared memory, unless the image is in shared memory already (readWavelength's).
      const rowSplit = 2 * Math.ceil(srcHeight / 4);
      const inShared = src.buffer instanceof SharedArrayBuffer;
      const shared = inShared ? src : new Float32Array(reuse(1, 4 * (srcHeight - rowSplit) * srcWidth));
      if (!inShared) shared.set(src.subarray(rowSplit * srcWidth));
      const srcFirstRow = inShared ? 0 : rowSplit;
      const colSplit = 4 * Math.ceil(halfWidth / 8); // on a block of the half spectrum (halfSpectrumLength)
      worker.postMessage({ ...job, src: shared, rowOffset: rowSplit, srcFirstRow, half, power, colSplit });
      start();
      transformRows(src, srcWidth, srcHeight, width, half, job.windowX, job.windowY, 0, rowSplit);
      awaitWord(ctrl, DONE, generation, FAIL);
      start();
      transformColumnsToPower(half, halfWidth, height, srcHeight, power, 0, colSplit);
      awaitWord(ctrl, DONE, generation, FAIL);
      return power;
    },
    splitRows(kernel: RowKernel, job: object, split: number, end: number, own: () => boolean): boolean | null {
      if (!worker || Atomics.load(ctrl, FAIL) !== 0) return null;
      worker.postMessage({ kernel, job, from: split, to: end });
      start();
      let mine: boolean;
      try {
        mine = own();
      } finally {
        // Whatever the caller's part did, the worker finishes its rows before the arrays are reused.
        awaitWord(ctrl, DONE, generation, FAIL);
      }
      return mine && Atomics.load(ctrl, RESULT) === 1;
    },
    dispose() {
      if (!worker) return;
      void worker.terminate();
      worker = null;
    },
  };
}

/**
 * The executor a readout process installs: its thread starts with the first job large enough to be
 * split (the FFT of ≥ 2²⁰ bins, the whole-frame pass of ≥ 2²⁰ pixels), so a small image costs none.
 */
export function startSpectrumThreadsOnDemand(): SpectrumExecutor {
  let threads: SpectrumThreads | null = null;
  const started = () => (threads ??= createSpectrumThreads());
  return {
    halfPower: (job) => started().halfPower(job),
    splitRows: (kernel, job, split, end, own) => started().splitRows(kernel, job, split, end, own),
  };
}
