/**
 * Spacing readouts: one upload read with one set of settings, immutable once made (other
 * settings make a new readout). Starting one writes its row and its background job in one
 * transaction; the job (lib/server/readouts/job.ts) writes the result and the derived
 * objects together. The row always has a status; a result exists only with status "succeeded".
 */
import "server-only";
import { randomUUID } from "node:crypto";
import type { InferAttributes, Transaction } from "sequelize";
import packageJson from "@/package.json";
import { DERIVED_PRODUCTS, type DerivedProduct } from "@/lib/contracts/readout";
import type { JobStatus } from "@/models/job";
import type { Readout } from "@/models/readout";
import type { ImageLayout } from "@/lib/imaging";
import { StorageUnavailableError } from "@/storage/object-store";
import { authorize, readInLab, type LabContext } from "../access";
import { AppError, notFound } from "../errors";
import { enqueueJob } from "../jobs/queue";
import { type ListQuery, type ListResult, pageResult } from "../web/list";
import { attributesExcept, CONTAINS_TEXT, readAll, readOne, readPage, withColumns, type ReadWhere } from "../db-read";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { headlineOf, type ReadoutHeadline, type ReadoutResult } from "./result";
import { resolveStartSettings, type StoredReadoutSettings } from "./settings";
import { findUpload, readUpload } from "../uploads/uploads";

export const SOFTWARE_VERSION = `morphokin ${packageJson.version}`;
export const READOUT_SORTS = ["createdAt", "status", "wavelengthUm"] as const;

export interface ReadoutDto {
  id: string;
  uploadId: string;
  specimenId: string;
  filename: string;
  kind: "image" | "table";
  status: JobStatus;
  /** 0..1 from the job while it runs. */
  progress: number;
  progressNote: string | null;
  error: string | null;
  jobId: string | null;
  settings: StoredReadoutSettings;
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
  softwareVersion: string;
  inputSha256: string;
  headline: ReadoutHeadline | null;
  createdBy: string | null;
  createdByEmail: string | null;
  createdAt: string;
}

export interface ReadoutDetailDto extends ReadoutDto {
  result: ReadoutResult | null;
  /** API paths of the stored derived products. */
  derived: Partial<Record<DerivedProduct, string>>;
  specimenLabel: string;
  condition: string;
  studyId: string;
  studyName: string;
  /** The upload's channels, planes and time points from its headers (null for tables and older uploads). */
  imageLayout: ImageLayout | null;
}

type Row = InstanceType<Awaited<ReturnType<typeof database>>["Readout"]>;

/** The columns a list reads instead of these, which hold the whole result and its files. */
const FULL_ATTRIBUTES = ["result", "derivedKeys"] as const;

/**
 * A succeeded readout's headline: stored beside the result, or for a readout finished before that
 * column, computed from the result (a list reads it only for such readouts, see listReadouts).
 */
function headlineOfRow(r: Partial<InferAttributes<Readout>>): ReadoutHeadline | null {
  if (r.headline) return r.headline as unknown as ReadoutHeadline;
  return r.result ? headlineOf(r.result as unknown as ReadoutResult) : null;
}

async function toDtos(rows: InferAttributes<Readout>[]): Promise<ReadoutDto[]> {
  const m = await database();
  const jobIds = rows.filter((r) => r.jobId && (r.status === "queued" || r.status === "running")).map((r) => r.jobId!);
  // Three independent reads, sent together: one wait for the database instead of three in a row.
  const [uploads, jobRows, emails] = await Promise.all([
    rows.length
      ? readAll(m.Upload, { where: { id: [...new Set(rows.map((r) => r.uploadId))] }, attributes: ["id", "filename"] })
      : [],
    jobIds.length ? readAll(m.Job, { where: { id: jobIds } }) : [],
    emailsOf(rows.map((r) => r.createdBy)),
  ]);
  const names = new Map(uploads.map((u) => [u.id, u.filename]));
  const jobs = new Map(jobRows.map((j) => [j.id, j]));
  return rows.map((r) => {
    const settings = r.settings as unknown as StoredReadoutSettings;
    const job = r.jobId ? jobs.get(r.jobId) : undefined;
    // A job cancelled or lost before its handler ran never touched the row: show the job's end.
    const ended = job && job.status !== "queued" && job.status !== "running" && job.status !== "succeeded";
    const status: JobStatus = ended ? job.status : r.status;
    return {
      id: r.id,
      uploadId: r.uploadId,
      specimenId: r.specimenId,
      filename: names.get(r.uploadId) ?? "",
      kind: r.kind as "image" | "table",
      status,
      progress: r.status === "succeeded" ? 1 : (job?.progress ?? 0),
      progressNote: job?.progressNote ?? null,
      error: ended ? job.error : r.error,
      jobId: r.jobId,
      settings,
      pixelSizeUm: r.pixelSizeUm,
      pixelSizeSource: settings.pixelSizeSource ?? null,
      softwareVersion: r.softwareVersion,
      inputSha256: r.inputSha256,
      headline: r.status === "succeeded" ? headlineOfRow(r) : null,
      createdBy: r.createdBy,
      createdByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
    };
  });
}

export interface ReadoutFilter {
  uploadId?: string;
  specimenId?: string;
}

