/**
 * Uploaded files. The original goes to object storage, its row to SQLite; the two are written
 * and removed together (see `storeUpload`): a failed store write leaves no row, a failed row write
 * removes the object, an upload cut short by a killed process is swept at the next start, and a
 * delete refused while storage is unreachable keeps the row. No transaction waits on storage.
 */
import "server-only";
import { createReadStream } from "node:fs";
import { randomUUID } from "node:crypto";
import type { InferAttributes, Transaction } from "sequelize";
import { can } from "@/lib/access/permissions";
import { uploadOriginalKey } from "@/storage/keys";
import { StorageUnavailableError } from "@/storage/object-store";
import type { Upload, UploadKind } from "@/models/upload";
import type { ImageLayout } from "@/lib/imaging";
import type { LabContext } from "../access";
import { authorize, readAfterCheck, readInLab } from "../access";
import { auditRefusal, findDependents, refuseWithDependents } from "../dependents";
import { AppError, notFound } from "../errors";
import { type ListQuery, type ListResult, pageResult, readPageOptions } from "../web/list";
import { CONTAINS_TEXT, readAll, readPage } from "../db-read";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { findSpecimen, readSpecimen } from "../studies/specimens";

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
  /** Images: size, bit depth, channels, planes (z), time points from the file's headers; null for tables and older uploads. */
  imageLayout: ImageLayout | null;
  uploadedBy: string | null;
  uploadedByEmail: string | null;
  createdAt: string;
  canDelete: boolean;
  /**
   * The same file (same SHA-256) uploaded earlier to the same specimen: this one is a repeat, and
   * comparisons and fits count the file once. Null when it is the first.
   */
  duplicateOf: { id: string; filename: string } | null;
}

export const UPLOAD_SORTS = ["filename", "kind", "sizeBytes", "createdAt"] as const;

type UploadRow = InstanceType<Awaited<ReturnType<typeof database>>["Upload"]>;

async function toDtos(ctx: LabContext, rows: InferAttributes<Upload>[]): Promise<UploadDto[]> {
  const m = await database();
  // Independent reads, sent together: one wait for the database instead of two in a row.
  const [emails, same] = await Promise.all([
    emailsOf(rows.map((r) => r.createdBy)),
    // Earlier uploads of the same file to the same specimen, in one query.
    rows.length
      ? readAll(m.Upload, {
          where: {
            specimenId: [...new Set(rows.map((r) => r.specimenId))],
            sha256: [...new Set(rows.map((r) => r.sha256))],
          },
          attributes: ["id", "filename", "specimenId", "sha256", "createdAt"],
          order: [
            ["createdAt", "asc"],
            ["id", "asc"],
          ],
        })
      : [],
  ]);
  const firstOf = new Map<string, { id: string; filename: string }>();
  for (const u of same) {
    const key = `${u.specimenId}\u0000${u.sha256}`;
    if (!firstOf.has(key)) firstOf.set(key, { id: u.id, filename: u.filename });
  }
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
    imageLayout: r.imageLayout ?? null,
    uploadedBy: r.createdBy,
    uploadedByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
    canDelete: can(ctx.role, "upload.delete", { ownerId: r.createdBy, actorId: ctx.actor.userId }),
    duplicateOf: ((first) => (first && first.id !== r.id ? first : null))(
      firstOf.get(`${r.specimenId}\u0000${r.sha256}`),
    ),
  }));
}

export async function listUploads(
  ctx: LabContext,
  specimenId: string,
  q: ListQuery<(typeof UPLOAD_SORTS)[number]>,
): Promise<ListResult<UploadDto>> {
  const m = await database();
  const { rows, count } = await readAfterCheck(
    readSpecimen(ctx, specimenId),
    readPage(m.Upload, {
      where: {
        labId: ctx.labId,
        specimenId,
        ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["filename"], text: q.q } } : {}),
      },
      ...readPageOptions(q),
    }),
  );
  return pageResult(q, await toDtos(ctx, rows), count);
}

