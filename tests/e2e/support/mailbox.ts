/**
 * Reads the fake SMTP server's HTTP listing (tests/e2e/serve.ts puts it on E2E_PORTS.mailbox) and
 * pulls links out of messages.
 */
import { expect } from "@playwright/test";
import { E2E_MAILBOX_URL } from "./ports";

const MAILBOX = E2E_MAILBOX_URL;

export interface Mail {
  id: string;
  receivedAt: string;
  to: string[];
  subject?: string;
  text?: string;
}

export async function listMail(to: string): Promise<Mail[]> {
  const res = await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(to)}`);
  if (!res.ok) throw new Error(`mailbox answered ${res.status}`);
  return ((await res.json()) as { messages: Mail[] }).messages;
}

/** Ids of what `to` has already received, to tell the next message apart. */
export async function mailIds(to: string): Promise<Set<string>> {
  return new Set((await listMail(to)).map((m) => m.id));
}

/** Waits for a message to `to` that is not in `seen` (newest first) and returns it. */
export async function waitForMail(to: string, seen: Set<string> = new Set(), timeoutMs = 10_000): Promise<Mail> {
  let found: Mail | undefined;
  await expect
    .poll(
      async () => {
        found = (await listMail(to)).find((m) => !seen.has(m.id));
        return found !== undefined;
      },
      { message: `no new mail to ${to}`, timeout: timeoutMs },
    )
    .toBe(true);
  return found!;
}

export function linksIn(mail: Mail): string[] {
  return [...(mail.text ?? "").matchAll(/https?:\/\/[^\s<>"]+/g)].map((m) => m[0]);
}

/** The one link in the message whose path starts with `pathPrefix`. */
export function linkTo(mail: Mail, pathPrefix: string): string {
  const links = linksIn(mail).filter((l) => new URL(l).pathname.startsWith(pathPrefix));
  if (links.length !== 1)
    throw new Error(
      `expected one link to ${pathPrefix} in “${mail.subject}”, found ${links.length}: ${linksIn(mail).join(", ")}`,
    );
  return links[0];
}
