/**
 * The one way Morphokin starts a worker thread (Turing-map rows, the solver's spectral stage).
 * From TypeScript (tsx, vitest) a worker does not inherit the parent's loader hooks, so it starts
 * through `worker-bootstrap.cjs`, which registers tsx's CommonJS hook and requires the `.ts` entry;
 * from a compiled build it starts the `.js` entry beside this file directly.
 */
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";

/**
 * A shared word a worker sets to 1 when it fails. A parent blocked in `Atomics.wait` cannot see
 * the worker's "error" event, so it polls this word instead (see awaitWord in worker-executor.ts).
 */
export interface FailureWord {
  words: Int32Array;
  index: number;
}

/** Raises the failure word carried in a worker's data, if any (called by a failing worker). */
export function raiseFailureWord(data: { failure?: FailureWord } | null | undefined): void {
  if (data?.failure) Atomics.store(data.failure.words, data.failure.index, 1);
}

/**
 * Starts the worker entry `entry` (a file name in lib/parallel without extension) with
 * `workerData`; include `failure` to have any throw in the worker, start-up included, raise it.
 */
export function startWorker(entry: string, workerData: { failure?: FailureWord; [key: string]: unknown } = {}): Worker {
  const here = import.meta.url;
  if (here.endsWith(".ts")) {
    const entryPath = fileURLToPath(new URL(`./${entry}.ts`, here));
    return new Worker(new URL("./worker-bootstrap.cjs", here), { workerData: { ...workerData, entryPath } });
  }
  return new Worker(new URL(`./${entry}.js`, here), { workerData });
}
