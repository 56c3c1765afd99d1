/**
 * Invitations: a lab manager invites an e-mail address with a role; the link carries a random
 * token (only its SHA-256 is stored), works once and expires after `INVITATION_DAYS`.
 */
import "server-only";
import { Op } from "sequelize";
import { ROLE_LABELS, type Role } from "@/lib/access/roles";
import type { LabContext } from "../access";
import { AppError, notFound } from "../errors";
import type { Actor } from "../accounts/actor";
import { hashPassword, verifyPassword } from "../accounts/passwords";
import {
  enforceRateLimit,
  lockedForS,
  lockoutMessage,
  RateLimitedError,
  recordFailedPassword,
} from "../web/rate-limit";
import { newSecret, sha256Hex } from "../secrets";
import { database, services } from "../services";
import { recordAudit } from "../audit";

export type InvitationStatus = "pending" | "accepted" | "revoked" | "expired";

export interface InvitationDto {
  id: string;
  email: string;
  role: Role;
  status: InvitationStatus;
  invitedAt: string;
  expiresAt: string;
}

function statusOf(
  inv: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date },
  now = new Date(),
): InvitationStatus {
  if (inv.acceptedAt) return "accepted";
  if (inv.revokedAt) return "revoked";
  if (inv.expiresAt.getTime() <= now.getTime()) return "expired";
  return "pending";
}

export async function listInvitations(ctx: LabContext): Promise<InvitationDto[]> {
  const m = await database();
  const rows = await m.Invitation.findAll({ where: { labId: ctx.labId }, order: [["createdAt", "desc"]] });
  return rows.map((i) => ({
    id: i.id,
    email: i.email,
    role: i.role,
    status: statusOf(i),
    invitedAt: i.createdAt.toISOString(),
    expiresAt: i.expiresAt.toISOString(),
  }));
}

export async function createInvitation(
  ctx: LabContext,
  email: string,
  role: Role,
  address?: string,
): Promise<InvitationDto> {
  await enforceRateLimit("invitation", { account: email, address: address ?? `user:${ctx.actor.userId}` });
  const m = await database();
  const { config, mailer, db } = services();
  const user = await m.User.findOne({ where: { email } });
  if (user && (await m.Membership.findOne({ where: { labId: ctx.labId, userId: user.id } }))) {
    throw new AppError("conflict", `${email} is already a member of this lab`);
  }
  const token = newSecret("inv", 24);
  const expiresAt = new Date(Date.now() + config.invitationDays * 24 * 3600 * 1000);
  const link = `${config.appUrl.replace(/\/$/, "")}/invite/${token}`;
  // The mail goes out before the transaction, never inside it: a slow mail server must not hold
  // the database's write turn. Should the write then fail, the mailed link finds no invitation.
  try {
    await mailer.send({
      to: email,
      subject: `You are invited to ${ctx.labName} on Morphokin`,
      text: `${ctx.actor.name ?? ctx.actor.email} invited you to join the lab “${ctx.labName}” on Morphokin as ${ROLE_LABELS[role]}.\n\nAccept the invitation here:\n${link}\n\nThe link works once and expires on ${expiresAt.toUTCString()}.`,
    });
  } catch (err) {
    throw new AppError(
      "unavailable",
      "the invitation e-mail could not be sent (mail server unreachable); nothing was saved, try again",
      { cause: String(err) },
    );
  }
  return db.sequelize.transaction(async (transaction) => {
    // A new invitation to the same address replaces any pending one.
    await m.Invitation.update(
      { revokedAt: new Date() },
      { where: { labId: ctx.labId, email, acceptedAt: { [Op.is]: null }, revokedAt: { [Op.is]: null } }, transaction },
    );
    const inv = await m.Invitation.create(
      { labId: ctx.labId, email, role, tokenHash: sha256Hex(token), invitedBy: ctx.actor.userId, expiresAt },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "invitation.created",
        targetType: "invitation",
        targetId: inv.id,
        summary: `${ctx.actor.email} invited ${email} as ${ROLE_LABELS[role]}`,
        details: { role },
      },
      transaction,
    );
    return {
      id: inv.id,
      email,
      role,
      status: "pending" as const,
      invitedAt: inv.createdAt.toISOString(),
      expiresAt: expiresAt.toISOString(),
    };
  });
}

