/**
 * Which function runs which kind of job. Add a line per kind; the handler module must not import
 * the runner (lib/server/jobs/runner.ts).
 */
import type { JobHandler } from "./types";

export const JOB_HANDLERS: Record<string, JobHandler> = {};

export function registerJobHandler(kind: string, handler: JobHandler) {
  JOB_HANDLERS[kind] = handler;
}
