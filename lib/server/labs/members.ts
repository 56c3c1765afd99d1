/** Members of a lab: list, change role, remove; a lab always keeps at least one lab manager. */
import "server-only";
import { Op } from "sequelize";
import { ROLE_LABELS, type Role } from "@/lib/access/roles";
import type { LabContext } from "../access";
import { AppError, notFound } from "../errors";
import type { ListQuery, ListResult } from "../web/list";
import { database, services } from "../services";
import { recordAudit } from "../audit";

export interface MemberDto {
  id: string;
  userId: string;
  email: string;
  name: string | null;
  role: Role;
  joinedAt: string;
}

export const MEMBER_SORTS = ["email", "name", "role", "joinedAt"] as const;

export async function listMembers(
  ctx: LabContext,
  q: ListQuery<(typeof MEMBER_SORTS)[number]>,
): Promise<ListResult<MemberDto>> {
  const m = await database();
  const memberships = await m.Membership.findAll({
    where: { labId: ctx.labId },
    include: [{ model: m.User, as: "user" }],
  });
  let items: MemberDto[] = memberships.map((x) => {
    const u = (x as unknown as { user: { email: string; name: string | null } }).user;
    return {
      id: x.id,
      userId: x.userId,
      email: u.email,
      name: u.name,
      role: x.role,
      joinedAt: x.createdAt.toISOString(),
    };
  });
  if (q.q) {
    const needle = q.q.toLowerCase();
    items = items.filter(
      (i) => i.email.includes(needle) || (i.name ?? "").toLowerCase().includes(needle) || i.role.includes(needle),
    );
  }
  const dir = q.dir === "asc" ? 1 : -1;
  items.sort((a, b) => dir * String(a[q.sort] ?? "").localeCompare(String(b[q.sort] ?? "")));
  const start = (q.page - 1) * q.pageSize;
  return { items: items.slice(start, start + q.pageSize), page: q.page, pageSize: q.pageSize, total: items.length };
}

const LAST_MANAGER = "a lab must keep at least one lab manager: make someone else lab manager first";

export async function changeMemberRole(ctx: LabContext, membershipId: string, role: Role): Promise<MemberDto> {
  const m = await database();
  return services().db.sequelize.transaction(async (transaction) => {
    const membership = await m.Membership.findOne({
      where: { id: membershipId, labId: ctx.labId },
      include: [{ model: m.User, as: "user" }],
      transaction,
    });
    if (!membership) throw notFound("member");
    const user = (membership as unknown as { user: { email: string; name: string | null } }).user;
    const before = membership.role;
    if (before === role)
      return {
        id: membership.id,
        userId: membership.userId,
        email: user.email,
        name: user.name,
        role,
        joinedAt: membership.createdAt.toISOString(),
      };
    if (before === "manager") {
      const managers = await m.Membership.count({ where: { labId: ctx.labId, role: "manager" }, transaction });
      if (managers <= 1) throw new AppError("conflict", LAST_MANAGER);
    }
    await membership.update({ role }, { transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "member.role_changed",
        targetType: "member",
        targetId: membership.userId,
        summary: `${ctx.actor.email} changed ${user.email} from ${ROLE_LABELS[before]} to ${ROLE_LABELS[role]}`,
        details: { from: before, to: role },
      },
      transaction,
    );
    return {
      id: membership.id,
      userId: membership.userId,
      email: user.email,
      name: user.name,
      role,
      joinedAt: membership.createdAt.toISOString(),
    };
  });
}

export async function removeMember(ctx: LabContext, membershipId: string): Promise<void> {
  const m = await database();
  await services().db.sequelize.transaction(async (transaction) => {
    const membership = await m.Membership.findOne({
      where: { id: membershipId, labId: ctx.labId },
      include: [{ model: m.User, as: "user" }],
      transaction,
    });
    if (!membership) throw notFound("member");
    const user = (membership as unknown as { user: { email: string } }).user;
    if (membership.role === "manager") {
      const managers = await m.Membership.count({
        where: { labId: ctx.labId, role: "manager", id: { [Op.ne]: membership.id } },
        transaction,
      });
      if (managers === 0) throw new AppError("conflict", LAST_MANAGER);
    }
    await membership.destroy({ transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "member.removed",
        targetType: "member",
        targetId: membership.userId,
        summary: `${ctx.actor.email} removed ${user.email} (${ROLE_LABELS[membership.role]}) from the lab`,
        details: { role: membership.role },
      },
      transaction,
    );
  });
}
