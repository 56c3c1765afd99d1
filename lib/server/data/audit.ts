import { Op, type Transaction } from "sequelize";
import type { Models } from "@/models";
import type { Actor } from "../actor";
import type { LabContext } from "../access";
import { containsText, type ListQuery, type ListResult } from "../list";
import { database } from "../services";

export interface AuditEntry {
  labId: string;
  actor: Pick<Actor, "userId" | "email"> | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  summary: string;
  details?: Record<string, unknown>;
}

export async function recordAudit(m: Models, entry: AuditEntry, transaction?: Transaction) {
  await m.AuditEvent.create(
    {
      labId: entry.labId,
      actorId: entry.actor?.userId ?? null,
      actorEmail: entry.actor?.email ?? null,
      action: entry.action,
      targetType: entry.targetType,
      targetId: entry.targetId ?? null,
      summary: entry.summary,
      details: entry.details ?? null,
    },
    { transaction },
  );
}

export interface AuditEventDto {
  id: string;
  at: string;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  summary: string;
}

export const AUDIT_SORTS = ["at", "action", "actorEmail"] as const;

export async function listAudit(ctx: LabContext, q: ListQuery<(typeof AUDIT_SORTS)[number]>): Promise<ListResult<AuditEventDto>> {
  const m = await database();
  const where = {
    labId: ctx.labId,
    ...(q.q ? { [Op.or]: [{ summary: containsText(q.q) }, { action: containsText(q.q) }, { actorEmail: containsText(q.q) }] } : {}),
  };
  const column = q.sort === "at" ? "createdAt" : q.sort;
  const { rows, count } = await m.AuditEvent.findAndCountAll({ where, order: [[column, q.dir], ["id", "asc"]], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
  return {
    items: rows.map((e) => ({ id: e.id, at: e.createdAt.toISOString(), actorEmail: e.actorEmail, action: e.action, targetType: e.targetType, targetId: e.targetId, summary: e.summary })),
    page: q.page,
    pageSize: q.pageSize,
    total: count,
  };
}
