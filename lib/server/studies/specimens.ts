/** Specimens: one sample under one condition, with a stage, genotype and notes. */
import "server-only";
import type { InferAttributes } from "sequelize";
import type { Specimen } from "@/models/specimen";
import { can } from "@/lib/access/permissions";
import type { LabContext } from "../access";
import { authorize, readAfterCheck, readInLab } from "../access";
import { AppError, notFound } from "../errors";
import { type ListQuery, type ListResult, pageResult, readPageOptions } from "../web/list";
import { CONTAINS_TEXT, readAll, readPage } from "../db-read";
import { database, services } from "../services";
import { changedFields, describeChanges, fitSummary, recordAudit } from "../audit";
import { findStudy, readStudy } from "./studies";

export interface SpecimenDto {
  id: string;
  studyId: string;
  studyName: string;
  label: string;
  condition: string;
  stage: string | null;
  genotype: string | null;
  notes: string | null;
  uploadCount: number;
  createdBy: string | null;
  createdAt: string;
  canEdit: boolean;
}

export interface SpecimenFields {
  label: string;
  condition: string;
  stage: string | null;
  genotype: string | null;
  notes: string | null;
}

export const SPECIMEN_SORTS = ["label", "condition", "stage", "genotype", "createdAt"] as const;

async function toDtos(ctx: LabContext, rows: InferAttributes<Specimen>[]): Promise<SpecimenDto[]> {
  const m = await database();
  const ids = rows.map((r) => r.id);
  // Independent reads, sent together: one wait for the database instead of two in a row.
  const [uploads, studies] = await Promise.all([
    ids.length ? readAll(m.Upload, { where: { specimenId: ids }, attributes: ["specimenId"] }) : [],
    readAll(m.Study, { where: { id: [...new Set(rows.map((r) => r.studyId))] }, attributes: ["id", "name"] }),
  ]);
  const studyNames = new Map(studies.map((s) => [s.id, s.name]));
  return rows.map((r) => ({
    id: r.id,
    studyId: r.studyId,
    studyName: studyNames.get(r.studyId) ?? "",
    label: r.label,
    condition: r.condition,
    stage: r.stage,
    genotype: r.genotype,
    notes: r.notes,
    uploadCount: uploads.filter((u) => u.specimenId === r.id).length,
    createdBy: r.createdBy,
    createdAt: r.createdAt.toISOString(),
    canEdit: can(ctx.role, "specimen.edit", { ownerId: r.createdBy, actorId: ctx.actor.userId }),
  }));
}

export async function listSpecimens(
  ctx: LabContext,
  studyId: string,
  q: ListQuery<(typeof SPECIMEN_SORTS)[number]>,
): Promise<ListResult<SpecimenDto>> {
  const m = await database();
  const { rows, count } = await readAfterCheck(
    readStudy(ctx, studyId),
    readPage(m.Specimen, {
      where: {
        labId: ctx.labId,
        studyId,
        ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["label", "condition", "stage", "genotype"], text: q.q } } : {}),
      },
      ...readPageOptions(q),
    }),
  );
  return pageResult(q, await toDtos(ctx, rows), count);
}

export async function findSpecimen(ctx: LabContext, specimenId: string) {
  const m = await database();
  const s = await m.Specimen.findOne({ where: { id: specimenId, labId: ctx.labId } });
  if (!s) throw notFound("specimen");
  return s;
}

/** The specimen's attributes, for reading (findSpecimen gives the row to change). */
export async function readSpecimen(ctx: LabContext, specimenId: string): Promise<InferAttributes<Specimen>> {
  return readInLab(ctx, (await database()).Specimen, specimenId, "specimen");
}

export async function getSpecimen(ctx: LabContext, specimenId: string): Promise<SpecimenDto> {
  return (await toDtos(ctx, [await readSpecimen(ctx, specimenId)]))[0];
}

export async function createSpecimen(ctx: LabContext, studyId: string, input: SpecimenFields): Promise<SpecimenDto> {
  authorize(ctx, "specimen.create");
  const m = await database();
  const study = await findStudy(ctx, studyId);
  const s = await services().db.sequelize.transaction(async (transaction) => {
    const row = await m.Specimen.create(
      { ...input, labId: ctx.labId, studyId, createdBy: ctx.actor.userId },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "specimen.created",
        targetType: "specimen",
        targetId: row.id,
        summary: `${ctx.actor.email} added specimen “${row.label}” (${row.condition}) to “${study.name}”`,
      },
      transaction,
    );
    return row;
  });
  return (await toDtos(ctx, [s]))[0];
}

export async function updateSpecimen(
  ctx: LabContext,
  specimenId: string,
  input: Partial<SpecimenFields>,
): Promise<SpecimenDto> {
  const s = await findSpecimen(ctx, specimenId);
  authorize(ctx, "specimen.edit", s.createdBy);
  const m = await database();
  const changes = changedFields(s.get({ plain: true }), input, {
    label: "Label",
    condition: "Condition",
    stage: "Stage",
    genotype: "Genotype",
    notes: "Notes",
  });
  const before = s.label;
  await services().db.sequelize.transaction(async (transaction) => {
    await s.update(input, { transaction });
    if (changes.length === 0) return; // nothing changed, nothing to record
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "specimen.edited",
        targetType: "specimen",
        targetId: s.id,
        summary: fitSummary(`${ctx.actor.email} edited specimen “${before}”: ${describeChanges(changes)}`),
        details: { changes },
      },
      transaction,
    );
  });
  return (await toDtos(ctx, [s]))[0];
}

export async function deleteSpecimen(ctx: LabContext, specimenId: string): Promise<void> {
  const m = await database();
  const s = await findSpecimen(ctx, specimenId);
  authorize(ctx, "specimen.delete", s.createdBy);
  const uploads = await m.Upload.unscoped().count({ where: { specimenId } }); // one still being received counts too (its row holds the specimen)
  if (uploads > 0)
    throw new AppError("conflict", `this specimen still has ${uploads} uploaded file(s); delete them first`);
  await services().db.sequelize.transaction(async (transaction) => {
    await s.destroy({ transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "specimen.deleted",
        targetType: "specimen",
        targetId: specimenId,
        summary: `${ctx.actor.email} deleted specimen “${s.label}”`,
      },
      transaction,
    );
  });
}
