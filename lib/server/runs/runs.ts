/**
 * Verification runs: a kinetics simulated from a stored RUN.json (the `simulate` CLI's spec) in a
 * background job of kind "simulation", its final pattern read by the tissue readout and set
 * beside the linear prediction 2π/k*. Starting one checks everything first (simulation-run-plan.ts)
 * and writes the row and its job in one transaction. A run starts from a kinetics and parameters,
 * or from a finished fit (simulation-run-fit.ts). The runner's mail hook tells the requester when a
 * long run ends (payload title and path).
 */
import "server-only";
import { randomUUID } from "node:crypto";
import type { InferAttributes } from "sequelize";
import { can } from "@/lib/access/permissions";
import type { SimulationRunRequest } from "@/lib/contracts/simulation-run";
import type { JobStatus } from "@/models/job";
import type { SimulationRun } from "@/models/simulation-run";
import { StorageUnavailableError } from "@/storage/object-store";
import { authorize, isUuid, readInLab, type LabContext } from "../access";
import { AppError, notFound } from "../errors";
import { cancelJob, enqueueJob } from "../jobs/queue";
import { type ListQuery, type ListResult, pageResult } from "../web/list";
import { CONTAINS_TEXT, readAll, readPage } from "../db-read";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { SOFTWARE_VERSION } from "../readouts/readouts";
import { planRun } from "./plan";
import { readRunLinks } from "./links";
import type { RunDetailDto, RunDto, RunPlan, RunResult, RunSpec } from "./types";

export const RUN_SORTS = ["createdAt", "status", "kineticsName"] as const;

type Row = InstanceType<Awaited<ReturnType<typeof database>>["SimulationRun"]>;

/** Grid lengths are in the kinetics' own units (µm for dimensional kinetics, model length otherwise). */
const gridLabel = (s: RunSpec, dimensional: boolean) =>
  `${s.grid.cells.join(" × ")} cells on ${s.grid.lengthUm.join(" × ")} ${dimensional ? "µm" : "model length"}, ${s.grid.boundary}`;

async function toDtos(rows: InferAttributes<SimulationRun>[]): Promise<RunDto[]> {
  const m = await database();
  const jobIds = rows.filter((r) => r.jobId && (r.status === "queued" || r.status === "running")).map((r) => r.jobId!);
  // Independent reads, sent together: one wait for the database instead of two in a row.
  const [jobRows, emails] = await Promise.all([
    jobIds.length ? readAll(m.Job, { where: { id: jobIds } }) : [],
    emailsOf(rows.map((r) => r.createdBy)),
  ]);
  const jobs = new Map(jobRows.map((j) => [j.id, j]));
  return rows.map((r) => {
    const job = r.jobId ? jobs.get(r.jobId) : undefined;
    // A job cancelled or lost before its handler ran never touched the row: show the job's end.
    const ended = job && job.status !== "queued" && job.status !== "running" && job.status !== "succeeded";
    const spec = r.spec as unknown as RunSpec,
      plan = r.plan as unknown as RunPlan;
    return {
      id: r.id,
      name: r.name,
      status: (ended ? job.status : r.status) as JobStatus,
      progress: r.status === "succeeded" ? 1 : (job?.progress ?? 0),
      progressNote: job?.progressNote ?? null,
      error: ended ? job.error : r.error,
      jobId: r.jobId,
      kinetics: {
        kind: r.kineticsKind as "catalogue" | "lab",
        ref: r.kineticsRef,
        version: r.kineticsVersion,
        name: r.kineticsName,
      },
      gridLabel: gridLabel(spec, plan.units === "dimensional"),
      endTimeS: spec.endTimeS,
      seed: r.seed,
      stopReason: r.stopReason,
      wavelength: r.wavelengthUm,
      uncertainty: r.uncertaintyUm,
      predictedWavelength: r.predictedWavelengthUm,
      lengthUnit: plan.lengthUnit,
      agrees: r.agrees,
      softwareVersion: r.softwareVersion,
      createdByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
      finishedAt: r.finishedAt?.toISOString() ?? null,
    };
  });
}

export async function listRuns(ctx: LabContext, q: ListQuery<(typeof RUN_SORTS)[number]>): Promise<ListResult<RunDto>> {
  const m = await database();
  const { rows, count } = await readPage(m.SimulationRun, {
    where: {
      labId: ctx.labId,
      ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["name", "kineticsName"], text: q.q } } : {}),
    },
    order: [
      [q.sort, q.dir],
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return pageResult(q, await toDtos(rows), count);
}

export async function findRun(ctx: LabContext, runId: string): Promise<Row> {
  if (!isUuid(runId)) throw notFound("run");
  const m = await database();
  const r = await m.SimulationRun.findOne({ where: { id: runId, labId: ctx.labId } });
  if (!r) throw notFound("run");
  return r;
}

