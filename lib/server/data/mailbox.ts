/** The development mailbox: what the local fake SMTP server received (never in production). */
import type { LabContext } from "../access";
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

export function mailboxEnabled(): boolean {
  return !!services().config.devMailboxUrl;
}

/** E-mail addresses of this lab: its members and everyone it has invited (lower case). */
async function labAddresses(ctx: LabContext): Promise<Set<string>> {
  const m = await database();
  const members = await m.Membership.findAll({ where: { labId: ctx.labId }, attributes: ["userId"] });
  const users = members.length ? await m.User.findAll({ where: { id: members.map((x) => x.userId) }, attributes: ["email"] }) : [];
  const invited = await m.Invitation.findAll({ where: { labId: ctx.labId }, attributes: ["email"] });
  return new Set([...users, ...invited].map((x) => x.email.toLowerCase()));
}

/** The messages addressed to this lab's members or invitees, newest first (at most 200). */
export async function listMail(ctx: LabContext): Promise<MailDto[]> {
  const url = services().config.devMailboxUrl;
  if (!url) throw new AppError("not_found", "the development mailbox is switched off (DEV_MAILBOX_URL is not set)");
  let res: Response;
  try {
    res = await fetch(`${url.replace(/\/$/, "")}/messages`, { cache: "no-store" });
  } catch {
    throw new AppError("unavailable", `the fake mail server does not answer at ${url}`);
  }
  if (!res.ok) throw new AppError("unavailable", `the fake mail server answered ${res.status}`);
  const body = (await res.json()) as { messages: MailDto[] };
  const ours = await labAddresses(ctx);
  return body.messages.filter((x) => x.to.some((a) => ours.has(a.toLowerCase()))).slice(0, 200).map(({ id, receivedAt, from, to, subject, text }) => ({ id, receivedAt, from, to, subject, text }));
}
