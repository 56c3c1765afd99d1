/**
 * Fits: one kinetics, or several compared, fitted to measured wavelengths. Starting one checks
 * the request completely (400/422 naming the field) and then writes the fit row and its job in
 * one transaction; the job (lib/server/fits/job.ts) writes the result. A result exists only
 * with status "succeeded" and is never changed: a re-run is a new fit with the same stored spec.
 */
import "server-only";
import { randomUUID } from "node:crypto";
import { can } from "@/lib/access/permissions";
import type { FitCreate } from "@/lib/contracts/fit";
import type { InferAttributes } from "sequelize";
import type { Fit } from "@/models/fit";
import type { JobStatus } from "@/models/job";
import { authorize, isUuid, readInLab, type LabContext } from "../access";
import { AppError, notFound } from "../errors";
import { enqueueJob } from "../jobs/queue";
import { type ListQuery, type ListResult, pageResult } from "../web/list";
import { attributesExcept, CONTAINS_TEXT, readAll, readOne, readPage, withColumns } from "../db-read";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { fitRunner } from "./process";
import { fitSummaryOf, type FitSummary } from "./summary";
import type { StoredFitResult } from "./result";
import { buildFitSpec, type BuiltFit } from "./spec";
import type { FitProvenance, StoredFitSpec } from "./spec-types";
import { SOFTWARE_VERSION } from "../readouts/readouts";

export interface FitSummaryDto {
  id: string;
  name: string;
  kind: "fit" | "comparison";
  status: JobStatus;
  progress: number;
  progressNote: string | null;
  error: string | null;
  jobId: string | null;
  kinetics: string[];
  conditions: string[];
  n: number;
  /** Headline of the (best-ranked) kinetics once finished. */
  verdict: string | null;
  best: string | null;
  rerunOf: string | null;
  createdBy: string | null;
  createdByEmail: string | null;
  createdAt: string;
}

export interface FitDetailDto extends FitSummaryDto {
  spec: StoredFitSpec;
  provenance: FitProvenance;
  inputSha256: string;
  softwareVersion: string;
  result: StoredFitResult | null;
  canRerun: boolean;
  /** The fit this one was changed from ("Change and re-run"), and the fits changed from this one. */
  changedFrom: FitLinkDto | null;
  changedInto: FitLinkDto[];
}

/** Another fit of the lab, as a link. */
export interface FitLinkDto {
  id: string;
  name: string;
  status: JobStatus;
}

type Row = InstanceType<Awaited<ReturnType<typeof database>>["Fit"]>;

type FitAttributes = InferAttributes<Fit>;

/** The columns a list reads instead of these, which hold the whole fit. */
const FULL_ATTRIBUTES = ["spec", "provenance", "result"] as const;
/** A stored summary that says all a list shows (a succeeded fit's names its best kinetics). */
const hasUsableSummary = (r: Partial<FitAttributes>) =>
  !!r.summary && (r.status !== "succeeded" || (r.summary as unknown as FitSummary).best !== null);

/**
 * The stored summary of a fit, or for a fit made before that column, the same computed from its
 * full spec, provenance and result (a list reads those only for such fits, see listFits).
 */
function summaryOfRow(r: Partial<FitAttributes>): FitSummary {
  if (hasUsableSummary(r)) return r.summary as unknown as FitSummary;
  return fitSummaryOf(
    r.spec as unknown as StoredFitSpec,
    r.provenance as unknown as FitProvenance,
    r.status === "succeeded" ? (r.result as unknown as StoredFitResult | null) : null,
  );
}

async function toSummaries(rows: FitAttributes[]): Promise<FitSummaryDto[]> {
  const m = await database();
  // A fit's job says more than its row only while the row is queued or running (as for readouts
  // and runs): then its progress, or its end when it ended before its handler touched the row.
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
    const ended =
      job &&
      (job.status === "failed" || job.status === "cancelled") &&
      (r.status === "queued" || r.status === "running");
    const summary = summaryOfRow(r);
    const succeeded = r.status === "succeeded";
    return {
      id: r.id,
      name: r.name,
      kind: r.kind as "fit" | "comparison",
      status: ended ? job.status : r.status,
      progress: r.status === "succeeded" ? 1 : (job?.progress ?? 0),
      progressNote: job?.progressNote ?? null,
      error: ended ? job.error : r.error,
      jobId: r.jobId,
      kinetics: summary.kinetics,
      conditions: summary.conditions,
      n: summary.n,
      verdict: succeeded ? summary.verdict : null,
      best: succeeded ? summary.best : null,
      rerunOf: r.rerunOf,
      createdBy: r.createdBy,
      createdByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
    };
  });
}

export async function listFits(
  ctx: LabContext,
  q: ListQuery<"createdAt" | "name" | "status">,
): Promise<ListResult<FitSummaryDto>> {
  const m = await database();
  const { rows, count } = await readPage(m.Fit, {
    where: { labId: ctx.labId, ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["name"], text: q.q } } : {}) },
    // The stored summary instead of the spec, provenance and result (tens of kB per fit).
    attributes: attributesExcept(m.Fit, FULL_ATTRIBUTES),
    order: [
      [q.sort, q.dir],
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  // Fits made before the summary column: their full columns, for these rows only.
  const full = await withColumns(m.Fit, rows, (r) => !hasUsableSummary(r), FULL_ATTRIBUTES);
  return pageResult(q, await toSummaries(full), count);
}

