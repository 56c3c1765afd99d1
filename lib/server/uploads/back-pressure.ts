/**
 * Back-pressure on uploads: at most `inFlight` uploads are received at once per process, the next
 * `waiting` wait up to `waitMs` for a slot, and any beyond that are refused at once with a 503 and
 * Retry-After — before a byte of their body is read, so a refused request costs almost nothing.
 * Without it, 200 uploads at once each held a temporary file, a sharp decode and a database
 * turn, and the server stopped answering anything.
 */
import "server-only";
import { serverBusy } from "../errors";

export interface GateLimits {
  inFlight: number;
  waiting: number;
  waitMs: number;
}

export interface Gate {
  /** Resolves with a release function once a slot is free; rejects with a 503 when saturated. */
  enter(limits: GateLimits): Promise<() => void>;
  readonly inFlight: number;
  readonly waiting: number;
}

export interface GateOptions {
  /** Why a refused caller waits, in the 503's words: "the server is busy (<reason>); try again in N s". */
  reason: string;
  /** First guess of how long one holder keeps its slot (ms), before any was measured. */
  initialHoldMs: number;
  /** Largest Retry-After to suggest (s). */
  maxRetryAfterS: number;
}

const UPLOADS: GateOptions = {
  reason: "it is receiving as many uploads as it can",
  initialHoldMs: 1000,
  maxRetryAfterS: 120,
};

/** Slots taken first come, first served; waiters wait as promises (the write queue is a gate of one slot). */
export function createGate(options: GateOptions = UPLOADS): Gate {
  let inFlight = 0;
  const queue: { start: () => void; timer: NodeJS.Timeout }[] = [];
  /** Smoothed time one holder keeps its slot (ms), for an honest Retry-After. */
  let holdMs = options.initialHoldMs;
  const REASON = options.reason;

  const retryAfterS = (limits: GateLimits) =>
    Math.min(
      options.maxRetryAfterS,
      Math.max(1, Math.ceil(((queue.length + 1) * holdMs) / Math.max(1, limits.inFlight) / 1000)),
    );

  const admit = (): (() => void) => {
    inFlight++;
    const t0 = performance.now();
    let released = false;
    return () => {
      if (released) return;
      released = true;
      holdMs = 0.8 * holdMs + 0.2 * (performance.now() - t0);
      inFlight--;
      const next = queue.shift();
      if (next) {
        clearTimeout(next.timer);
        next.start();
      }
    };
  };

  return {
    enter(limits) {
      if (inFlight < limits.inFlight && queue.length === 0) return Promise.resolve(admit());
      if (queue.length >= limits.waiting) return Promise.reject(serverBusy(retryAfterS(limits), REASON));
      return new Promise((resolve, reject) => {
        const waiter = {
          start: () => resolve(admit()),
          timer: setTimeout(() => {
            const i = queue.indexOf(waiter);
            if (i >= 0) queue.splice(i, 1);
            reject(serverBusy(retryAfterS(limits), REASON));
          }, limits.waitMs),
        };
        queue.push(waiter);
      });
    },
    get inFlight() {
      return inFlight;
    },
    get waiting() {
      return queue.length;
    },
  };
}

const g = globalThis as unknown as { __morphokinUploadGate?: Gate };

/** The one upload gate of this process (on globalThis: Next may load this module more than once). */
export function uploadGate(): Gate {
  return (g.__morphokinUploadGate ??= createGate());
}
