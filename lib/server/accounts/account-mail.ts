/**
 * Mail that belongs to one account and opens or changes it: sign-in links, sign-up confirmations,
 * password resets, e-mail changes and the notices about them. Such a message is for its addressee
 * only: the development mailbox never shows it to anyone else (lib/server/labs/mailbox.ts), so a
 * lab manager cannot take over a member's account by reading their mail there.
 */
import "server-only";

/** Where each account link points; a message holding one is account mail, whatever its subject. */
export const ACCOUNT_LINK_PATHS = {
  passwordReset: "/reset-password/",
  emailChange: "/confirm-email/",
  signupConfirm: "/signup/confirm/",
  signIn: "/api/auth/",
} as const;

export const ACCOUNT_MAIL_SUBJECTS = {
  signInLink: "Your Morphokin sign-in link",
  signupConfirm: "Confirm your Morphokin account",
  signupTaken: "You already have a Morphokin account",
  passwordReset: "Reset your Morphokin password",
  passwordWasReset: "Your Morphokin password was reset",
  emailChange: "Confirm your new e-mail address for Morphokin",
  emailChangeTaken: "Someone tried to move a Morphokin account to this address",
  emailChangeNotice: "Your Morphokin e-mail address is about to change",
  emailChanged: "Your Morphokin e-mail address was changed",
} as const;

const SUBJECTS = new Set<string>(Object.values(ACCOUNT_MAIL_SUBJECTS));

/** True for a message that only its addressee may read (see the file comment). */
export function isAccountMail(mail: { subject?: string; text?: string }): boolean {
  const text = mail.text ?? "";
  if (Object.values(ACCOUNT_LINK_PATHS).some((p) => text.includes(p))) return true;
  return SUBJECTS.has(mail.subject ?? "");
}
