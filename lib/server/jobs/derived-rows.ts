/**
 * The row a job works on (readout, fit, simulation run) must end in its job's state: never
 * "queued" or "running" once its job failed or was cancelled. Handlers write the row themselves;
 * this settles the rows they could not (a process killed between the two writes, a job given up
 * after server stops, a handler that never ran).
 */
import "server-only";
import { Op } from "sequelize";
import { database } from "../services";

const OPEN_ROWS = { [Op.in]: ["queued", "running"] };

/**
 * Sets the open derived rows of these ended jobs to the job's status and error. `overCancelled`:
 * also rows the handler marked "cancelled" (a job stopped by its time limit: the handler saw an
 * aborted signal, but the job failed).
 */
export async function settleDerivedRows(
  jobs: { id: string; status: string; error: string | null }[],
  options: { overCancelled?: boolean } = {},
): Promise<void> {
  const m = await database();
  const OPEN = { [Op.in]: options.overCancelled ? ["queued", "running", "cancelled"] : ["queued", "running"] };
  for (const job of jobs) {
    if (job.status !== "failed" && job.status !== "cancelled") continue;
    const values = { status: job.status, error: job.error } as const;
    await m.Readout.update({ ...values, result: null, derivedKeys: null }, { where: { jobId: job.id, status: OPEN } });
    await m.Fit.update({ ...values, result: null }, { where: { jobId: job.id, status: OPEN } });
    await m.SimulationRun.update(
      { ...values, result: null, fileKeys: null, finishedAt: new Date() },
      { where: { jobId: job.id, status: OPEN } },
    );
  }
}

/** Every open derived row whose job has ended without success (start-up). */
export async function settleAllDerivedRows(): Promise<void> {
  const m = await database();
  const open = [m.Readout, m.Fit, m.SimulationRun] as const;
  const jobIds = new Set<string>();
  for (const model of open) {
    const rows = await (model as typeof m.Readout).findAll({
      where: { status: OPEN_ROWS, jobId: { [Op.ne]: null } },
      attributes: ["jobId"],
    });
    for (const r of rows) jobIds.add(r.jobId!);
  }
  if (jobIds.size === 0) return;
  const ended = await m.Job.findAll({
    where: { id: [...jobIds], status: { [Op.in]: ["failed", "cancelled"] } },
    attributes: ["id", "status", "error"],
  });
  await settleDerivedRows(ended);
}
