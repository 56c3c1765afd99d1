import "server-only";

export interface JobContext {
  /** Report progress 0..1 with a short note ("FFT", "simulated t = 120 s"). Throttled. */
  progress(fraction: number, note?: string): Promise<void>;
  /** Aborted when the job is cancelled; long loops check it between steps. */
  signal: AbortSignal;
}

export interface JobInput {
  id: string;
  labId: string;
  kind: string;
  payload: Record<string, unknown>;
  requestedBy: string | null;
}

/** Returns the result (stored as JSON) or throws; a thrown AppError's message is kept for the user. */
export type JobHandler = (job: JobInput, ctx: JobContext) => Promise<Record<string, unknown>>;

/**
 * Removes every object any attempt of a job may have written (its keys are fixed by the job's own
 * ids, so a re-run overwrites them). Called when a job that a stop interrupted ends without
 * success, because the killed attempt could not clean up after itself.
 */
export type JobCleanup = (job: JobInput) => Promise<void>;

/** Thrown by a handler that saw `signal.aborted`. */
export class JobCancelledError extends Error {
  constructor() {
    super("the job was cancelled");
  }
}
