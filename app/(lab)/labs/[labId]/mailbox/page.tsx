import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Notice } from "@/components/ui/notice";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import { listMail, mailboxEnabled, type MailDto } from "@/lib/server/labs/mailbox";
import { AppError } from "@/lib/server/errors";
import { pageLab } from "@/lib/server/web/page-access";

export const metadata: Metadata = { title: "Mailbox (development)" };
export const dynamic = "force-dynamic";

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all text-moss underline" data-testid="mail-link">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

export default async function MailboxPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId, "mailbox.read");
  if (!mailboxEnabled()) notFound();
  let messages: MailDto[] = [];
  let problem: string | null = null;
  try {
    messages = await listMail(ctx);
  } catch (err) {
    problem = err instanceof AppError ? err.message : "the mailbox could not be read";
  }
  return (
    <>
      <PageHeader
        title="Mailbox"
        subtitle="Development only: the messages the local fake mail server received for this lab's current members and pending invitees, newest first, so sign-in links and invitations work on a laptop. For people who also belong to another lab, only this lab's own mail is shown (never their sign-in links)."
      />
      {problem && <Notice tone="error">{problem}</Notice>}
      {!problem && messages.length === 0 && (
        <EmptyState title="No mail yet.">
          Invite someone or ask for a sign-in link; the message appears here.
        </EmptyState>
      )}
      <ul className="space-y-3" data-testid="mailbox">
        {messages.map((m) => (
          <li key={m.id} className="rounded-lg border border-rule bg-card p-4">
            <div className="flex flex-wrap justify-between gap-2 text-sm">
              <span className="font-medium">{m.subject}</span>
              <span className="num text-xs text-ink-soft">{formatDateTime(m.receivedAt)}</span>
            </div>
            <div className="num mt-1 text-xs text-ink-soft">to {m.to.join(", ")}</div>
            <pre className="mt-3 whitespace-pre-wrap font-sans text-sm text-ink">{linkify(m.text ?? "")}</pre>
          </li>
        ))}
      </ul>
    </>
  );
}