export async function findUpload(ctx: LabContext, uploadId: string) {
  const m = await database();
  const u = await m.Upload.findOne({ where: { id: uploadId, labId: ctx.labId } });
  if (!u) throw notFound("upload");
  return u;
}

/** The upload's attributes, for reading (findUpload gives the row to change). */
export async function readUpload(ctx: LabContext, uploadId: string): Promise<InferAttributes<Upload>> {
  return readInLab(ctx, (await database()).Upload, uploadId, "upload");
}

export async function getUpload(ctx: LabContext, uploadId: string): Promise<UploadDto> {
  return (await toDtos(ctx, [await readUpload(ctx, uploadId)]))[0];
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
  /** The batch this file came with (lib/server/batches), if any. */
  batchId?: string | null;
  imageLayout?: ImageLayout | null;
}

/** Removes what an unfinished upload left: its object, then its row (kept while the object may remain). */
export async function abandonUpload(uploadId: string, key: string): Promise<void> {
  const m = await database();
  try {
    await services().store.delete(key);
  } catch (err) {
    console.error(`upload ${uploadId}: could not remove its object ${key}; the sweep will`, err);
    return; // the "receiving" row stays, so the sweep knows to retry the object
  }
  await m.Upload.unscoped()
    .destroy({ where: { id: uploadId, state: "receiving" } })
    .catch((err) => console.error(`upload ${uploadId}: could not remove its unfinished row; the sweep will`, err));
}

/**
 * Stores an upload's original and its row so that neither survives without the other:
 * 1. the row, in state "receiving" (hidden from every list and readout by the model's scope);
 * 2. the object (no transaction is open meanwhile: writes of others go on);
 * 3. one short transaction: the row becomes "stored", the audit entry, and whatever `alsoInTransaction`
 *    adds (the upload's readout), so the upload appears with its readout or not at all.
 * A failure after step 1 removes object and row (`abandonUpload`); a process killed between the
 * steps leaves a "receiving" row that the sweep (upload-recovery.ts) removes with its object.
 */
export async function storeUpload<T = void>(
  ctx: LabContext,
  specimenId: string,
  file: IncomingFile,
  alsoInTransaction?: (upload: UploadRow, transaction: Transaction) => Promise<T>,
): Promise<UploadDto & { also: T | undefined }> {
  authorize(ctx, "upload.create");
  const m = await database();
  const { store, db } = services();
  const specimen = await findSpecimen(ctx, specimenId);
  const id = randomUUID();
  const key = uploadOriginalKey(ctx.labId, id);
  await m.Upload.create({
    id,
    labId: ctx.labId,
    specimenId,
    filename: file.filename,
    kind: file.kind,
    contentType: file.contentType,
    sizeBytes: file.sizeBytes,
    sha256: file.sha256,
    storageKey: key,
    state: "receiving",
    pixelSizeUm: file.pixelSizeUm,
    pixelSizeSource: file.pixelSizeSource,
    batchId: file.batchId ?? null,
    imageLayout: file.imageLayout ?? null,
    createdBy: ctx.actor.userId,
  });
  try {
    await store.put(key, createReadStream(file.path), {
      contentType: file.contentType,
      contentLength: file.sizeBytes,
      sha256Hex: file.sha256,
    });
  } catch (err) {
    await abandonUpload(id, key);
    if (err instanceof StorageUnavailableError)
      throw new AppError("unavailable", "object storage is unreachable, so the file was not saved; try again later");
    throw err;
  }
  try {
    const { row, also } = await db.sequelize.transaction(async (transaction) => {
      const [marked] = await m.Upload.unscoped().update(
        { state: "stored" },
        { where: { id, state: "receiving" }, transaction },
      );
      // Only the sweep removes a "receiving" row: this upload outlived the grace period.
      if (marked !== 1)
        throw new AppError(
          "unavailable",
          "storing the file took longer than the server waits for an upload, so it was discarded; try again",
        );
      const r = (await m.Upload.findByPk(id, { transaction }))!;
      await recordAudit(
        m,
        {
          labId: ctx.labId,
          actor: ctx.actor,
          action: "upload.created",
          targetType: "upload",
          targetId: id,
          summary: `${ctx.actor.email} uploaded “${file.filename}” to specimen “${specimen.label}”`,
          details: { sha256: file.sha256, sizeBytes: file.sizeBytes },
        },
        transaction,
      );
      return { row: r, also: alsoInTransaction ? await alsoInTransaction(r, transaction) : undefined };
    });
    return { ...(await toDtos(ctx, [row]))[0], also };
  } catch (err) {
    await abandonUpload(id, key);
    throw err;
  }
}

