/**
 * A lab's own kinetics, whose definitions are immutable versions — every save adds one, so a fit
 * can name exactly what it used. The published catalogue is in ./catalogue.ts.
 */
import "server-only";
import { auditRefusal, findDependents, refuseWithDependents } from "../dependents";
import { Op } from "sequelize";
import { can } from "@/lib/access/permissions";
import { resolveParameters, type KineticsDefinition } from "@/lib/kinetics";
import { findSteadyStates } from "@/lib/stability";
import type { LabContext } from "../access";
import { authorize, isUuid } from "../access";
import { AppError, notFound } from "../errors";
import { containsText, type ListQuery, type ListResult, pageOptions, pageResult } from "../web/list";
import { emailsOf } from "../accounts/emails";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { toAppError } from "../core-errors";
import { compileDefinition } from "./engine";

export interface LabKineticsDto {
  id: string;
  labId: string;
  name: string;
  description: string | null;
  latestVersion: number;
  species: string[];
  createdBy: string | null;
  createdByEmail: string | null;
  createdAt: string;
  updatedAt: string;
  canEdit: boolean;
}

export interface KineticsVersionDto {
  version: number;
  definition: KineticsDefinition;
  createdByEmail: string | null;
  createdAt: string;
}

export const LAB_KINETICS_SORTS = ["name", "latestVersion", "createdAt", "updatedAt"] as const;

type Row = InstanceType<Awaited<ReturnType<typeof database>>["LabKinetics"]>;

async function toDtos(ctx: LabContext, rows: Row[]): Promise<LabKineticsDto[]> {
  const m = await database();
  const emails = await emailsOf(rows.map((r) => r.createdBy));
  const latest = rows.length
    ? await m.KineticsVersion.findAll({
        where: { [Op.or]: rows.map((r) => ({ kineticsId: r.id, version: r.latestVersion })) },
        attributes: ["kineticsId", "definition"],
      })
    : [];
  const species = new Map(latest.map((v) => [v.kineticsId, v.definition.species]));
  return rows.map((r) => ({
    id: r.id,
    labId: r.labId,
    name: r.name,
    description: r.description,
    latestVersion: r.latestVersion,
    species: species.get(r.id) ?? [],
    createdBy: r.createdBy,
    createdByEmail: r.createdBy ? (emails.get(r.createdBy) ?? null) : null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    canEdit: can(ctx.role, "kinetics.edit", { ownerId: r.createdBy, actorId: ctx.actor.userId }),
  }));
}

export async function listLabKinetics(
  ctx: LabContext,
  q: ListQuery<(typeof LAB_KINETICS_SORTS)[number]>,
): Promise<ListResult<LabKineticsDto>> {
  const m = await database();
  const where = {
    labId: ctx.labId,
    ...(q.q ? { [Op.or]: [{ name: containsText(q.q) }, { description: containsText(q.q) }] } : {}),
  };
  const { rows, count } = await m.LabKinetics.findAndCountAll({
    where,
    ...pageOptions(q),
  });
  return pageResult(q, await toDtos(ctx, rows), count);
}

async function findLabKinetics(ctx: LabContext, id: string): Promise<Row> {
  if (!isUuid(id)) throw notFound("kinetics");
  const m = await database();
  const row = await m.LabKinetics.findOne({ where: { id, labId: ctx.labId } });
  if (!row) throw notFound("kinetics");
  return row;
}

export async function getLabKinetics(ctx: LabContext, id: string): Promise<LabKineticsDto> {
  return (await toDtos(ctx, [await findLabKinetics(ctx, id)]))[0];
}

/** One stored version (the latest when `version` is omitted), with its row id for caching. */
export async function getLabKineticsVersion(
  ctx: LabContext,
  id: string,
  version?: number,
): Promise<{ versionId: string; version: number; definition: KineticsDefinition }> {
  const row = await findLabKinetics(ctx, id);
  const m = await database();
  const v = await m.KineticsVersion.findOne({ where: { kineticsId: row.id, version: version ?? row.latestVersion } });
  if (!v) throw notFound(`version ${version} of this kinetics`);
  return { versionId: v.id, version: v.version, definition: v.definition };
}

