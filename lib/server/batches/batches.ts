/**
 * Batches: many files uploaded at once to one specimen or to a study, with the settings chosen
 * once. Creating one writes its row (and, for "one-specimen", the new specimen) with the audit
 * entry in one transaction; its files arrive one request each (./receive.ts).
 */
import "server-only";
import type { BatchTarget } from "@/models/batch";
import { batchCreateSchema } from "@/lib/contracts/batch";
import { authorize, type LabContext } from "../access";
import { notFound } from "../errors";
import { type ListQuery, type ListResult, containsText, pageOptions, pageResult } from "../web/list";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { findSpecimen } from "../studies/specimens";
import { findStudy } from "../studies/studies";

export interface BatchDto {
  id: string;
  name: string;
  target: BatchTarget;
  studyId: string | null;
  studyName: string | null;
  specimenId: string | null;
  specimenLabel: string | null;
  condition: string | null;
  stage: string | null;
  pixelSizeUm: number | null;
  pixelSizeOverride: boolean;
  createdBy: string | null;
  createdByEmail: string | null;
  createdAt: string;
  /** Stored uploads of the batch and files refused at upload. */
  fileCount: number;
  rejectedCount: number;
}

export const BATCH_SORTS = ["createdAt", "name"] as const;

type BatchRow = InstanceType<Awaited<ReturnType<typeof database>>["Batch"]>;

export async function toBatchDtos(rows: BatchRow[]): Promise<BatchDto[]> {
  if (rows.length === 0) return [];
  const m = await database();
  const ids = rows.map((r) => r.id);
  const [users, studies, specimens, uploads, rejections] = await Promise.all([
    m.User.findAll({ where: { id: rows.map((r) => r.createdBy).filter((x): x is string => !!x) } }),
    m.Study.findAll({ where: { id: rows.map((r) => r.studyId).filter((x): x is string => !!x) } }),
    m.Specimen.findAll({ where: { id: rows.map((r) => r.specimenId).filter((x): x is string => !!x) } }),
    m.Upload.findAll({ where: { batchId: ids }, attributes: ["batchId"] }),
    m.BatchRejection.findAll({ where: { batchId: ids }, attributes: ["batchId"] }),
  ]);
  const emails = new Map(users.map((u) => [u.id, u.email]));
  const studyNames = new Map(studies.map((s) => [s.id, s.name]));
  const labels = new Map(specimens.map((s) => [s.id, s.label]));
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    target: r.target,
    studyId: r.studyId,
    studyName: r.studyId ? (studyNames.get(r.studyId) ?? null) : null,
    specimenId: r.specimenId,
    specimenLabel: r.specimenId ? (labels.get(r.specimenId) ?? null) : null,
    condition: r.condition,
    stage: r.stage,
    pixelSizeUm: r.pixelSizeUm,
    pixelSizeOverride: r.pixelSizeOverride,
    createdBy: r.createdBy,
    createdByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
    fileCount: uploads.filter((u) => u.batchId === r.id).length,
    rejectedCount: rejections.filter((x) => x.batchId === r.id).length,
  }));
}

export async function findBatch(ctx: LabContext, batchId: string): Promise<BatchRow> {
  const m = await database();
  const b = await m.Batch.findOne({ where: { id: batchId, labId: ctx.labId } });
  if (!b) throw notFound("batch");
  return b;
}

/** The default name: when it was started, to the minute (UTC), as a person would reopen it. */
const defaultName = (at: Date) => `Batch of ${at.toISOString().slice(0, 16).replace("T", " ")} UTC`;

export async function createBatch(ctx: LabContext, body: unknown): Promise<BatchDto> {
  authorize(ctx, "upload.create");
  const parsed = batchCreateSchema.safeParse(body ?? {});
  if (!parsed.success) throw parsed.error;
  const input = parsed.data;
  const m = await database();
  // 404 before anything is written when the specimen or study is not in this lab.
  const specimen = input.target === "specimen" ? await findSpecimen(ctx, input.specimenId!) : null;
  const study = specimen ? await findStudy(ctx, specimen.studyId) : await findStudy(ctx, input.studyId!);
  if (input.target !== "specimen") authorize(ctx, "specimen.create");
  const pixelSizeUm = typeof input.pixelSizeUm === "number" ? input.pixelSizeUm : null;
  const now = new Date();
  const row = await services().db.sequelize.transaction(async (transaction) => {
    let specimenId = specimen?.id ?? null;
    if (input.target === "one-specimen") {
      const s = await m.Specimen.create(
        {
          labId: ctx.labId,
          studyId: study.id,
          label: input.specimenLabel!,
          condition: input.condition!,
          stage: input.stage,
          genotype: null,
          notes: null,
          createdBy: ctx.actor.userId,
        },
        { transaction },
      );
      specimenId = s.id;
      await recordAudit(
        m,
        {
          labId: ctx.labId,
          actor: ctx.actor,
          action: "specimen.created",
          targetType: "specimen",
          targetId: s.id,
          summary: `${ctx.actor.email} added specimen “${s.label}” (${s.condition}) to “${study.name}” for a batch upload`,
        },
        transaction,
      );
    }
    const b = await m.Batch.create(
      {
        labId: ctx.labId,
        name: input.name ?? defaultName(now),
        target: input.target,
        studyId: study.id,
        specimenId,
        condition: input.target === "specimen" ? null : input.condition,
        stage: input.target === "specimen" ? null : input.stage,
        pixelSizeUm,
        pixelSizeOverride: input.pixelSizeOverride && pixelSizeUm !== null,
        createdBy: ctx.actor.userId,
        createdAt: now,
      },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "batch.created",
        targetType: "batch",
        targetId: b.id,
        summary: `${ctx.actor.email} started the batch upload “${b.name}” into ${specimen ? `specimen “${specimen.label}”` : `study “${study.name}”`}`,
        details: { target: b.target },
      },
      transaction,
    );
    return b;
  });
  return (await toBatchDtos([row]))[0];
}

export async function getBatch(ctx: LabContext, batchId: string): Promise<BatchDto> {
  return (await toBatchDtos([await findBatch(ctx, batchId)]))[0];
}

export async function listBatches(
  ctx: LabContext,
  q: ListQuery<(typeof BATCH_SORTS)[number]>,
): Promise<ListResult<BatchDto>> {
  const m = await database();
  const where = { labId: ctx.labId, ...(q.q ? { name: containsText(q.q) } : {}) };
  const { rows, count } = await m.Batch.findAndCountAll({ where, ...pageOptions(q) });
  return pageResult(q, await toBatchDtos(rows), count);
}
