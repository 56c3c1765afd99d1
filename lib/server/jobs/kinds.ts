/**
 * The job kinds the queue accepts and what the queue needs to know of each: a time limit and a
 * retry limit. No handler here: the queue side (routes, enqueueing) never loads job code; the
 * handlers are mapped to these names in lib/server/jobs/wiring.ts.
 */
import "server-only";
export const JOB_KIND_NAMES = ["readout", "fit", "fit-comparison", "simulation", "echo"] as const;
export type JobKind = (typeof JOB_KIND_NAMES)[number];

export function isJobKind(kind: string): kind is JobKind {
  return (JOB_KIND_NAMES as readonly string[]).includes(kind);
}

/**
 * Longest one attempt of a job may run, s; past it the worker stops the job, which fails saying
 * so. An outer safety net: each kind's own child process has a tighter limit (readout 3 min, one
 * fit model 10 min, a simulation 10 × its estimate + 2 min under RUN_WORK_LIMIT). Design choice.
 */
export const JOB_TIME_LIMITS_S: Record<JobKind, number> = {
  readout: 15 * 60,
  fit: 2 * 3600,
  "fit-comparison": 2 * 3600,
  simulation: 2 * 3600,
  echo: 5 * 60,
};

/**
 * How often a job interrupted by a stopped process (server or worker) is started again before it
 * fails saying so. Design choice: once, so a job that kills its process cannot loop forever.
 */
export const JOB_RETRY_LIMIT = 1;
