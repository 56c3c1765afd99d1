/**
 * Reads the fake SMTP server's HTTP listing in API tests. Waiting for mail waits for the message
 * itself (by subject), never for "some mail arrived": other jobs of the same test file may mail the
 * same person first, in any order.
 */
export interface TestMail {
  id?: string;
  subject: string;
  text: string;
}

export async function listMail(mailboxUrl: string, to: string): Promise<TestMail[]> {
  const res = await fetch(`${mailboxUrl}/messages?to=${encodeURIComponent(to)}`);
  if (!res.ok) throw new Error(`the mailbox answered ${res.status}`);
  return ((await res.json()) as { messages: TestMail[] }).messages;
}

/** Polls until a message to `to` whose subject is `subject` is listed; fails with what was there. */
export async function waitForMailWithSubject(
  mailboxUrl: string,
  to: string,
  subject: string,
  timeoutMs = 30_000,
): Promise<TestMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mails = await listMail(mailboxUrl, to);
    const found = mails.find((m) => m.subject === subject);
    if (found) return found;
    if (Date.now() > until)
      throw new Error(
        `no mail to ${to} with subject “${subject}” after ${timeoutMs} ms; there were: ${mails.map((m) => `“${m.subject}”`).join(", ") || "none"}`,
      );
    await new Promise((r) => setTimeout(r, 100));
  }
}
