"use client";
/**
 * The discussion of one lab object (a readout, a fit, an uploaded file): its threads, open ones
 * first, each with comments, replies, edit/delete and resolve/reopen, plus a box to start a new
 * thread. Any page embeds it with `<Discussion labId targetType targetId />`.
 */
import useSWR from "swr";
import { Notice } from "@/components/ui/notice";
import { EmptyState } from "@/components/ui/panel";
import { ApiError, fetchJson } from "@/lib/client/api";
import type { DiscussionTargetType, ThreadDto } from "@/lib/contracts/discussion";
import { CommentBox } from "./comment-box";
import { ThreadCard } from "./thread-card";
import { useMembers } from "./use-members";
import { useThreadActions } from "./use-thread-actions";

interface Page<T> {
  items: T[];
  total: number;
}

const NOUN: Record<DiscussionTargetType, string> = { readout: "readout", fit: "fit", upload: "file" };

export function Discussion({
  labId,
  targetType,
  targetId,
}: {
  labId: string;
  targetType: DiscussionTargetType;
  targetId: string;
}) {
  const base = `/api/v1/labs/${labId}/threads`;
  const threads = useSWR<Page<ThreadDto>>(
    `${base}?targetType=${targetType}&targetId=${targetId}&pageSize=100`,
    fetchJson,
  );
  const people = useMembers(labId);
  const { actions, start, notice } = useThreadActions(labId, () => threads.mutate());

  const items = threads.data?.items ?? [];
  const open = items.filter((t) => t.status === "open").length;
  return (
    <section className="space-y-3" id="discussion" data-testid="discussion">
      <header className="flex items-baseline justify-between">
        <h2 className="text-sm font-semibold tracking-wide text-ink">Discussion</h2>
        {items.length > 0 && (
          <span className="text-xs text-ink-soft">
            <span className="num">{open}</span> open · <span className="num">{items.length - open}</span> resolved
          </span>
        )}
      </header>
      {notice && (
        <Notice tone={notice.tone} testId="discussion-notice">
          {notice.text}
        </Notice>
      )}
      {threads.error && (
        <Notice tone="error">
          {threads.error instanceof ApiError ? threads.error.message : "The discussion could not be loaded."}
        </Notice>
      )}
      {threads.isLoading && <p className="text-sm text-ink-soft">Loading the discussion…</p>}
      {threads.data && items.length === 0 && (
        <EmptyState title={`No discussion about this ${NOUN[targetType]} yet.`}>
          Ask a question or note what you see below; type @ to bring a lab member in by e-mail.
        </EmptyState>
      )}
      {items.map((t) => (
        <ThreadCard key={t.id} thread={t} members={people} actions={actions} />
      ))}
      <div className="rounded-md border border-rule bg-card px-4 py-3">
        <CommentBox
          label="Start a new discussion"
          submitLabel="Start discussion"
          members={people}
          placeholder={`What should the lab look at in this ${NOUN[targetType]}?`}
          testId="new-thread"
          onSubmit={(body) => start(targetType, targetId, body)}
        />
      </div>
    </section>
  );
}
