/**
 * How a queued job reaches a worker. The `jobs` table is the app's record of every job (status,
 * progress, result); a delivery only carries "this job is waiting" to a worker and "stop this
 * one" to the worker running it (in this process; a worker elsewhere sees the row's
 * `cancelRequestedAt` on its next heartbeat). Chosen once in lib/server/services.ts.
 */
import "server-only";
import { announceCancel, announceQueued } from "./local-bus";

export interface JobDelivery {
  /** Shown by /api/health. */
  readonly name: "in-process" | "pg-boss";
  /** Hands a job whose row is committed "queued" to a worker. */
  deliver(job: { id: string; kind: string }): Promise<void>;
  /** Asks the worker running this job to stop it; the worker records the cancellation. */
  cancelRunning(jobId: string): Promise<void>;
  /**
   * A queue engine's consumer (pg-boss): calls `take(jobId)` for each delivered job, at most
   * `concurrency` at once, until the returned stop function is called. Absent in-process: the
   * worker takes the oldest queued row itself.
   */
  consume?(concurrency: number, take: (jobId: string) => Promise<void>): Promise<() => Promise<void>>;
  close(): Promise<void>;
}

/** The embedded default: the worker in this process (or one polling the same database) takes the job. */
export function createInProcessDelivery(): JobDelivery {
  return {
    name: "in-process",
    async deliver() {
      announceQueued();
    },
    async cancelRunning(jobId) {
      announceCancel(jobId);
    },
    async close() {},
  };
}
