/**
 * "Forgot your password?": the request answers the same whether or not the address has an account
 * (no enumeration) and is rate-limited like sign-in; an account gets a one-time link by e-mail,
 * valid PASSWORD_RESET_LINK_MINUTES. Setting the new password uses the link up, retires the
 * account's other reset links, ends every session of the account and is recorded as an account
 * event — all in one transaction, so nothing is half-done.
 */
import "server-only";
import { AppError } from "../errors";
import { recordAccountEvent } from "../audit";
import { database, services } from "../services";
import { endLockout, enforceRateLimit } from "../web/rate-limit";
import { ACCOUNT_LINK_PATHS, ACCOUNT_MAIL_SUBJECTS } from "./account-mail";
import {
  appBase,
  claimAccountLink,
  createAccountLink,
  findAccountLink,
  PASSWORD_RESET_LINK_MINUTES,
  retireAccountLinks,
} from "./account-links";
import { sendInBackground } from "./auth";
import { hashPassword } from "./passwords";

export const RESET_REQUESTED_MESSAGE =
  "If an account has this address, we sent a link to it. The link works once and expires in " +
  `${PASSWORD_RESET_LINK_MINUTES} minutes.`;

export async function requestPasswordReset(email: string, address: string) {
  await enforceRateLimit("passwordReset", { account: email, address });
  const m = await database();
  const user = await m.User.findOne({ where: { email }, attributes: ["id", "email"] });
  if (user) {
    const { token } = await createAccountLink(user.id, "password-reset", PASSWORD_RESET_LINK_MINUTES * 60_000);
    const base = appBase();
    sendInBackground({
      to: user.email,
      subject: ACCOUNT_MAIL_SUBJECTS.passwordReset,
      text:
        `Someone (probably you) asked to reset the password of your Morphokin account. Open this link to choose a new one:\n\n` +
        `${base}${ACCOUNT_LINK_PATHS.passwordReset}${token}\n\n` +
        `The link works once and expires in ${PASSWORD_RESET_LINK_MINUTES} minutes. Setting a new password signs you out everywhere.\n\n` +
        `If you did not ask for this, ignore this message: your password stays as it is.`,
    });
  }
  return { status: "check-email" as const, message: RESET_REQUESTED_MESSAGE };
}

/** For the page behind the link: whether it still works (opening it changes nothing). */
export async function describePasswordReset(token: string): Promise<{ email: string }> {
  const link = await findAccountLink(token, "password-reset");
  const m = await database();
  const user = await m.User.findByPk(link.userId, { attributes: ["email"] });
  if (!user) throw new AppError("not_found", "this password reset link is not valid any more; ask for a new one");
  return { email: user.email };
}

export async function resetPassword(token: string, newPassword: string) {
  const link = await findAccountLink(token, "password-reset");
  const passwordHash = await hashPassword(newPassword);
  const m = await database();
  const email = await services().db.sequelize.transaction(async (transaction) => {
    if (!(await claimAccountLink(link.id, transaction)))
      throw new AppError("conflict", "this password reset link was already used; ask for a new one");
    const user = await m.User.findByPk(link.userId, { transaction });
    if (!user) throw new AppError("not_found", "this password reset link is not valid any more; ask for a new one");
    await user.update({ passwordHash }, { transaction });
    await retireAccountLinks(user.id, "password-reset", transaction);
    // Whoever knew the old password, and every browser signed in with it, is out.
    await m.AuthSession.destroy({ where: { userId: user.id }, transaction });
    await recordAccountEvent(
      m,
      {
        userId: user.id,
        email: user.email,
        action: "password.reset",
        summary: `${user.email} set a new password with an e-mailed reset link; every session was signed out`,
      },
      transaction,
    );
    return user.email;
  });
  // A lockout from wrong guesses should not keep the owner out after a reset.
  await endLockout(email);
  sendInBackground({
    to: email,
    subject: ACCOUNT_MAIL_SUBJECTS.passwordWasReset,
    text: `The password of your Morphokin account was just changed with a reset link, and every session was signed out.\n\nIf this was not you, ask for a new reset link at ${appBase()}/forgot-password at once and tell your lab manager.`,
  });
  return { reset: true, email };
}