export async function getRun(ctx: LabContext, runId: string): Promise<RunDetailDto> {
  const r = await readInLab(ctx, (await database()).SimulationRun, runId, "run");
  const [[dto], links] = await Promise.all([toDtos([r]), readRunLinks(ctx, r.id, r.changedFrom)]);
  const base = `/api/v1/labs/${ctx.labId}/runs/${r.id}/files`;
  const files = Object.fromEntries(
    Object.keys(r.status === "succeeded" ? (r.fileKeys ?? {}) : {}).map((k) => [k, `${base}/${k}`]),
  );
  return {
    ...dto,
    spec: r.spec as unknown as RunSpec,
    plan: r.plan as unknown as RunPlan,
    result: r.status === "succeeded" ? (r.result as unknown as RunResult) : null,
    files,
    canCancel: can(ctx.role, "job.cancel", { ownerId: r.createdBy, actorId: ctx.actor.userId }),
    ...links,
  };
}

/** Checks the request, then queues the run; answers 400/422 before any job exists. */
export async function startRun(ctx: LabContext, req: SimulationRunRequest): Promise<RunDetailDto> {
  authorize(ctx, "run.create");
  const changedFrom = req.changedFrom ? await findChangedFromRun(ctx, req.changedFrom) : null;
  const planned = await planRun(ctx, req);
  const m = await database();
  const id = randomUUID();
  const lf = planned.plan.lengthFactor ?? 1;
  const from = planned.plan.startFrom;
  const name =
    req.name ||
    `${planned.kineticsName}${planned.kineticsVersion ? ` v${planned.kineticsVersion}` : ""}, ${planned.spec.grid.cells.join("×")}, ${from ? `from “${from.name}”${planned.seed !== "none" ? ` + noise, seed ${planned.seed}` : ""}` : `seed ${planned.seed}`}`;
  await services().db.sequelize.transaction(async (transaction) => {
    const job = await enqueueJob(
      {
        labId: ctx.labId,
        kind: "simulation",
        payload: { runId: id, title: `the verification run “${name}”`, path: `/labs/${ctx.labId}/runs/${id}` },
        requestedBy: ctx.actor.userId,
      },
      transaction,
    );
    await m.SimulationRun.create(
      {
        id,
        labId: ctx.labId,
        jobId: job.id,
        status: "queued",
        name,
        kineticsKind: planned.kineticsKind,
        kineticsRef: planned.kineticsRef,
        kineticsVersion: planned.kineticsVersion,
        kineticsName: planned.kineticsName,
        spec: planned.spec as unknown as Record<string, unknown>,
        plan: planned.plan as unknown as Record<string, unknown>,
        seed: planned.seed,
        predictedWavelengthUm: planned.plan.prediction ? planned.plan.prediction.wavelength * lf : null,
        softwareVersion: SOFTWARE_VERSION,
        changedFrom,
        createdBy: ctx.actor.userId,
      },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "run.started",
        targetType: "run",
        targetId: id,
        summary: `${ctx.actor.email} ${changedFrom ? "changed and ran again" : "started"} the verification run “${name}”`,
      },
      transaction,
    );
  });
  return getRun(ctx, id);
}

/** The run a new one was changed from: one of this lab's (422 naming the field otherwise). */
async function findChangedFromRun(ctx: LabContext, runId: string): Promise<string> {
  try {
    return (await findRun(ctx, runId)).id;
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found")
      throw new AppError("unprocessable", "changedFrom: there is no run with this id in this lab", {
        field: "changedFrom",
      });
    throw err;
  }
}

const CONTENT_TYPES: Record<string, string> = {
  png: "image/png",
  json: "application/json",
  f64: "application/octet-stream",
};

/** One stored output of a finished run. */
export async function openRunFile(ctx: LabContext, runId: string, name: string) {
  const r = await findRun(ctx, runId);
  const key = r.status === "succeeded" && r.fileKeys && Object.hasOwn(r.fileKeys, name) ? r.fileKeys[name] : undefined;
  if (!key) throw notFound("run file");
  try {
    const obj = await services().store.get(key);
    return {
      body: obj.body,
      contentType: CONTENT_TYPES[name.split(".").pop() ?? ""] ?? "application/octet-stream",
      contentLength: obj.contentLength,
    };
  } catch (err) {
    if (err instanceof StorageUnavailableError)
      throw new AppError("unavailable", "object storage is unreachable; try again later");
    if ((err as { name?: string }).name === "NoSuchKey") throw notFound("run file");
    throw err;
  }
}

/** Cancels a queued or running run (its creator or a lab manager); the job kills the simulation process. */
export async function cancelRun(ctx: LabContext, runId: string): Promise<RunDetailDto> {
  const r = await findRun(ctx, runId);
  authorize(ctx, "job.cancel", r.createdBy);
  if (!r.jobId || (r.status !== "queued" && r.status !== "running"))
    throw new AppError("conflict", `this run has already ${r.status === "succeeded" ? "finished" : r.status}`);
  await cancelJob(ctx.labId, r.jobId);
  if (r.status === "queued")
    await r.update({ status: "cancelled", error: "the run was cancelled", finishedAt: new Date() });
  return getRun(ctx, runId);
}
