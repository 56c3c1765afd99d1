/** Sign-up (a new user and their own lab, with them as lab manager), password change and per-user settings. */
import "server-only";
import { Op, UniqueConstraintError } from "sequelize";
import type { SignupInput } from "@/lib/contracts/account";
import type { Actor } from "./actor";
import { ACCOUNT_MAIL_SUBJECTS } from "./account-mail";
import { AppError } from "../errors";
import { createSignInLink, sendInBackground, SIGN_IN_LINK_MINUTES } from "./auth";
import { hashPassword } from "./passwords";
import { checkPasswordOrRefuse } from "./password-check";
import { enforceRateLimit } from "../web/rate-limit";
import { newSecret, sha256Hex } from "../secrets";
import { closeOtherSessions } from "./sessions";
import { changeDisplayName } from "./profile";
import { database, services } from "../services";
import { recordAccountEvent, recordAudit } from "../audit";

export interface MeDto {
  id: string;
  email: string;
  name: string | null;
  notifyByEmail: boolean;
  labs: { id: string; name: string; role: string }[];
}

interface NewAccount {
  name: string;
  email: string;
  passwordHash: string;
  labName: string;
  emailVerified: Date | null;
}

/** Creates the user, their lab and their lab-manager membership in one transaction. */
async function createAccountWithLab(input: NewAccount) {
  const m = await database();
  const { sequelize } = services().db;
  try {
    return await sequelize.transaction(async (transaction) => {
      const existing = await m.User.findOne({ where: { email: input.email }, transaction });
      if (existing)
        throw new AppError("conflict", `an account with the e-mail ${input.email} already exists; sign in instead`);
      const user = await m.User.create(
        { name: input.name, email: input.email, passwordHash: input.passwordHash, emailVerified: input.emailVerified },
        { transaction },
      );
      const lab = await m.Lab.create({ name: input.labName, createdBy: user.id }, { transaction });
      await m.Membership.create({ labId: lab.id, userId: user.id, role: "manager" }, { transaction });
      await recordAudit(
        m,
        {
          labId: lab.id,
          actor: { userId: user.id, email: user.email },
          action: "lab.created",
          targetType: "lab",
          targetId: lab.id,
          summary: `${user.email} created the lab “${lab.name}” and is its lab manager`,
        },
        transaction,
      );
      return { userId: user.id, labId: lab.id };
    });
  } catch (err) {
    if (err instanceof UniqueConstraintError)
      throw new AppError("conflict", `an account with the e-mail ${input.email} already exists; sign in instead`);
    throw err;
  }
}

/** An account and its lab at once, without the e-mail round trip (demo data and tests). */
export async function signUp(input: { name: string; email: string; password: string; labName: string }) {
  return createAccountWithLab({ ...input, passwordHash: await hashPassword(input.password), emailVerified: null });
}

export interface SignupAnswer {
  status: "check-email";
  email: string;
  message: string;
}

/**
 * Sign-up as the public form does it: the same answer, after the same work, whether or not the
 * address has an account. A new address gets a confirmation link (the account and its lab are
 * created when it is opened); an address with an account gets a mail saying so, with a sign-in
 * link. Both mails leave after the answer (sendInBackground).
 */
export async function requestSignup(
  input: { name: string; email: string; password: string; labName: string },
  address: string,
): Promise<SignupAnswer> {
  await enforceRateLimit("signUp", { account: input.email, address });
  const m = await database();
  const { config } = services();
  const base = config.appUrl.replace(/\/$/, "");
  // Hash first for everyone: the bcrypt cost dominates, so both paths take the same time.
  const passwordHash = await hashPassword(input.password);
  const existing = await m.User.findOne({ where: { email: input.email }, attributes: ["id"] });
  if (existing) {
    const link = await createSignInLink(input.email);
    sendInBackground({
      to: input.email,
      subject: ACCOUNT_MAIL_SUBJECTS.signupTaken,
      text: `Someone (probably you) tried to create a Morphokin account with this address, but it already has one. Nothing was changed.\n\nSign in with this one-time link (it expires in ${SIGN_IN_LINK_MINUTES} minutes):\n${link}\n\nor with your password at ${base}/login\n\nIf this was not you, ignore this message.`,
    });
  } else {
    const token = newSecret("su", 24);
    const expiresAt = new Date(Date.now() + config.signupLinkHours * 3600_000);
    await m.SignupRequest.create({
      tokenHash: sha256Hex(token),
      email: input.email,
      name: input.name,
      labName: input.labName,
      passwordHash,
      expiresAt,
    });
    sendInBackground({
      to: input.email,
      subject: ACCOUNT_MAIL_SUBJECTS.signupConfirm,
      text: `Open this link to confirm your address and create your Morphokin account and the lab “${input.labName}”:\n\n${base}/signup/confirm/${token}\n\nThe link works once and expires on ${expiresAt.toUTCString()}. If you did not sign up, ignore this message.`,
    });
  }
  return {
    status: "check-email",
    email: input.email,
    message: `Check your e-mail: a message to ${input.email} tells you how to go on.`,
  };
}