export async function listKineticsVersions(ctx: LabContext, id: string): Promise<KineticsVersionDto[]> {
  const row = await findLabKinetics(ctx, id);
  const m = await database();
  const versions = await m.KineticsVersion.findAll({ where: { kineticsId: row.id }, order: [["version", "desc"]] });
  const emails = await emailsOf(versions.map((v) => v.createdBy));
  return versions.map((v) => ({
    version: v.version,
    definition: v.definition,
    createdByEmail: v.createdBy ? (emails.get(v.createdBy) ?? null) : null,
    createdAt: v.createdAt.toISOString(),
  }));
}

/**
 * Compiles the definition and looks for a homogeneous steady state at the default parameters;
 * a kinetics without one cannot be analysed, so it is refused (422) with the solver's reason.
 */
export function checkDefinition(definition: KineticsDefinition): void {
  const compiled = compileDefinition(definition);
  try {
    findSteadyStates(compiled, resolveParameters(compiled, {}, "definition.parameters"));
  } catch (err) {
    const e = toAppError(err) ?? err;
    if (e instanceof AppError && e.code === "unprocessable") {
      throw new AppError(
        "unprocessable",
        `definition: no steady state at the default parameter values — ${e.message}`,
        { field: "definition.parameters" },
      );
    }
    throw e;
  }
}

interface KineticsInput {
  description: string | null;
  definition: KineticsDefinition;
}

export async function createLabKinetics(ctx: LabContext, input: KineticsInput): Promise<LabKineticsDto> {
  authorize(ctx, "kinetics.edit");
  checkDefinition(input.definition);
  const m = await database();
  const row = await services().db.sequelize.transaction(async (transaction) => {
    const k = await m.LabKinetics.create(
      {
        labId: ctx.labId,
        name: input.definition.name,
        description: input.description,
        latestVersion: 1,
        createdBy: ctx.actor.userId,
      },
      { transaction },
    );
    await m.KineticsVersion.create(
      { kineticsId: k.id, labId: ctx.labId, version: 1, definition: input.definition, createdBy: ctx.actor.userId },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "kinetics.created",
        targetType: "kinetics",
        targetId: k.id,
        summary: `${ctx.actor.email} created the kinetics “${k.name}” (version 1, ${input.definition.species.length} species)`,
      },
      transaction,
    );
    return k;
  });
  return (await toDtos(ctx, [row]))[0];
}

/** Saves the definition as the next version; earlier versions stay as they were. */
export async function updateLabKinetics(ctx: LabContext, id: string, input: KineticsInput): Promise<LabKineticsDto> {
  const row = await findLabKinetics(ctx, id);
  authorize(ctx, "kinetics.edit", row.createdBy);
  checkDefinition(input.definition);
  const m = await database();
  await services().db.sequelize.transaction(async (transaction) => {
    await row.reload({ transaction });
    const version = row.latestVersion + 1;
    await m.KineticsVersion.create(
      { kineticsId: row.id, labId: ctx.labId, version, definition: input.definition, createdBy: ctx.actor.userId },
      { transaction },
    );
    await row.update(
      { name: input.definition.name, description: input.description, latestVersion: version },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "kinetics.edited",
        targetType: "kinetics",
        targetId: row.id,
        summary: `${ctx.actor.email} saved version ${version} of the kinetics “${row.name}”`,
      },
      transaction,
    );
  });
  return (await toDtos(ctx, [row]))[0];
}

export async function deleteLabKinetics(ctx: LabContext, id: string): Promise<void> {
  const row = await findLabKinetics(ctx, id);
  authorize(ctx, "kinetics.edit", row.createdBy);
  const m = await database();
  const target = {
    action: "kinetics.delete-refused",
    targetType: "kinetics",
    targetId: id,
    what: `the kinetics “${row.name}”`,
  };
  await auditRefusal(m, ctx, target, () =>
    services().db.sequelize.transaction(async (transaction) => {
      // Provenance holds: kinetics a fit or run used stays, with every version.
      const deps = await findDependents(m, ctx.labId, { kineticsId: row.id }, transaction);
      if (deps.length) throw refuseWithDependents(`The kinetics “${row.name}”`, "its versions are", deps);
      const n = await m.KineticsVersion.destroy({ where: { kineticsId: row.id }, transaction });
      await row.destroy({ transaction });
      await recordAudit(
        m,
        {
          labId: ctx.labId,
          actor: ctx.actor,
          action: "kinetics.deleted",
          targetType: "kinetics",
          targetId: id,
          summary: `${ctx.actor.email} deleted the kinetics “${row.name}” and its ${n} version(s)`,
        },
        transaction,
      );
    }),
  );
}
