/**
 * The in-process link between the queue and a worker running in the same process, so the queue
 * never imports the worker (or any handler): the queue announces, the worker listens. Kept on
 * globalThis because Next may load this module more than once in one process.
 */
import "server-only";
interface LocalBus {
  onQueued: Set<() => void>;
  onCancel: Set<(jobId: string) => boolean>;
}

const g = globalThis as unknown as { __morphokinJobBus?: LocalBus };
const bus: LocalBus = (g.__morphokinJobBus ??= { onQueued: new Set(), onCancel: new Set() });

/** Tells local workers that a job was queued (they look for work). */
export function announceQueued(): void {
  for (const listener of bus.onQueued) listener();
}

/** Asks local workers to stop a running job; true when one of them was running it. */
export function announceCancel(jobId: string): boolean {
  let taken = false;
  for (const listener of bus.onCancel) taken = listener(jobId) || taken;
  return taken;
}

export function listenForQueued(listener: () => void): void {
  bus.onQueued.add(listener);
}

export function listenForCancel(listener: (jobId: string) => boolean): void {
  bus.onCancel.add(listener);
}
