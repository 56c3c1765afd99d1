/**
 * The development mailbox: what the local fake SMTP server received, shown to a lab manager so
 * invitations and sign-in links work on a laptop. It must not become a way into someone else's
 * account, so it is on only in a local development setup (see `mailboxEnabled`) and a lab sees
 * only mail to its current members and its pending invitations — and, for anyone who also belongs
 * to another lab, only this lab's own mail. Account mail (sign-in links, password resets, e-mail
 * changes: lib/server/accounts/account-mail.ts) is shown only to the person it is addressed to.
 */
import "server-only";
import { Op } from "sequelize";
import type { LabContext } from "../access";
import { isAccountMail } from "../accounts/account-mail";
import { AppError } from "../errors";
import { database, services } from "../services";

export interface MailDto {
  id: string;
  receivedAt: string;
  from?: string;
  to: string[];
  subject?: string;
  text?: string;
}

function isLoopbackUrl(raw: string): boolean {
  let host: string;
  try {
    host = new URL(raw).hostname.replace(/^\[|\]$/g, "").toLowerCase();
  } catch {
    return false;
  }
  return host === "localhost" || host === "::1" || /^127(\.\d{1,3}){3}$/.test(host);
}

/**
 * On only when the app and the mail catcher are both on loopback (a laptop, not a server others
 * reach), and in a production build only with MORPHOKIN_DEV_MAILBOX=1 (`npm start` sets it).
 */
export function mailboxEnabled(): boolean {
  const { config } = services();
  if (!config.devMailboxUrl) return false;
  if (!isLoopbackUrl(config.appUrl) || !isLoopbackUrl(config.devMailboxUrl)) return false;
  return !config.productionBuild || config.devMailboxOptIn;
}

interface Audience {
  /** Members and pending invitees who belong to no other lab: all their mail is shown. */
  whole: Set<string>;
  /** Those who also belong to another lab: only this lab's own mail is shown. */
  labOnly: Set<string>;
}

async function audienceOf(ctx: LabContext): Promise<Audience> {
  const m = await database();
  const now = new Date();
  const members = await m.Membership.findAll({ where: { labId: ctx.labId }, attributes: ["userId"] });
  const pending = await m.Invitation.findAll({
    where: {
      labId: ctx.labId,
      acceptedAt: { [Op.is]: null },
      revokedAt: { [Op.is]: null },
      expiresAt: { [Op.gt]: now },
    },
    attributes: ["email"],
  });
  const memberUsers = members.length
    ? await m.User.findAll({ where: { id: members.map((x) => x.userId) }, attributes: ["id", "email"] })
    : [];
  const inviteeUsers = pending.length
    ? await m.User.findAll({ where: { email: pending.map((x) => x.email.toLowerCase()) }, attributes: ["id", "email"] })
    : [];
  const users = [...memberUsers, ...inviteeUsers];
  const elsewhere = users.length
    ? new Set(
        (
          await m.Membership.findAll({
            where: { userId: users.map((u) => u.id), labId: { [Op.ne]: ctx.labId } },
            attributes: ["userId"],
          })
        ).map((x) => x.userId),
      )
    : new Set<string>();
  const labOnly = new Set(users.filter((u) => elsewhere.has(u.id)).map((u) => u.email.toLowerCase()));
  const all = [...memberUsers.map((u) => u.email), ...pending.map((p) => p.email)].map((e) => e.toLowerCase());
  return { whole: new Set(all.filter((e) => !labOnly.has(e))), labOnly };
}

/** This lab's own mail: its invitation, or a message linking into this lab (job finished, mention). */
function isLabMail(mail: MailDto, ctx: LabContext): boolean {
  const text = mail.text ?? "";
  // Account mail (sign-in links, confirmations, resets) goes through /api/auth/ or names the account: never.
  if (text.includes("/api/auth/") || /sign-in link|password|account/i.test(mail.subject ?? "")) return false;
  return (
    text.includes(`/labs/${ctx.labId}`) ||
    (mail.subject === `You are invited to ${ctx.labName} on Morphokin` && /\/invite\/\S+/.test(text))
  );
}

export function visibleTo(mail: MailDto, ctx: LabContext, audience: Audience): boolean {
  // Sign-in links, resets and e-mail changes open an account: only its owner reads them, here too.
  if (isAccountMail(mail)) return mail.to.some((raw) => raw.toLowerCase() === ctx.actor.email.toLowerCase());
  return mail.to.some((raw) => {
    const a = raw.toLowerCase();
    return audience.whole.has(a) || (audience.labOnly.has(a) && isLabMail(mail, ctx));
  });
}

/** The messages this lab may see, newest first (at most 200). */
export async function listMail(ctx: LabContext): Promise<MailDto[]> {
  const url = services().config.devMailboxUrl;
  if (!mailboxEnabled())
    throw new AppError(
      "not_found",
      "the development mailbox is switched off (it is on only in a local development setup; see README, Configuration)",
    );
  let res: Response;
  try {
    res = await fetch(`${url.replace(/\/$/, "")}/messages`, { cache: "no-store" });
  } catch {
    throw new AppError("unavailable", `the fake mail server does not answer at ${url}`);
  }
  if (!res.ok) throw new AppError("unavailable", `the fake mail server answered ${res.status}`);
  const body = (await res.json()) as { messages: MailDto[] };
  const audience = await audienceOf(ctx);
  return body.messages
    .filter((x) => visibleTo(x, ctx, audience))
    .slice(0, 200)
    .map(({ id, receivedAt, from, to, subject, text }) => ({ id, receivedAt, from, to, subject, text }));
}

/** Where a person without a lab reads local mail (the catcher's listing), or null when the mailbox is off. */
export function localMailCatcherUrl(email?: string): string | null {
  if (!mailboxEnabled()) return null;
  const base = services().config.devMailboxUrl.replace(/\/$/, "");
  return `${base}/messages${email ? `?to=${encodeURIComponent(email)}` : ""}`;
}
