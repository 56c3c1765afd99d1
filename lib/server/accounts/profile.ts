/**
 * The account's display name and e-mail address. A new address takes effect only when the link
 * mailed to it is opened (proof the person reads it); until then the old one stays, and it gets a
 * notice at once, so a stolen session cannot quietly move the account. Asking needs the current
 * password. An address that already has an account gets a note instead of a link, and the answer
 * is the same either way (no enumeration). Every change is an account event.
 */
import "server-only";
import { Op, UniqueConstraintError } from "sequelize";
import type { Actor } from "./actor-type";
import { AppError } from "../errors";
import { recordAccountEvent } from "../audit";
import { database, services } from "../services";
import { ACCOUNT_LINK_PATHS, ACCOUNT_MAIL_SUBJECTS } from "./account-mail";
import {
  appBase,
  claimAccountLink,
  createAccountLink,
  EMAIL_CHANGE_LINK_HOURS,
  findAccountLink,
  retireAccountLinks,
} from "./account-links";
import { sendInBackground } from "./auth";
import { checkPasswordOrRefuse } from "./password-check";

export async function changeDisplayName(actor: Actor, name: string) {
  const m = await database();
  const user = await m.User.findByPk(actor.userId);
  if (!user) throw new AppError("unauthenticated", "your account no longer exists");
  if (user.name === name) return;
  await services().db.sequelize.transaction(async (transaction) => {
    const before = user.name;
    await user.update({ name }, { transaction });
    await recordAccountEvent(
      m,
      {
        userId: user.id,
        email: user.email,
        action: "name.changed",
        summary: `${user.email} changed their display name from ${before ? `“${before}”` : "(none)"} to “${name}”`,
        details: { from: before, to: name },
      },
      transaction,
    );
  });
}

export async function requestEmailChange(actor: Actor, input: { newEmail: string; currentPassword: string }) {
  const m = await database();
  const user = await m.User.findByPk(actor.userId);
  if (!user) throw new AppError("unauthenticated", "your account no longer exists");
  await checkPasswordOrRefuse(
    user.email,
    input.currentPassword,
    user.passwordHash,
    "current password: that is not your current password",
  );
  const newEmail = input.newEmail;
  if (newEmail === user.email)
    throw new AppError("bad_input", "new e-mail address: that is already your address; type the new one");
  const base = appBase();
  const taken = await m.User.findOne({ where: { email: newEmail }, attributes: ["id"] });
  if (taken) {
    sendInBackground({
      to: newEmail,
      subject: ACCOUNT_MAIL_SUBJECTS.emailChangeTaken,
      text: `Someone signed in to Morphokin asked to move their account to this address, but this address already has an account. Nothing was changed.\n\nIf this was you, sign in to that account instead: ${base}/login`,
    });
  } else {
    const { token, expiresAt } = await createAccountLink(
      user.id,
      "email-change",
      EMAIL_CHANGE_LINK_HOURS * 3_600_000,
      newEmail,
    );
    sendInBackground({
      to: newEmail,
      subject: ACCOUNT_MAIL_SUBJECTS.emailChange,
      text:
        `Open this link to make ${newEmail} the e-mail address of your Morphokin account (now ${user.email}):\n\n` +
        `${base}${ACCOUNT_LINK_PATHS.emailChange}${token}\n\n` +
        `The link works once and expires in ${EMAIL_CHANGE_LINK_HOURS} hours (${expiresAt.toUTCString()}). Until you open it, your address stays ${user.email}.\n\n` +
        `If you did not ask for this, ignore this message.`,
    });
  }
  sendInBackground({
    to: user.email,
    subject: ACCOUNT_MAIL_SUBJECTS.emailChangeNotice,
    text: `Someone signed in to your Morphokin account asked to change its e-mail address from ${user.email} to ${newEmail}. The address changes only when the link sent to ${newEmail} is opened; until then it stays ${user.email}.\n\nIf this was not you, change your password on your Account page (${base}/account) at once: that also signs out every other session.`,
  });
  await recordAccountEvent(m, {
    userId: user.id,
    email: user.email,
    action: "email.change-requested",
    summary: `${user.email} asked to change their e-mail address to ${newEmail}; a confirmation link was sent there`,
    details: { newEmail },
  });
  return {
    status: "check-email" as const,
    message: `We sent a link to ${newEmail}. Open it to finish; until then your address stays ${user.email}.`,
  };
}

/** For the page behind the link: the change it would make (opening it changes nothing). */
export async function describeEmailChange(token: string): Promise<{ newEmail: string }> {
  const link = await findAccountLink(token, "email-change");
  return { newEmail: link.newEmail ?? "" };
}

export async function confirmEmailChange(token: string) {
  const link = await findAccountLink(token, "email-change");
  const newEmail = link.newEmail!;
  const m = await database();
  const taken = () =>
    new AppError(
      "conflict",
      `${newEmail} has become the address of another account in the meantime; nothing was changed`,
    );
  const oldEmail = await services()
    .db.sequelize.transaction(async (transaction) => {
      if (!(await claimAccountLink(link.id, transaction)))
        throw new AppError(
          "conflict",
          "this link to confirm your new e-mail address was already used; change the address again on your Account page",
        );
      const user = await m.User.findByPk(link.userId, { transaction });
      if (!user) throw new AppError("not_found", "this link is not valid any more: its account no longer exists");
      const other = await m.User.findOne({
        where: { email: newEmail, id: { [Op.ne]: user.id } },
        attributes: ["id"],
        transaction,
      });
      if (other) throw taken();
      const before = user.email;
      await user.update({ email: newEmail, emailVerified: new Date() }, { transaction });
      await retireAccountLinks(user.id, "email-change", transaction);
      await recordAccountEvent(
        m,
        {
          userId: user.id,
          email: newEmail,
          action: "email.changed",
          summary: `${before} changed their e-mail address to ${newEmail} (confirmed by the link sent there)`,
          details: { from: before, to: newEmail },
        },
        transaction,
      );
      return before;
    })
    .catch((err) => {
      // Two accounts confirming the same new address at once: the unique index lets one through.
      throw err instanceof UniqueConstraintError ? taken() : err;
    });
  sendInBackground({
    to: oldEmail,
    subject: ACCOUNT_MAIL_SUBJECTS.emailChanged,
    text: `The e-mail address of your Morphokin account was changed from ${oldEmail} to ${newEmail}. Sign in with ${newEmail} from now on.\n\nIf this was not you, tell your lab manager at once.`,
  });
  return { changed: true, email: newEmail };
}
