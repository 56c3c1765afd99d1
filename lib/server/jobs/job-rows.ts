import "server-only";
import { authorize, type LabContext } from "../access";
import { notFound } from "../errors";
import { cancelJob, toJobDto, type JobDto } from "./queue";
import { database } from "../services";

export async function listJobs(ctx: LabContext, mine: boolean): Promise<JobDto[]> {
  const m = await database();
  const rows = await m.Job.findAll({
    where: { labId: ctx.labId, ...(mine ? { requestedBy: ctx.actor.userId } : {}) },
    order: [["createdAt", "desc"]],
    limit: 50,
  });
  return rows.map(toJobDto);
}

export async function cancelOwnJob(ctx: LabContext, jobId: string): Promise<JobDto> {
  const m = await database();
  const job = await m.Job.findOne({ where: { id: jobId, labId: ctx.labId } });
  if (!job) throw notFound("job");
  authorize(ctx, "job.cancel", job.requestedBy);
  return cancelJob(ctx.labId, jobId);
}
