/**
 * A first-come-first-served lock held in JavaScript: callers wait as pending promises, not as
 * blocked threads. SQLite allows one writer at a time anyway; letting every writer wait in
 * sqlite3's busy handler instead parks each of them on one of libuv's few threads (4 by
 * default), which the lock holder, file writes, sharp and crypto also need — under load the
 * holder cannot finish and every waiter times out with SQLITE_BUSY. The wait is bounded: a
 * caller that would wait longer gets a 503 "busy, try again in N s" instead of a hang.
 */
import "server-only";
import { createGate } from "./uploads/back-pressure";

export interface WriteQueue {
  run<T>(fn: () => Promise<T>): Promise<T>;
  /** Waits for the turn and returns its release (call it exactly once; later calls do nothing). */
  acquire(): Promise<() => void>;
  /** Callers waiting now (not counting the holder). */
  readonly waiting: number;
}

/** A gate of one slot with no limit on waiters, each waiting at most `maxWaitMs`. */
export function createWriteQueue(options: { maxWaitMs: number; what?: string }): WriteQueue {
  const gate = createGate({
    reason: options.what ?? "the database is busy with other writes",
    initialHoldMs: 20,
    maxRetryAfterS: 60,
  });
  const limits = { inFlight: 1, waiting: Infinity, waitMs: options.maxWaitMs };
  const acquire = () => gate.enter(limits);
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
      return gate.waiting;
    },
  };
}
