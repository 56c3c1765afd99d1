/**
 * How a queued job reaches a worker. The `jobs` table is the app's record of every job (status,
 * progress, result); a delivery only carries "this job is waiting" to a worker and "stop this
 * one" to the worker running it. Chosen once in lib/server/services.ts.
 */
import { announceCancel, announceQueued } from "./local-bus";

export interface JobDelivery {
  /** Shown by /api/health. */
  readonly name: "in-process" | "pg-boss";
  /** Hands a job whose row is committed "queued" to a worker. */
  deliver(job: { id: string; kind: string }): Promise<void>;
  /** Asks the worker running this job to stop it; the worker records the cancellation. */
  cancelRunning(jobId: string): Promise<void>;
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