export async function revokeInvitation(ctx: LabContext, invitationId: string): Promise<void> {
  const m = await database();
  const inv = await m.Invitation.findOne({ where: { id: invitationId, labId: ctx.labId } });
  if (!inv) throw notFound("invitation");
  const status = statusOf(inv);
  if (status !== "pending") throw new AppError("conflict", `this invitation is already ${status}`);
  await services().db.sequelize.transaction(async (transaction) => {
    await inv.update({ revokedAt: new Date() }, { transaction });
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "invitation.revoked",
        targetType: "invitation",
        targetId: inv.id,
        summary: `${ctx.actor.email} revoked the invitation of ${inv.email}`,
      },
      transaction,
    );
  });
}

async function findByToken(token: string) {
  const m = await database();
  const inv = await m.Invitation.findOne({ where: { tokenHash: sha256Hex(token) } });
  if (!inv) throw notFound("invitation");
  return inv;
}

function explainUnusable(status: InvitationStatus): AppError {
  const why = {
    accepted: "this invitation was already used; sign in instead",
    revoked: "this invitation was revoked by the lab manager; ask for a new one",
    expired: "this invitation has expired; ask the lab manager for a new one",
    pending: "",
  }[status];
  return new AppError("conflict", why);
}

export interface InvitationPublicDto {
  labName: string;
  email: string;
  role: Role;
  roleLabel: string;
  status: InvitationStatus;
  accountExists: boolean;
  expiresAt: string;
}

export async function describeInvitation(token: string): Promise<InvitationPublicDto> {
  const m = await database();
  const inv = await findByToken(token);
  const lab = await m.Lab.findByPk(inv.labId);
  const user = await m.User.findOne({ where: { email: inv.email } });
  return {
    labName: lab?.name ?? "",
    email: inv.email,
    role: inv.role,
    roleLabel: ROLE_LABELS[inv.role],
    status: statusOf(inv),
    accountExists: !!user,
    expiresAt: inv.expiresAt.toISOString(),
  };
}

/** The refusal when someone else's session opens the link (the link alone must not be enough). */
export function wrongAccountMessage(signedInAs: string, invitedEmail: string): string {
  return `You are signed in as ${signedInAs}; this invitation is for ${invitedEmail}. Sign out first.`;
}

/**
 * Accepting needs the e-mailed link (the token) and the invitee: a new person sets a name and
 * password; an existing account confirms with its password or is signed in as itself. A session
 * (or API token) of any other account is refused.
 */
export async function acceptInvitation(
  token: string,
  input: { name?: string; password?: string },
  actor: Actor | null = null,
) {
  const m = await database();
  const inv = await findByToken(token);
  const status = statusOf(inv);
  if (status !== "pending") throw explainUnusable(status);
  if (actor && actor.email.toLowerCase() !== inv.email.toLowerCase())
    throw new AppError("forbidden", wrongAccountMessage(actor.email, inv.email));
  const existing = await m.User.findOne({ where: { email: inv.email } });
  const signedInAsInvitee = !!actor && !!existing && actor.userId === existing.id;
  if (existing && !signedInAsInvitee) {
    const locked = await lockedForS(inv.email);
    if (locked > 0) throw new RateLimitedError(lockoutMessage(locked), locked);
    if (!input.password) throw new AppError("bad_input", `password: enter the password of your account ${inv.email}`);
    if (!(await verifyPassword(input.password, existing.passwordHash))) {
      await recordFailedPassword(inv.email);
      throw new AppError("unauthenticated", `wrong password for the existing account ${inv.email}`);
    }
  }
  if (!existing && !input.name) throw new AppError("bad_input", "name: enter your name");
  if (!existing && !input.password) throw new AppError("bad_input", "password: choose a password");
  const passwordHash = existing ? null : await hashPassword(input.password!);
  return services().db.sequelize.transaction(async (transaction) => {
    // Re-read inside the transaction so two clicks cannot both accept.
    const fresh = await m.Invitation.findByPk(inv.id, { transaction });
    if (!fresh || statusOf(fresh) !== "pending") throw explainUnusable(fresh ? statusOf(fresh) : "revoked");
    const user =
      existing ??
      (await m.User.create(
        { name: input.name!, email: inv.email, passwordHash, emailVerified: new Date() },
        { transaction },
      ));
    const already = await m.Membership.findOne({ where: { labId: inv.labId, userId: user.id }, transaction });
    if (!already) await m.Membership.create({ labId: inv.labId, userId: user.id, role: inv.role }, { transaction });
    await fresh.update({ acceptedAt: new Date() }, { transaction });
    await recordAudit(
      m,
      {
        labId: inv.labId,
        actor: { userId: user.id, email: user.email },
        action: "member.joined",
        targetType: "member",
        targetId: user.id,
        summary: `${user.email} accepted the invitation and joined as ${ROLE_LABELS[inv.role]}`,
        details: { role: inv.role },
      },
      transaction,
    );
    return { labId: inv.labId, email: user.email };
  });
}
