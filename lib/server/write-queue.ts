/**
 * A first-come-first-served lock held in JavaScript: callers wait as pending promises, not as
 * blocked threads. SQLite allows one writer at a time anyway; letting every writer wait in
 * sqlite3's busy handler instead parks each of them on one of libuv's few threads (4 by
 * default), which the lock holder, file writes, sharp and crypto also need — under load the
 * holder cannot finish and every waiter times out with SQLITE_BUSY. The wait is bounded: a
 * caller that would wait longer gets a 503 "busy, try again in N s" instead of a hang.
 */
import { serverBusy } from "./errors";

export interface WriteQueue {
  run<T>(fn: () => Promise<T>): Promise<T>;
  /** Waits for the turn and returns its release (call it exactly once; later calls do nothing). */
  acquire(): Promise<() => void>;
  /** Callers waiting now (not counting the holder). */
  readonly waiting: number;
}

interface Waiter {
  start: () => void;
  timer: NodeJS.Timeout;
}

export function createWriteQueue(options: { maxWaitMs: number; what?: string }): WriteQueue {
  const queue: Waiter[] = [];
  let held = false;
  /** Smoothed time one holder keeps the lock (ms), for an honest Retry-After. */
  let holdMs = 20;

  const retryAfterS = () => Math.min(60, Math.max(1, Math.ceil(((queue.length + 1) * holdMs) / 1000)));

  const release = () => {
    const next = queue.shift();
    if (next) {
      clearTimeout(next.timer);
      next.start();
    } else {
      held = false;
    }
  };

  const wait = (): Promise<void> => {
    if (!held) {
      held = true;
      return Promise.resolve();
    }
    return new Promise<void>((resolve, reject) => {
      const waiter: Waiter = {
        start: resolve,
        timer: setTimeout(() => {
          const i = queue.indexOf(waiter);
          if (i >= 0) queue.splice(i, 1);
          reject(serverBusy(retryAfterS(), options.what ?? "the database is busy with other writes"));
        }, options.maxWaitMs),
      };
      queue.push(waiter);
    });
  };

  const acquire = async (): Promise<() => void> => {
    await wait();
    const t0 = performance.now();
    let done = false;
    return () => {
      if (done) return;
      done = true;
      holdMs = 0.8 * holdMs + 0.2 * (performance.now() - t0);
      release();
    };
  };

  return {
    async run<T>(fn: () => Promise<T>): Promise<T> {
      const leave = await acquire();
      try {
        return await fn();
      } finally {
        leave();
      }
    },
    acquire,
    get waiting() {
      return queue.length;
    },
  };
}
