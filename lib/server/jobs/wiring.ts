/**
 * The composition root of jobs: which function runs which kind of job, and which removes what a
 * killed attempt of it wrote. Add a line per kind (and its name in kinds.ts). Only entry points
 * import this file (start-up, the worker command, tests); the queue and the handlers never do,
 * so no import circle runs through the jobs.
 */
import "server-only";
import { cleanUpReadoutJob, runReadoutJob } from "../readouts/job";
import { runFitJob } from "../fits/job";
import { cleanUpSimulationJob, runSimulationJob } from "../runs/job";
import { runEchoJob } from "./echo-job";
import { JOB_TIME_LIMITS_S, type JobKind } from "./kinds";
import type { RecoveryReport } from "./recovery";
import type { JobCode } from "./run-job";
import type { JobCleanup, JobHandler } from "./types";
import { recoverJobs, resumeJobs, giveWorkerJobCode } from "./worker";
import { services } from "../services";

export const JOB_HANDLERS: Record<JobKind, JobHandler> = {
  readout: runReadoutJob,
  fit: runFitJob,
  "fit-comparison": runFitJob,
  simulation: runSimulationJob,
  echo: runEchoJob,
};

export const JOB_CLEANUPS: Partial<Record<JobKind, JobCleanup>> = {
  readout: cleanUpReadoutJob,
  simulation: cleanUpSimulationJob,
};

export const JOB_CODE: JobCode = { handlers: JOB_HANDLERS, cleanups: JOB_CLEANUPS, timeLimitsS: JOB_TIME_LIMITS_S };

/** Runs jobs in this process from now on (tests, the command line's seed). */
export function startJobs(): void {
  giveWorkerJobCode(JOB_CODE);
  resumeJobs();
}

/**
 * The web server's start-up task: recover what a stopped process left, then run queued jobs in
 * this process, unless JOBS_IN_WEB=0 (then `npm run worker` processes run them).
 */
export async function recoverJobsAtStart(): Promise<RecoveryReport> {
  if (!services().config.jobsInWeb) return { requeued: [], failed: [] };
  giveWorkerJobCode(JOB_CODE, { role: "web" });
  return recoverJobs();
}

/** `npm run worker`: this process runs jobs, `concurrency` at once. */
export async function startWorkerProcess(concurrency: number): Promise<RecoveryReport> {
  giveWorkerJobCode(JOB_CODE, { role: "worker", concurrency });
  return recoverJobs();
}