export async function deleteUpload(ctx: LabContext, uploadId: string): Promise<void> {
  const m = await database();
  const { store, db } = services();
  const u = await findUpload(ctx, uploadId);
  authorize(ctx, "upload.delete", u.createdBy);
  // Refuse while storage is unreachable, so the rows are not removed with their objects kept.
  try {
    await store.check();
  } catch (err) {
    if (err instanceof StorageUnavailableError)
      throw new AppError("unavailable", "object storage is unreachable, so the file was not deleted; try again later");
    throw err;
  }
  // Rows first, in one short transaction without storage I/O; then the objects. An object whose
  // delete fails after that has no row, and the sweep (upload-recovery.ts) removes it.
  const target = {
    action: "upload.delete-refused",
    targetType: "upload",
    targetId: u.id,
    what: `the upload “${u.filename}”`,
  };
  const { readouts, jobIds } = await auditRefusal(m, ctx, target, () =>
    db.sequelize.transaction(async (transaction) => {
      const rs = await m.Readout.findAll({ where: { uploadId: u.id }, transaction });
      // Provenance holds: a file whose readouts a fit or run used stays (checked inside the transaction).
      const deps = await findDependents(m, ctx.labId, { readoutIds: rs.map((r) => r.id) }, transaction);
      if (deps.length) throw refuseWithDependents(`“${u.filename}”`, "its readouts are", deps);
      await m.Readout.destroy({ where: { uploadId: u.id }, transaction });
      await u.destroy({ transaction });
      await recordAudit(
        m,
        {
          labId: ctx.labId,
          actor: ctx.actor,
          action: "upload.deleted",
          targetType: "upload",
          targetId: u.id,
          summary: `${ctx.actor.email} deleted the upload “${u.filename}”${rs.length ? ` and its ${rs.length} readout(s)` : ""}`,
          details: { sha256: u.sha256, readouts: rs.length },
        },
        transaction,
      );
      return {
        readouts: rs,
        jobIds: rs.filter((r) => r.jobId && (r.status === "queued" || r.status === "running")).map((r) => r.jobId!),
      };
    }),
  );
  const keys = [...readouts.flatMap((r) => Object.values(r.derivedKeys ?? {})), u.storageKey];
  for (const key of keys)
    await store
      .delete(key)
      .catch((err) => console.error(`upload ${u.id} deleted: could not remove ${key}; the sweep will`, err));
  // A readout still queued or running finds its row gone and removes what it wrote; stop it early.
  if (jobIds.length) {
    const { cancelJob } = await import("../jobs/queue");
    for (const id of jobIds) await cancelJob(ctx.labId, id).catch(() => undefined);
  }
}

export async function openUploadContent(ctx: LabContext, uploadId: string) {
  const u = await findUpload(ctx, uploadId);
  try {
    const obj = await services().store.get(u.storageKey);
    return { upload: u, body: obj.body };
  } catch (err) {
    if (err instanceof StorageUnavailableError)
      throw new AppError("unavailable", "object storage is unreachable; try again later");
    throw err;
  }
}
