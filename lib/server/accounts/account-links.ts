/**
 * One-time e-mailed links of an account (password reset, e-mail change): made with a random token
 * whose SHA-256 alone is stored, valid for a limited time, claimed once by a conditional update so
 * two clicks cannot both use one link.
 */
import "server-only";
import { Op, type Transaction } from "sequelize";
import type { AccountLinkKind } from "@/models/account-link";
import { AppError } from "../errors";
import { newSecret, sha256Hex } from "../secrets";
import { database, services } from "../services";

/** How long a password-reset link works (said in the mail). */
export const PASSWORD_RESET_LINK_MINUTES = 60;
/** How long the link to confirm a new e-mail address works (said in the mail). */
export const EMAIL_CHANGE_LINK_HOURS = 24;

const PREFIX: Record<AccountLinkKind, string> = { "password-reset": "pr", "email-change": "ec" };

/** What a person reads when a link does not work, and where to ask again. */
const WHAT: Record<AccountLinkKind, { name: string; again: string }> = {
  "password-reset": { name: "password reset link", again: "ask for a new one" },
  "email-change": {
    name: "link to confirm your new e-mail address",
    again: "change the address again on your Account page",
  },
};

export function appBase(): string {
  return services().config.appUrl.replace(/\/$/, "");
}

/** Stores a new link and returns its token (for the mail only; never stored). */
export async function createAccountLink(
  userId: string,
  kind: AccountLinkKind,
  lifetimeMs: number,
  newEmail: string | null = null,
): Promise<{ token: string; expiresAt: Date }> {
  const m = await database();
  const token = newSecret(PREFIX[kind], 32);
  const expiresAt = new Date(Date.now() + lifetimeMs);
  await m.AccountLink.create({ userId, kind, tokenHash: sha256Hex(token), newEmail, expiresAt });
  return { token, expiresAt };
}

/**
 * The link's row, if it still works; otherwise a 404 (unknown) or 409 (used, expired) whose message
 * says what to do. Never says whose link it is.
 */
export async function findAccountLink(token: string, kind: AccountLinkKind) {
  const m = await database();
  const what = WHAT[kind];
  const link = await m.AccountLink.findOne({ where: { tokenHash: sha256Hex(token), kind } });
  if (!link)
    throw new AppError(
      "not_found",
      `this ${what.name} is not valid; check that you copied the whole link from the e-mail, or ${what.again}`,
    );
  if (link.usedAt) throw new AppError("conflict", `this ${what.name} was already used; ${what.again}`);
  if (link.expiresAt.getTime() <= Date.now())
    throw new AppError("conflict", `this ${what.name} has expired; ${what.again}`);
  return link;
}

/** Marks the link used if nobody else did first (and it has not expired since); false when it lost. */
export async function claimAccountLink(id: string, transaction: Transaction): Promise<boolean> {
  const m = await database();
  const [claimed] = await m.AccountLink.update(
    { usedAt: new Date() },
    { where: { id, usedAt: { [Op.is]: null }, expiresAt: { [Op.gt]: new Date() } }, transaction },
  );
  return claimed === 1;
}

/** Ends every other open link of this kind of the account (a used reset makes older resets useless). */
export async function retireAccountLinks(userId: string, kind: AccountLinkKind, transaction: Transaction) {
  const m = await database();
  await m.AccountLink.update(
    { usedAt: new Date() },
    { where: { userId, kind, usedAt: { [Op.is]: null } }, transaction },
  );
}
