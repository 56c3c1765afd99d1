/** Studies of a lab: one tissue and organism, many specimens. */
import "server-only";
import { fn, col, type InferAttributes } from "sequelize";
import type { Study } from "@/models/study";
import { can } from "@/lib/access/permissions";
import type { LabContext } from "../access";
import { authorize, readInLab } from "../access";
import { AppError, notFound } from "../errors";
import { type ListQuery, type ListResult, pageResult, readPageOptions } from "../web/list";
import { CONTAINS_TEXT, readAll, readPage } from "../db-read";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { changedFields, describeChanges, fitSummary, recordAudit } from "../audit";

export interface StudyDto {
  id: string;
  labId: string;
  name: string;
  tissue: string;
  organism: string;
  description: string | null;
  specimenCount: number;
  conditions: string[];
  createdBy: string | null;
  createdByEmail: string | null;
  createdAt: string;
  updatedAt: string;
  canEdit: boolean;
}

export const STUDY_SORTS = ["name", "tissue", "organism", "createdAt", "updatedAt"] as const;

async function toDtos(ctx: LabContext, studies: InferAttributes<Study>[]): Promise<StudyDto[]> {
  const m = await database();
  const ids = studies.map((s) => s.id);
  // Independent reads, sent together: one wait for the database instead of two in a row.
  const [specimens, emails] = await Promise.all([
    ids.length ? readAll(m.Specimen, { where: { studyId: ids }, attributes: ["studyId", "condition"] }) : [],
    emailsOf(studies.map((s) => s.createdBy)),
  ]);
  return studies.map((s) => {
    const mine = specimens.filter((x) => x.studyId === s.id);
    return {
      id: s.id,
      labId: s.labId,
      name: s.name,
      tissue: s.tissue,
      organism: s.organism,
      description: s.description,
      specimenCount: mine.length,
      conditions: [...new Set(mine.map((x) => x.condition))].sort(),
      createdBy: s.createdBy,
      createdByEmail: s.createdBy ? (emails.get(s.createdBy) ?? null) : null,
      createdAt: s.createdAt.toISOString(),
      updatedAt: s.updatedAt.toISOString(),
      canEdit: can(ctx.role, "study.edit", { ownerId: s.createdBy, actorId: ctx.actor.userId }),
    };
  });
}

export async function listStudies(
  ctx: LabContext,
  q: ListQuery<(typeof STUDY_SORTS)[number]>,
): Promise<ListResult<StudyDto>> {
  const m = await database();
  const { rows, count } = await readPage(m.Study, {
    where: {
      labId: ctx.labId,
      ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["name", "tissue", "organism"], text: q.q } } : {}),
    },
    ...readPageOptions(q),
  });
  return pageResult(q, await toDtos(ctx, rows), count);
}

export async function findStudy(ctx: LabContext, studyId: string) {
  const m = await database();
  const study = await m.Study.findOne({ where: { id: studyId, labId: ctx.labId } });
  if (!study) throw notFound("study");
  return study;
}

/** The study's attributes, for reading (findStudy gives the row to change). */
export async function readStudy(ctx: LabContext, studyId: string): Promise<InferAttributes<Study>> {
  return readInLab(ctx, (await database()).Study, studyId, "study");
}

export async function getStudy(ctx: LabContext, studyId: string): Promise<StudyDto> {
  return (await toDtos(ctx, [await readStudy(ctx, studyId)]))[0];
}

export async function createStudy(
  ctx: LabContext,
  input: { name: string; tissue: string; organism: string; description: string | null },
): Promise<StudyDto> {
  authorize(ctx, "study.create");
  const m = await database();
  const study = await services().db.sequelize.transaction(async (transaction) => {
    const s = await m.Study.create({ ...input, labId: ctx.labId, createdBy: ctx.actor.userId }, { transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "study.created",
        targetType: "study",
        targetId: s.id,
        summary: `${ctx.actor.email} created the study “${s.name}”`,
      },
      transaction,
    );
    return s;
  });
  return (await toDtos(ctx, [study]))[0];
}

export async function updateStudy(
  ctx: LabContext,
  studyId: string,
  input: Partial<{ name: string; tissue: string; organism: string; description: string | null }>,
): Promise<StudyDto> {
  const study = await findStudy(ctx, studyId);
  authorize(ctx, "study.edit", study.createdBy);
  const m = await database();
  const changes = changedFields(study.get({ plain: true }), input, {
    name: "Name",
    tissue: "Tissue",
    organism: "Organism",
    description: "Description",
  });
  const before = study.name;
  await services().db.sequelize.transaction(async (transaction) => {
    await study.update(input, { transaction });
    if (changes.length === 0) return; // nothing changed, nothing to record
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "study.edited",
        targetType: "study",
        targetId: study.id,
        summary: fitSummary(`${ctx.actor.email} edited the study “${before}”: ${describeChanges(changes)}`),
        details: { changes },
      },
      transaction,
    );
  });
  return (await toDtos(ctx, [study]))[0];
}

/** A study with uploads must have them deleted first (their objects live in storage). */
export async function deleteStudy(ctx: LabContext, studyId: string): Promise<void> {
  const m = await database();
  const study = await findStudy(ctx, studyId);
  authorize(ctx, "study.delete", study.createdBy);
  const specimens = await m.Specimen.findAll({ where: { studyId }, attributes: ["id"] });
  const uploads = specimens.length
    ? await m.Upload.unscoped().count({ where: { specimenId: specimens.map((s) => s.id) } })
    : 0;
  if (uploads > 0)
    throw new AppError("conflict", `this study still has ${uploads} uploaded file(s); delete them first`);
  await services().db.sequelize.transaction(async (transaction) => {
    await m.Specimen.destroy({ where: { studyId }, transaction });
    await study.destroy({ transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "study.deleted",
        targetType: "study",
        targetId: studyId,
        summary: `${ctx.actor.email} deleted the study “${study.name}” and its ${specimens.length} specimen(s)`,
      },
      transaction,
    );
  });
}

/** Specimen counts per condition across the lab, for the dashboard. */
export async function countConditions(ctx: LabContext) {
  const m = await database();
  const rows = (await m.Specimen.findAll({
    where: { labId: ctx.labId },
    attributes: ["condition", [fn("COUNT", col("id")), "n"]],
    group: ["condition"],
    raw: true,
  })) as unknown as { condition: string; n: number | string }[];
  // PostgreSQL returns COUNT (a bigint) as a string.
  return rows.map((r) => ({ condition: r.condition, n: Number(r.n) }));
}
