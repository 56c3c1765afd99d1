/**
 * Uploaded files. The original goes to object storage, its row to SQLite; the two are written
 * and removed together: a failed store write leaves no row, a failed row write removes the object,
 * a failed object delete keeps the row.
 */
import { createReadStream } from "node:fs";
import { randomUUID } from "node:crypto";
import { can } from "@/lib/access/permissions";
import { uploadOriginalKey } from "@/storage/keys";
import { StorageUnavailableError } from "@/storage/object-store";
import type { UploadKind } from "@/models/upload";
import type { LabContext } from "../access";
import { authorize } from "../access";
import { AppError, notFound } from "../errors";
import { containsText, type ListQuery, type ListResult } from "../list";
import { database, services } from "../services";
import { recordAudit } from "./audit";
import { findSpecimen } from "./specimens";

export interface UploadDto {
  id: string;
  specimenId: string;
  filename: string;
  kind: UploadKind;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
  uploadedBy: string | null;
  uploadedByEmail: string | null;
  createdAt: string;
  canDelete: boolean;
}

export const UPLOAD_SORTS = ["filename", "kind", "sizeBytes", "createdAt"] as const;

type UploadRow = InstanceType<Awaited<ReturnType<typeof database>>["Upload"]>;

async function toDtos(ctx: LabContext, rows: UploadRow[]): Promise<UploadDto[]> {
  const m = await database();
  const users = await m.User.findAll({ where: { id: rows.map((r) => r.createdBy).filter((x): x is string => !!x) }, attributes: ["id", "email"] });
  const emails = new Map(users.map((u) => [u.id, u.email]));
  return rows.map((r) => ({
    id: r.id,
    specimenId: r.specimenId,
    filename: r.filename,
    kind: r.kind,
    contentType: r.contentType,
    sizeBytes: r.sizeBytes,
    sha256: r.sha256,
    pixelSizeUm: r.pixelSizeUm,
    pixelSizeSource: r.pixelSizeSource,
    uploadedBy: r.createdBy,
    uploadedByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
    canDelete: can(ctx.role, "upload.delete", { ownerId: r.createdBy, actorId: ctx.actor.userId }),
  }));
}

export async function listUploads(ctx: LabContext, specimenId: string, q: ListQuery<(typeof UPLOAD_SORTS)[number]>): Promise<ListResult<UploadDto>> {
  const m = await database();
  await findSpecimen(ctx, specimenId);
  const where = { labId: ctx.labId, specimenId, ...(q.q ? { filename: containsText(q.q) } : {}) };
  const { rows, count } = await m.Upload.findAndCountAll({ where, order: [[q.sort, q.dir], ["id", "asc"]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
  return { items: await toDtos(ctx, rows), page: q.page, pageSize: q.pageSize, total: count };
}

export async function findUpload(ctx: LabContext, uploadId: string) {
  const m = await database();
  const u = await m.Upload.findOne({ where: { id: uploadId, labId: ctx.labId } });
  if (!u) throw notFound("upload");
  return u;
}

export async function getUpload(ctx: LabContext, uploadId: string): Promise<UploadDto> {
  return (await toDtos(ctx, [await findUpload(ctx, uploadId)]))[0];
}

export interface IncomingFile {
  path: string;
  filename: string;
  sizeBytes: number;
  sha256: string;
  kind: UploadKind;
  contentType: string;
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
}

export async function storeUpload(ctx: LabContext, specimenId: string, file: IncomingFile): Promise<UploadDto> {
  authorize(ctx, "upload.create");
  const m = await database();
  const { store, db } = services();
  const specimen = await findSpecimen(ctx, specimenId);
  const id = randomUUID();
  const key = uploadOriginalKey(ctx.labId, id);
  try {
    await store.put(key, createReadStream(file.path), { contentType: file.contentType, contentLength: file.sizeBytes, sha256Hex: file.sha256 });
  } catch (err) {
    if (err instanceof StorageUnavailableError) throw new AppError("unavailable", "object storage is unreachable, so the file was not saved; try again later");
    throw err;
  }
  try {
    const row = await db.sequelize.transaction(async (transaction) => {
      const r = await m.Upload.create(
        { id, labId: ctx.labId, specimenId, filename: file.filename, kind: file.kind, contentType: file.contentType, sizeBytes: file.sizeBytes, sha256: file.sha256, storageKey: key, pixelSizeUm: file.pixelSizeUm, pixelSizeSource: file.pixelSizeSource, createdBy: ctx.actor.userId },
        { transaction },
      );
      await recordAudit(m, { labId: ctx.labId, actor: ctx.actor, action: "upload.created", targetType: "upload", targetId: id, summary: `${ctx.actor.email} uploaded “${file.filename}” to specimen “${specimen.label}”`, details: { sha256: file.sha256, sizeBytes: file.sizeBytes } }, transaction);
      return r;
    });
    return (await toDtos(ctx, [row]))[0];
  } catch (err) {
    await store.delete(key).catch((e) => console.error(`could not remove orphan object ${key}`, e));
    throw err;
  }
}

export async function deleteUpload(ctx: LabContext, uploadId: string): Promise<void> {
  const m = await database();
  const { store, db } = services();
  const u = await findUpload(ctx, uploadId);
  authorize(ctx, "upload.delete", u.createdBy);
  let jobIds: string[] = [];
  try {
    await db.sequelize.transaction(async (transaction) => {
      // Its readouts and their derived objects go with it; objects are deleted last, inside the
      // transaction, so a storage failure keeps every row.
      const readouts = await m.Readout.findAll({ where: { uploadId: u.id }, transaction });
      jobIds = readouts.filter((r) => r.jobId && (r.status === "queued" || r.status === "running")).map((r) => r.jobId!);
      await m.Readout.destroy({ where: { uploadId: u.id }, transaction });
      await u.destroy({ transaction });
      await recordAudit(m, { labId: ctx.labId, actor: ctx.actor, action: "upload.deleted", targetType: "upload", targetId: u.id, summary: `${ctx.actor.email} deleted the upload “${u.filename}”${readouts.length ? ` and its ${readouts.length} readout(s)` : ""}`, details: { sha256: u.sha256, readouts: readouts.length } }, transaction);
      for (const r of readouts) for (const key of Object.values(r.derivedKeys ?? {})) await store.delete(key);
      await store.delete(u.storageKey);
    });
  } catch (err) {
    if (err instanceof StorageUnavailableError) throw new AppError("unavailable", "object storage is unreachable, so the file was not deleted; try again later");
    throw err;
  }
  // A readout still queued or running finds its row gone and removes what it wrote; stop it early.
  if (jobIds.length) {
    const { cancelJob } = await import("../jobs/runner");
    for (const id of jobIds) await cancelJob(ctx.labId, id).catch(() => undefined);
  }
}

export async function openUploadContent(ctx: LabContext, uploadId: string) {
  const u = await findUpload(ctx, uploadId);
  try {
    const obj = await services().store.get(u.storageKey);
    return { upload: u, body: obj.body };
  } catch (err) {
    if (err instanceof StorageUnavailableError) throw new AppError("unavailable", "object storage is unreachable; try again later");
    throw err;
  }
}
