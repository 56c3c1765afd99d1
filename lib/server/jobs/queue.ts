/**
 * The queue side of jobs: enqueue, read, cancel, wait. Imports no handler and no worker; a job
 * reaches a worker through the delivery chosen in lib/server/services.ts (in-process on the
 * embedded default, pg-boss on Postgres), and the `jobs` table stays the record of every job.
 */
import "server-only";
import type { Transaction } from "sequelize";
import type { JobStatus } from "@/models/job";
import { AppError, notFound } from "../errors";
import { database, services } from "../services";
import { settleDerivedRows } from "./derived-rows";
import { isJobKind } from "./kinds";

export interface JobDto {
  id: string;
  kind: string;
  status: JobStatus;
  progress: number;
  progressNote: string | null;
  error: string | null;
  result: Record<string, unknown> | null;
  requestedBy: string | null;
  /** How often a server stop interrupted it (it is re-queued once, then failed). */
  restarts: number;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export type JobRow = InstanceType<Awaited<ReturnType<typeof database>>["Job"]>;

export function toJobDto(j: JobRow): JobDto {
  return {
    id: j.id,
    kind: j.kind,
    status: j.status,
    progress: j.progress,
    progressNote: j.progressNote,
    error: j.error,
    result: j.result,
    requestedBy: j.requestedBy,
    restarts: j.restarts,
    createdAt: j.createdAt.toISOString(),
    startedAt: j.startedAt?.toISOString() ?? null,
    finishedAt: j.finishedAt?.toISOString() ?? null,
  };
}

/** Queues a job; it is delivered to a worker after the surrounding transaction (if any) commits. */
export async function enqueueJob(
  input: { labId: string; kind: string; payload: Record<string, unknown>; requestedBy: string | null },
  transaction?: Transaction,
): Promise<JobRow> {
  if (!isJobKind(input.kind)) throw new Error(`no handler for job kind "${input.kind}"`);
  const m = await database();
  const job = await m.Job.create({ ...input, status: "queued" }, { transaction });
  const deliver = () =>
    void services()
      .jobs.deliver({ id: job.id, kind: job.kind })
      .catch((err) => console.error(`job ${job.kind} ${job.id}: could not be handed to a worker`, err));
  if (transaction) transaction.afterCommit(deliver);
  else deliver();
  return job;
}

export async function getJob(labId: string, jobId: string): Promise<JobDto> {
  const m = await database();
  const job = await m.Job.findOne({ where: { id: jobId, labId } });
  if (!job) throw notFound("job");
  return toJobDto(job);
}

export async function cancelJob(labId: string, jobId: string): Promise<JobDto> {
  const m = await database();
  const job = await m.Job.findOne({ where: { id: jobId, labId } });
  if (!job) throw notFound("job");
  if (job.status === "queued") {
    await job.update({ status: "cancelled", error: "the job was cancelled", finishedAt: new Date() });
    await settleDerivedRows([{ id: job.id, status: "cancelled", error: "the job was cancelled" }]);
  } else if (job.status === "running") {
    // The row carries the request to a worker in another process; one here stops at once.
    await job.update({ cancelRequestedAt: new Date() });
    await services().jobs.cancelRunning(job.id);
  } else {
    throw new AppError("conflict", `this job has already ${job.status === "succeeded" ? "finished" : job.status}`);
  }
  return toJobDto((await m.Job.findByPk(job.id))!);
}

/** Waits until a job leaves queued/running (tests and the CLI). */
export async function waitForJob(jobId: string, timeoutMs = 60_000): Promise<JobDto> {
  const m = await database();
  const until = Date.now() + timeoutMs;
  for (;;) {
    const j = await m.Job.findByPk(jobId);
    if (!j) throw notFound("job");
    if (j.status !== "queued" && j.status !== "running") return toJobDto(j);
    if (Date.now() > until) throw new Error(`job ${jobId} still ${j.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