async function findSignupRequest(token: string) {
  const m = await database();
  const request = await m.SignupRequest.findOne({ where: { tokenHash: sha256Hex(token) } });
  if (!request)
    throw new AppError(
      "not_found",
      "this confirmation link is not valid; check that you copied the whole link from the e-mail",
    );
  if (request.usedAt) throw new AppError("conflict", "this confirmation link was already used; sign in instead");
  if (request.expiresAt.getTime() <= Date.now())
    throw new AppError("conflict", "this confirmation link has expired; sign up again");
  return request;
}

export async function describeSignupRequest(token: string): Promise<{ email: string; labName: string }> {
  const r = await findSignupRequest(token);
  return { email: r.email, labName: r.labName };
}

/**
 * Opens the confirmation link: with the password chosen at sign-up (so the mail alone is not
 * enough), creates the account, verified, and its lab.
 */
export async function confirmSignup(token: string, password: string) {
  const request = await findSignupRequest(token);
  await checkPasswordOrRefuse(
    request.email,
    password,
    request.passwordHash,
    "password: this is not the password you chose when you signed up",
  );
  const m = await database();
  // Claim the link first, so two clicks cannot both create the account.
  const [claimed] = await m.SignupRequest.update(
    { usedAt: new Date() },
    { where: { id: request.id, usedAt: { [Op.is]: null } } },
  );
  if (claimed === 0) throw new AppError("conflict", "this confirmation link was already used; sign in instead");
  try {
    const created = await createAccountWithLab({
      name: request.name,
      email: request.email,
      passwordHash: request.passwordHash,
      labName: request.labName,
      emailVerified: new Date(),
    });
    return { ...created, email: request.email };
  } catch (err) {
    if (!(err instanceof AppError)) await m.SignupRequest.update({ usedAt: null }, { where: { id: request.id } });
    throw err;
  }
}

/** Changes the password after checking the current one, and ends every other session of the account. */
export async function changePassword(
  actor: Actor,
  input: { currentPassword: string; newPassword: string },
  keepSid: string | null,
) {
  const m = await database();
  const user = await m.User.findByPk(actor.userId);
  if (!user) throw new AppError("unauthenticated", "your account no longer exists");
  await checkPasswordOrRefuse(
    user.email,
    input.currentPassword,
    user.passwordHash,
    "current password: that is not your current password",
  );
  if (input.currentPassword === input.newPassword)
    throw new AppError("bad_input", "new password: choose a password different from the current one");
  await services().db.sequelize.transaction(async (transaction) => {
    await user.update({ passwordHash: await hashPassword(input.newPassword) }, { transaction });
    await recordAccountEvent(
      m,
      {
        userId: user.id,
        email: user.email,
        action: "password.changed",
        summary: `${user.email} changed their password on the Account page; their other sessions were signed out`,
      },
      transaction,
    );
  });
  const ended = await closeOtherSessions(user.id, keepSid);
  return { changed: true, endedSessions: ended };
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

export async function updateSettings(actor: Actor, settings: { notifyByEmail?: boolean; name?: string }) {
  const m = await database();
  if (settings.notifyByEmail !== undefined)
    await m.User.update({ notifyByEmail: settings.notifyByEmail }, { where: { id: actor.userId } });
  if (settings.name !== undefined) await changeDisplayName(actor, settings.name);
  return getMe(actor);
}

/** Another lab for an existing user, who becomes its manager. */
export async function createLab(actor: Actor, name: string) {
  const m = await database();
  return services().db.sequelize.transaction(async (transaction) => {
    const lab = await m.Lab.create({ name, createdBy: actor.userId }, { transaction });
    await m.Membership.create({ labId: lab.id, userId: actor.userId, role: "manager" }, { transaction });
    await recordAudit(
      m,
      {
        labId: lab.id,
        actor,
        action: "lab.created",
        targetType: "lab",
        targetId: lab.id,
        summary: `${actor.email} created the lab “${name}” and is its lab manager`,
      },
      transaction,
    );
    return { id: lab.id, name: lab.name, role: "manager" as const };
  });
}