export async function findFit(ctx: LabContext, fitId: string): Promise<Row> {
  if (!isUuid(fitId)) throw notFound("fit");
  const m = await database();
  const r = await m.Fit.findOne({ where: { id: fitId, labId: ctx.labId } });
  if (!r) throw notFound("fit");
  return r;
}

export async function getFit(ctx: LabContext, fitId: string): Promise<FitDetailDto> {
  const r = await readInLab(ctx, (await database()).Fit, fitId, "fit");
  const [[s], links] = await Promise.all([toSummaries([r]), readFitLinks(ctx, r)]);
  return {
    ...s,
    spec: r.spec as unknown as StoredFitSpec,
    provenance: r.provenance as unknown as FitProvenance,
    inputSha256: r.inputSha256,
    softwareVersion: r.softwareVersion,
    result: r.status === "succeeded" ? (r.result as unknown as StoredFitResult) : null,
    canRerun: can(ctx.role, "fit.create"),
    ...links,
  };
}

async function queueFit(
  ctx: LabContext,
  name: string,
  built: BuiltFit,
  { rerunOf = null, changedFrom = null }: { rerunOf?: string | null; changedFrom?: string | null },
): Promise<FitDetailDto> {
  const m = await database();
  const id = randomUUID();
  const kind = built.kind === "fit" ? "fit" : "fit-comparison";
  await services().db.sequelize.transaction(async (transaction) => {
    const job = await enqueueJob(
      {
        labId: ctx.labId,
        kind,
        payload: { fitId: id, title: `the fit “${name}”`, path: `/labs/${ctx.labId}/fits/${id}` },
        requestedBy: ctx.actor.userId,
      },
      transaction,
    );
    await m.Fit.create(
      {
        id,
        labId: ctx.labId,
        name,
        kind: built.kind,
        status: "queued",
        jobId: job.id,
        spec: built.spec as unknown as Record<string, unknown>,
        provenance: built.provenance as unknown as Record<string, unknown>,
        summary: fitSummaryOf(built.spec, built.provenance, null) as unknown as Record<string, unknown>,
        inputSha256: built.inputSha256,
        softwareVersion: SOFTWARE_VERSION,
        rerunOf,
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
        action: rerunOf ? "fit.rerun" : "fit.started",
        targetType: "fit",
        targetId: id,
        summary: `${ctx.actor.email} ${rerunOf ? "re-ran" : changedFrom ? "changed and re-ran" : "started"} the ${built.kind} “${name}” (${built.provenance.kinetics.map((k) => k.label).join(", ")}; ${built.spec.data.length} measurements)`,
      },
      transaction,
    );
  });
  return getFit(ctx, id);
}

/** Checks the request (400/422 before anything is written) and queues the fit. */
export async function startFit(ctx: LabContext, input: FitCreate): Promise<FitDetailDto> {
  authorize(ctx, "fit.create");
  // The fit it was changed from must be one of this lab's (checked before the spec, which is slower).
  const changedFrom = input.changedFrom ? (await findChangedFrom(ctx, input.changedFrom)).id : null;
  const built = await buildFitSpec(ctx, input, SOFTWARE_VERSION, fitRunner());
  return queueFit(ctx, input.name, built, { changedFrom });
}

/** A new fit with exactly the stored spec of an existing one (same data values, same kinetics versions). */
export async function rerunFit(ctx: LabContext, fitId: string): Promise<FitDetailDto> {
  authorize(ctx, "fit.create");
  const r = await findFit(ctx, fitId);
  const spec = r.spec as unknown as StoredFitSpec;
  const provenance = {
    ...(r.provenance as unknown as FitProvenance),
    softwareVersion: SOFTWARE_VERSION,
    runner: fitRunner(),
  };
  const name = r.name.replace(/( \(re-run\))*$/, "") + " (re-run)";
  return queueFit(
    ctx,
    name.slice(0, 200),
    { kind: r.kind as "fit" | "comparison", spec, provenance, inputSha256: r.inputSha256 },
    { rerunOf: r.id },
  );
}

async function findChangedFrom(ctx: LabContext, fitId: string): Promise<Row> {
  try {
    return await findFit(ctx, fitId);
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found")
      throw new AppError("unprocessable", "changedFrom: there is no fit with this id in this lab", {
        field: "changedFrom",
      });
    throw err;
  }
}

/** Both directions of "Change and re-run" for one fit, in one query each (newest change first). */
async function readFitLinks(
  ctx: LabContext,
  r: FitAttributes,
): Promise<Pick<FitDetailDto, "changedFrom" | "changedInto">> {
  const m = await database();
  const attributes = ["id", "name", "status"];
  const [from, into] = await Promise.all([
    r.changedFrom ? readOne(m.Fit, { where: { id: r.changedFrom, labId: ctx.labId }, attributes }) : null,
    readAll(m.Fit, {
      where: { changedFrom: r.id, labId: ctx.labId },
      attributes,
      order: [
        ["createdAt", "desc"],
        ["id", "asc"],
      ],
    }),
  ]);
  const link = (x: Pick<FitAttributes, "id" | "name" | "status">): FitLinkDto => ({
    id: x.id,
    name: x.name,
    status: x.status,
  });
  return { changedFrom: from ? link(from) : null, changedInto: into.map(link) };
}