export async function listReadouts(
  ctx: LabContext,
  filter: ReadoutFilter,
  q: ListQuery<(typeof READOUT_SORTS)[number]>,
): Promise<ListResult<ReadoutDto>> {
  const m = await database();
  if (filter.uploadId) await readUpload(ctx, filter.uploadId);
  const where: ReadWhere = {
    labId: ctx.labId,
    ...(filter.uploadId ? { uploadId: filter.uploadId } : {}),
    ...(filter.specimenId ? { specimenId: filter.specimenId } : {}),
  };
  if (q.q) {
    const uploads = await readAll(m.Upload, {
      where: { labId: ctx.labId, [CONTAINS_TEXT]: { attributes: ["filename"], text: q.q } },
      attributes: ["id"],
    });
    Object.assign(where, {
      uploadId: filter.uploadId
        ? [filter.uploadId].filter((id) => uploads.some((u) => u.id === id))
        : uploads.map((u) => u.id),
    });
  }
  const { rows, count } = await readPage(m.Readout, {
    where,
    // The stored headline instead of the whole result.
    attributes: attributesExcept(m.Readout, FULL_ATTRIBUTES),
    order: [
      [q.sort, q.dir],
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  // Readouts finished before the headline column: their results, for these rows only.
  const full = await withColumns(m.Readout, rows, (r) => r.status === "succeeded" && !r.headline, ["result"]);
  return pageResult(q, await toDtos(full), count);
}

async function findReadout(ctx: LabContext, readoutId: string): Promise<Row> {
  const m = await database();
  const r = await m.Readout.findOne({ where: { id: readoutId, labId: ctx.labId } });
  if (!r) throw notFound("readout");
  return r;
}

export async function getReadout(ctx: LabContext, readoutId: string): Promise<ReadoutDetailDto> {
  const m = await database();
  const r = await readInLab(ctx, m.Readout, readoutId, "readout");
  // The readout's own fields, its specimen (then study) and its upload's layout, read together.
  const [[dto], [specimen, study], upload] = await Promise.all([
    toDtos([r]),
    readOne(m.Specimen, { where: { id: r.specimenId }, attributes: ["id", "label", "condition", "studyId"] }).then(
      async (s) =>
        [s, s ? await readOne(m.Study, { where: { id: s.studyId }, attributes: ["id", "name"] }) : null] as const,
    ),
    readOne(m.Upload, { where: { id: r.uploadId }, attributes: ["id", "imageLayout"] }),
  ]);
  const base = `/api/v1/labs/${ctx.labId}/readouts/${r.id}/derived`;
  const derived = Object.fromEntries(
    Object.keys(r.status === "succeeded" ? (r.derivedKeys ?? {}) : {}).map((k) => [k, `${base}/${k}`]),
  );
  return {
    ...dto,
    result: r.status === "succeeded" ? (r.result as unknown as ReadoutResult) : null,
    derived,
    specimenLabel: specimen?.label ?? "",
    condition: specimen?.condition ?? "",
    studyId: specimen?.studyId ?? "",
    studyName: study?.name ?? "",
    imageLayout: upload?.imageLayout ?? null,
  };
}

/** Queues a readout of an upload with the given settings (a JSON body; {} = defaults). */
export async function startReadout(ctx: LabContext, uploadId: string, body: unknown): Promise<ReadoutDto> {
  authorize(ctx, "readout.create");
  const upload = await findUpload(ctx, uploadId);
  const settings = resolveStartSettings(upload, body);
  const row = await services().db.sequelize.transaction((transaction) =>
    queueReadout(ctx, upload, settings, transaction),
  );
  return toReadoutDto(row);
}

type UploadForReadout = { id: string; specimenId: string; kind: "image" | "table"; sha256: string };

/** Writes a queued readout of `upload` and its job inside the caller's transaction (an upload's first readout). */
export async function queueReadout(
  ctx: LabContext,
  upload: UploadForReadout,
  settings: StoredReadoutSettings,
  transaction: Transaction,
): Promise<Row> {
  const m = await database();
  const id = randomUUID();
  const job = await enqueueJob(
    { labId: ctx.labId, kind: "readout", payload: { readoutId: id }, requestedBy: ctx.actor.userId },
    transaction,
  );
  return m.Readout.create(
    {
      id,
      labId: ctx.labId,
      uploadId: upload.id,
      specimenId: upload.specimenId,
      jobId: job.id,
      status: "queued",
      kind: upload.kind,
      settings: settings as unknown as Record<string, unknown>,
      pixelSizeUm: settings.pixelSizeUm,
      inputSha256: upload.sha256,
      softwareVersion: SOFTWARE_VERSION,
      createdBy: ctx.actor.userId,
    },
    { transaction },
  );
}

export async function toReadoutDto(row: Row): Promise<ReadoutDto> {
  return (await toDtos([row]))[0];
}

/** Many rows at once (a batch's summary): one query per related table, not per row. */
export const toReadoutDtos = (rows: Row[]): Promise<ReadoutDto[]> => toDtos(rows);

/** A stored derived product of a finished readout. */
export async function openDerived(ctx: LabContext, readoutId: string, product: string) {
  if (!Object.hasOwn(DERIVED_PRODUCTS, product)) throw notFound("derived product");
  const r = await findReadout(ctx, readoutId);
  const key =
    r.status === "succeeded" && r.derivedKeys && Object.hasOwn(r.derivedKeys, product)
      ? r.derivedKeys[product]
      : undefined;
  if (!key) throw notFound("derived product");
  try {
    const obj = await services().store.get(key);
    return {
      body: obj.body,
      contentType: DERIVED_PRODUCTS[product as DerivedProduct],
      contentLength: obj.contentLength,
    };
  } catch (err) {
    if (err instanceof StorageUnavailableError)
      throw new AppError("unavailable", "object storage is unreachable; try again later");
    if ((err as { name?: string }).name === "NoSuchKey") throw notFound("derived product");
    throw err;
  }
}
