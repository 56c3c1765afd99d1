/**
 * Jobs left "running" by a process that died (killed, crashed, restarted) are re-queued once and
 * failed with a reason the second time; rows of ended jobs still open are settled.
 */
import { Op } from "sequelize";
import { database } from "../services";
import { settleAllDerivedRows, settleDerivedRows } from "./derived-rows";
import { JOB_RETRY_LIMIT } from "./kinds";
import { cleanUpAfterInterruption, type JobCode } from "./run-job";

/** Progress note of a job re-queued because the server stopped while it ran. */
export const RESTARTED_NOTE = "restarted after a server restart";
/** Error of a job that a second server stop interrupted: it is not tried a third time. */
export const INTERRUPTED_TWICE =
  "failed: the server stopped twice while this job ran, so it was not started a third time; start it again, and if it keeps failing, make it smaller";

export interface RecoveryReport {
  requeued: string[];
  failed: string[];
}

/** Re-queues or fails every "running" job except those this process runs itself (`alive`). */
export async function recoverInterruptedJobs(code: JobCode, alive: string[]): Promise<RecoveryReport> {
  const m = await database();
  const report: RecoveryReport = { requeued: [], failed: [] };
  const stale = await m.Job.findAll({ where: { status: "running", id: { [Op.notIn]: alive } } });
  for (const job of stale) {
    if (job.restarts >= JOB_RETRY_LIMIT) {
      const [n] = await m.Job.update(
        { status: "failed", error: INTERRUPTED_TWICE, finishedAt: new Date() },
        { where: { id: job.id, status: "running" } },
      );
      if (n === 0) continue;
      report.failed.push(job.id);
      await settleDerivedRows([{ id: job.id, status: "failed", error: INTERRUPTED_TWICE }]);
      await cleanUpAfterInterruption(code, job);
    } else {
      const [n] = await m.Job.update(
        { status: "queued", progress: 0, progressNote: RESTARTED_NOTE, startedAt: null, restarts: job.restarts + 1 },
        { where: { id: job.id, status: "running" } },
      );
      if (n > 0) report.requeued.push(job.id);
    }
  }
  await settleAllDerivedRows();
  if (report.requeued.length + report.failed.length > 0)
    console.warn(`jobs: ${report.requeued.length} re-queued and ${report.failed.length} failed after a server stop`);
  return report;
}
