/** The development mailbox: what the local fake SMTP server received (never in production). */
import { AppError } from "../errors";
import { services } from "../services";

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

export async function listMail(): Promise<MailDto[]> {
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
  return body.messages.slice(0, 200).map(({ id, receivedAt, from, to, subject, text }) => ({ id, receivedAt, from, to, subject, text }));
}
