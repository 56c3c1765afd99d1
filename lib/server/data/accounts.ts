/** Sign-up (a new user and their own lab, with them as lab manager) and per-user settings. */
import { UniqueConstraintError } from "sequelize";
import type { SignupInput } from "@/lib/contracts/account";
import type { Actor } from "../actor";
import { AppError } from "../errors";
import { hashPassword } from "../passwords";
import { database, services } from "../services";
import { recordAudit } from "./audit";

export interface MeDto {
  id: string;
  email: string;
  name: string | null;
  notifyByEmail: boolean;
  labs: { id: string; name: string; role: string }[];
}

export async function signUp(input: { name: string; email: string; password: string; labName: string }) {
  const m = await database();
  const { sequelize } = services().db;
  const passwordHash = await hashPassword(input.password);
  try {
    return await sequelize.transaction(async (transaction) => {
      const existing = await m.User.findOne({ where: { email: input.email }, transaction });
      if (existing) throw new AppError("conflict", `an account with the e-mail ${input.email} already exists; sign in instead`);
      const user = await m.User.create({ name: input.name, email: input.email, passwordHash, emailVerified: null }, { transaction });
      const lab = await m.Lab.create({ name: input.labName, createdBy: user.id }, { transaction });
      await m.Membership.create({ labId: lab.id, userId: user.id, role: "manager" }, { transaction });
      await recordAudit(m, { labId: lab.id, actor: { userId: user.id, email: user.email }, action: "lab.created", targetType: "lab", targetId: lab.id, summary: `${user.email} created the lab “${lab.name}” and is its lab manager` }, transaction);
      return { userId: user.id, labId: lab.id };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw new AppError("conflict", `an account with the e-mail ${input.email} already exists; sign in instead`);
    throw err;
  }
}
export type { SignupInput };

export async function getMe(actor: Actor): Promise<MeDto> {
  const m = await database();
  const user = await m.User.findByPk(actor.userId);
  if (!user) throw new AppError("unauthenticated", "your account no longer exists");
  const memberships = await m.Membership.findAll({ where: { userId: actor.userId } });
  const labs = await m.Lab.findAll({ where: { id: memberships.map((x) => x.labId) } });
  const byId = new Map(labs.map((l) => [l.id, l]));
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    notifyByEmail: user.notifyByEmail,
    labs: memberships
      .map((x) => ({ id: x.labId, name: byId.get(x.labId)?.name ?? "?", role: x.role }))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}

export async function updateSettings(actor: Actor, settings: { notifyByEmail: boolean }) {
  const m = await database();
  await m.User.update({ notifyByEmail: settings.notifyByEmail }, { where: { id: actor.userId } });
  return getMe(actor);
}

/** Another lab for an existing user, who becomes its manager. */
export async function createLab(actor: Actor, name: string) {
  const m = await database();
  return services().db.sequelize.transaction(async (transaction) => {
    const lab = await m.Lab.create({ name, createdBy: actor.userId }, { transaction });
    await m.Membership.create({ labId: lab.id, userId: actor.userId, role: "manager" }, { transaction });
    await recordAudit(m, { labId: lab.id, actor, action: "lab.created", targetType: "lab", targetId: lab.id, summary: `${actor.email} created the lab “${name}” and is its lab manager` }, transaction);
    return { id: lab.id, name: lab.name, role: "manager" as const };
  });
}
