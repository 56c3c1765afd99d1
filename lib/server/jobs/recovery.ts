/**
 * Jobs left "running" by a process that stopped (killed, crashed, restarted) are re-queued once
 * and failed with a reason the second time; rows of ended jobs still open are settled. A job is
 * left behind when its worker is stopped (lib/server/jobs/worker-registry.ts) or unknown (a row
 * of a version without workers); jobs of live workers, on this machine or another, are theirs.
 */
import "server-only";
import { Op } from "sequelize";
import { database, services } from "../services";
import { settleAllDerivedRows, settleDerivedRows } from "./derived-rows";
import { JOB_RETRY_LIMIT } from "./kinds";
import { cleanUpAfterInterruption, type JobCode } from "./run-job";
import { findStoppedWorkers, removeWorker, type WorkerRole } from "./worker-registry";

/** Progress note of a job re-queued because the server stopped while it ran. */
export const RESTARTED_NOTE = "restarted after a server restart";
/** Error of a job that a second server stop interrupted: it is not tried a third time. */
export const INTERRUPTED_TWICE =
  "failed: the server stopped twice while this job ran, so it was not started a third time; start it again, and if it keeps failing, make it smaller";
/** The same two for a job of a worker process (`npm run worker`) that stopped. */
export const WORKER_RESTARTED_NOTE = "restarted after its worker stopped";
export const WORKER_STOPPED_TWICE =
  "failed: the worker stopped twice while this job ran, so it was not started a third time; start it again, and if it keeps failing, make it smaller";

export interface RecoveryReport {
  requeued: string[];
  failed: string[];
}

/**
 * Re-queues or fails every "running" job whose worker stopped, except those this process runs
 * (`alive`); then removes the stopped workers' rows and hands the re-queued jobs to a worker.
 */
export async function recoverInterruptedJobs(
  code: JobCode,
  selfId: string | null,
  alive: string[],
): Promise<RecoveryReport> {
  const m = await database();
  const report: RecoveryReport = { requeued: [], failed: [] };
  const running = await m.Job.findAll({ where: { status: "running", id: { [Op.notIn]: alive } } });
  const workerIds = [...new Set(running.map((j) => j.workerId).filter((id): id is string => !!id))];
  const stopped = await findStoppedWorkers(workerIds, selfId);
  const roleOf = (workerId: string | null): WorkerRole | null =>
    workerId === null ? "web" : (stopped.get(workerId) ?? null);
  for (const job of running) {
    const role = roleOf(job.workerId);
    if (!role || (job.workerId === selfId && selfId !== null)) continue;
    const where = { id: job.id, status: "running", workerId: job.workerId };
    if (job.restarts >= JOB_RETRY_LIMIT) {
      const error = role === "worker" ? WORKER_STOPPED_TWICE : INTERRUPTED_TWICE;
      const [n] = await m.Job.update({ status: "failed", error, finishedAt: new Date() }, { where });
      if (n === 0) continue;
      report.failed.push(job.id);
      await settleDerivedRows([{ id: job.id, status: "failed", error }]);
      await cleanUpAfterInterruption(code, job);
    } else {
      const note = role === "worker" ? WORKER_RESTARTED_NOTE : RESTARTED_NOTE;
      const [n] = await m.Job.update(
        {
          status: "queued",
          progress: 0,
          progressNote: note,
          startedAt: null,
          restarts: job.restarts + 1,
          workerId: null,
        },
        { where },
      );
      if (n > 0) report.requeued.push(job.id);
    }
  }
  for (const id of stopped.keys()) await removeWorker(id);
  await settleAllDerivedRows();
  for (const id of report.requeued) {
    const job = running.find((j) => j.id === id)!;
    await services().jobs.deliver({ id, kind: job.kind });
  }
  if (report.requeued.length + report.failed.length > 0)
    console.warn(`jobs: ${report.requeued.length} re-queued and ${report.failed.length} failed after a stop`);
  return report;
}
