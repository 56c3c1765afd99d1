/**
 * A study's conditions as a list: the distinct conditions of its specimens, matched without regard to
 * case and surrounding spaces ("Kontrolle" = " kontrolle"), each shown as most specimens spell it; and
 * renaming one renames it on every specimen of the study, in one transaction, audited.
 */
import "server-only";
import { conditionKey } from "@/lib/spacing";
import type { LabContext } from "../access";
import { authorize } from "../access";
import { recordAudit } from "../audit";
import { AppError } from "../errors";
import { database, services } from "../services";
import { findStudy } from "./studies";

export interface StudyConditionDto {
  /** As most of its specimens spell it (ties: the first in alphabetical order). */
  name: string;
  specimens: number;
  /** Other spellings met, e.g. "kontrolle" beside "Kontrolle". */
  otherSpellings: string[];
}

export async function listStudyConditions(ctx: LabContext, studyId: string): Promise<StudyConditionDto[]> {
  await findStudy(ctx, studyId);
  const m = await database();
  const rows = await m.Specimen.findAll({ where: { labId: ctx.labId, studyId }, attributes: ["condition"] });
  const groups = new Map<string, Map<string, number>>();
  for (const r of rows) {
    const k = conditionKey(r.condition);
    const spellings = groups.get(k) ?? new Map<string, number>();
    spellings.set(r.condition, (spellings.get(r.condition) ?? 0) + 1);
    groups.set(k, spellings);
  }
  return [...groups.values()]
    .map((spellings) => {
      const sorted = [...spellings.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]));
      return {
        name: sorted[0][0],
        specimens: sorted.reduce((s, [, n]) => s + n, 0),
        otherSpellings: sorted.slice(1).map(([s]) => s),
      };
    })
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** Renames condition `from` (any spelling) to `to` on every specimen of the study; returns how many changed. */
export async function renameStudyCondition(
  ctx: LabContext,
  studyId: string,
  input: { from: string; to: string },
): Promise<{ renamed: number; conditions: StudyConditionDto[] }> {
  const study = await findStudy(ctx, studyId);
  authorize(ctx, "study.edit", study.createdBy);
  const to = input.to.trim().replace(/\s+/g, " ");
  const m = await database();
  const fromKey = conditionKey(input.from);
  const renamed = await services().db.sequelize.transaction(async (transaction) => {
    const specimens = await m.Specimen.findAll({ where: { labId: ctx.labId, studyId }, transaction });
    const hit = specimens.filter((s) => conditionKey(s.condition) === fromKey);
    if (hit.length === 0)
      throw new AppError("not_found", `No specimen of this study has the condition “${input.from.trim()}”.`, {
        field: "from",
      });
    for (const s of hit) if (s.condition !== to) await s.update({ condition: to }, { transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "study.condition-renamed",
        targetType: "study",
        targetId: studyId,
        summary: `${ctx.actor.email} renamed the condition “${input.from.trim()}” to “${to}” on ${hit.length} specimen(s) of “${study.name}”`,
        details: { from: input.from, to, specimens: hit.length },
      },
      transaction,
    );
    return hit.length;
  });
  return { renamed, conditions: await listStudyConditions(ctx, studyId) };
}
