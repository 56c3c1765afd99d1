/**
 * A small pool of worker threads for Turing-map rows (Node only). Workers run `map-worker`,
 * started by start-worker.ts (tsx or a compiled build). If a worker cannot start, the pool has
 * size 0 and callers compute in-process.
 */
import os from "node:os";
import type { Worker } from "node:worker_threads";
import type { MapReply, MapTask } from "./messages";
import { startWorker } from "./start-worker";

/** How long a worker may take to start before the pool gives up on workers, ms. */
export const WORKER_START_TIMEOUT_MS = 15_000;

/** Default pool size: the machine's available parallelism, at most 8. */
export function defaultWorkerCount(): number {
  const n = typeof os.availableParallelism === "function" ? os.availableParallelism() : os.cpus().length;
  return Math.max(1, Math.min(8, n));
}

export interface MapWorkerPool {
  /** Number of live workers (0 when workers are unavailable). */
  size: number;
  run(task: Omit<MapTask, "id">): Promise<MapReply>;
  close(): Promise<void>;
}

/** Starts `size` workers and waits until they are ready; resolves with size 0 when they cannot start. */
export async function createMapWorkerPool(size = defaultWorkerCount()): Promise<MapWorkerPool> {
  const workers: Worker[] = [];
  try {
    const starting = Array.from({ length: size }, () => startWorker("map-worker"));
    workers.push(...starting);
    await Promise.all(starting.map((w) => waitReady(w)));
  } catch {
    await Promise.all(workers.map((w) => w.terminate()));
    return { size: 0, run: () => Promise.reject(new Error("no workers")), close: async () => {} };
  }
  const idle = [...workers];
  const queue: { task: MapTask; resolve: (r: MapReply) => void; reject: (e: Error) => void }[] = [];
  const pending = new Map<number, { resolve: (r: MapReply) => void; reject: (e: Error) => void; worker: Worker }>();
  let nextId = 1;
  const pump = () => {
    while (idle.length && queue.length) {
      const w = idle.pop()!,
        job = queue.shift()!;
      pending.set(job.task.id, { resolve: job.resolve, reject: job.reject, worker: w });
      w.postMessage(job.task);
    }
  };
  for (const w of workers) {
    w.on("message", (msg: MapReply) => {
      const job = pending.get(msg.id);
      if (!job) return;
      pending.delete(msg.id);
      idle.push(w);
      job.resolve(msg);
      pump();
    });
    w.on("error", (err) => {
      for (const [id, job] of pending)
        if (job.worker === w) {
          pending.delete(id);
          job.reject(err);
        }
    });
  }
  return {
    size: workers.length,
    run(task) {
      return new Promise((resolve, reject) => {
        queue.push({ task: { ...task, id: nextId++ }, resolve, reject });
        pump();
      });
    },
    async close() {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}

function waitReady(w: Worker): Promise<void> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("worker start timed out")), WORKER_START_TIMEOUT_MS);
    w.once("message", () => {
      clearTimeout(timer);
      resolve();
    });
    w.once("error", (e) => {
      clearTimeout(timer);
      reject(e);
    });
    w.once("exit", (code) => {
      clearTimeout(timer);
      reject(new Error(`worker exited with ${code}`));
    });
  });
}
