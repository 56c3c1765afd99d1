/**
 * Which function runs which kind of job. Add a line per kind; the handler module must not import
 * the runner (lib/server/jobs/runner.ts).
 */
import "server-only";
import type { JobHandler, JobInput } from "./types";

export const JOB_HANDLERS: Record<string, JobHandler> = {};

/**
 * Per kind: removes every object any attempt of a job may have written (its keys are fixed by the
 * job's own ids, so a re-run overwrites them). Called when a job that a server stop interrupted
 * ends without success, because the killed attempt could not clean up after itself.
 */
export const JOB_CLEANUPS: Record<string, (job: JobInput) => Promise<void>> = {};

export function registerJobHandler(kind: string, handler: JobHandler) {
  JOB_HANDLERS[kind] = handler;
}

export function registerJobCleanup(kind: string, cleanup: (job: JobInput) => Promise<void>) {
  JOB_CLEANUPS[kind] = cleanup;
}
