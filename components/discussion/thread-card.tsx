"use client";
/** One thread: status, comments with their replies, a reply box, resolve/reopen. */
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Badge } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import type { CommentDto, ThreadDto } from "@/lib/contracts/discussion";
import { CommentBox } from "./comment-box";
import { CommentItem } from "./comment-item";
import type { MemberOption } from "./mention-hint";

export interface ThreadActions {
  reply: (thread: ThreadDto, body: string, parentId: string | null) => Promise<void>;
  edit: (thread: ThreadDto, comment: CommentDto, body: string) => Promise<void>;
  remove: (thread: ThreadDto, comment: CommentDto) => Promise<void>;
  setStatus: (thread: ThreadDto, status: "open" | "resolved") => Promise<void>;
}

export function ThreadCard({
  thread,
  members,
  actions,
}: {
  thread: ThreadDto;
  members: MemberOption[];
  actions: ThreadActions;
}) {
  const [replyTo, setReplyTo] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const comments = thread.comments ?? [];
  const top = comments.filter((c) => c.parentId === null);
  const resolved = thread.status === "resolved";

  async function toggleStatus() {
    setBusy(true);
    try {
      await actions.setStatus(thread, resolved ? "open" : "resolved");
    } finally {
      setBusy(false);
    }
  }
  const item = (c: CommentDto) => (
    <CommentItem
      comment={c}
      members={members}
      onEdit={(x, body) => actions.edit(thread, x, body)}
      onDelete={(x) => actions.remove(thread, x)}
    />
  );

  return (
    <article
      className={`rounded-md border px-4 py-3 ${resolved ? "border-rule bg-paper" : "border-moss/30 bg-card"}`}
      data-testid="thread"
      data-status={thread.status}
    >
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-rule pb-2">
        <div className="flex flex-wrap items-center gap-2 text-xs text-ink-soft">
          <Badge tone={resolved ? "plain" : "moss"}>{resolved ? "Resolved" : "Open"}</Badge>
          <span>
            started by {thread.createdByName ?? "a former member"} · <span className="num">{thread.commentCount}</span>{" "}
            comment{thread.commentCount === 1 ? "" : "s"} · last activity{" "}
            <span className="num">{formatDateTime(thread.lastActivityAt)}</span>
          </span>
          {resolved && thread.resolvedByName && thread.resolvedAt && (
            <span data-testid="resolved-by">
              · resolved by {thread.resolvedByName} <span className="num">{formatDateTime(thread.resolvedAt)}</span>
            </span>
          )}
        </div>
        <Button
          size="sm"
          variant="secondary"
          disabled={busy}
          onClick={toggleStatus}
          data-testid={resolved ? "reopen-thread" : "resolve-thread"}
        >
          {resolved ? "Reopen" : "Resolve"}
        </Button>
      </header>
      <div className="divide-y divide-rule/60">
        {top.map((c) => (
          <div key={c.id}>
            {item(c)}
            <div className="ml-6 border-l-2 border-rule pl-3">
              {comments
                .filter((r) => r.parentId === c.id)
                .map((r) => (
                  <div key={r.id}>{item(r)}</div>
                ))}
              {replyTo === c.id ? (
                <div className="py-2">
                  <CommentBox
                    label="Reply"
                    submitLabel="Send reply"
                    members={members}
                    testId="reply-box"
                    onSubmit={async (body) => {
                      await actions.reply(thread, body, c.id);
                      setReplyTo(null);
                    }}
                    onCancel={() => setReplyTo(null)}
                  />
                </div>
              ) : (
                <button
                  type="button"
                  className="py-1 text-xs text-moss hover:underline"
                  onClick={() => setReplyTo(c.id)}
                  data-testid="reply-toggle"
                >
                  Reply
                </button>
              )}
            </div>
          </div>
        ))}
      </div>
    </article>
  );
}
