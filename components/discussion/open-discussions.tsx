"use client";
/**
 * The lab's open discussions (for the dashboard): what each is about, its first words, how many
 * comments, when it last moved. Opening one shows the whole thread here to reply or resolve.
 */
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { EmptyState } from "@/components/ui/panel";
import { fetchJson } from "@/lib/client/api";
import { formatDateTime } from "@/lib/client/format";
import type { ThreadDto } from "@/lib/contracts/discussion";
import { ThreadCard } from "./thread-card";
import { useMembers } from "./use-members";
import { useThreadActions } from "./use-thread-actions";

const PAGE_SIZE = 8;

function OpenThread({ labId, threadId, onClose }: { labId: string; threadId: string; onClose: () => void }) {
  const detail = useSWR<ThreadDto>(`/api/v1/labs/${labId}/threads/${threadId}`, fetchJson);
  const members = useMembers(labId);
  const { actions, notice } = useThreadActions(labId, () => detail.mutate());
  return (
    <div className="space-y-2 py-2">
      {notice && (
        <Notice tone={notice.tone} testId="discussion-notice">
          {notice.text}
        </Notice>
      )}
      {detail.data && (
        <p className="text-sm">
          About{" "}
          {detail.data.target.path ? (
            <Link href={detail.data.target.path} className="font-medium text-moss hover:underline">
              {detail.data.target.label}
            </Link>
          ) : (
            <span className="text-ink-soft">{detail.data.target.label}</span>
          )}
        </p>
      )}
      {detail.data ? (
        <ThreadCard thread={detail.data} members={members} actions={actions} />
      ) : (
        <p className="text-sm text-ink-soft">Loading the discussion…</p>
      )}
      <Button size="sm" variant="ghost" onClick={onClose} data-testid="close-thread">
        Close
      </Button>
    </div>
  );
}

export function OpenDiscussions({ labId }: { labId: string }) {
  const [page, setPage] = useState(1);
  const [expanded, setExpanded] = useState<string | null>(null);
  const list = useSWR<{ items: ThreadDto[]; total: number }>(
    `/api/v1/labs/${labId}/threads?status=open&page=${page}&pageSize=${PAGE_SIZE}`,
    fetchJson,
  );
  if (list.error) return <Notice tone="error">The open discussions could not be loaded.</Notice>;
  if (!list.data) return <p className="text-sm text-ink-soft">Loading…</p>;
  const { items, total } = list.data;
  if (total === 0) {
    return (
      <EmptyState title="No open discussions.">
        Start one from a readout or a file: the Discussion box sits at the bottom of its page. Resolved threads stay on
        their page.
      </EmptyState>
    );
  }
  const pages = Math.ceil(total / PAGE_SIZE);
  return (
    <div data-testid="open-discussions">
      <ul className="divide-y divide-rule">
        {items.map((t) => (
          <li key={t.id} data-testid="open-discussion">
            {expanded === t.id ? (
              <OpenThread
                labId={labId}
                threadId={t.id}
                onClose={() => {
                  setExpanded(null);
                  void list.mutate();
                }}
              />
            ) : (
              <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-2">
                <div className="min-w-0 flex-1 basis-48">
                  <div className="text-sm">
                    {t.target.path ? (
                      <Link href={t.target.path} className="font-medium text-ink hover:text-moss">
                        {t.target.label}
                      </Link>
                    ) : (
                      <span className="font-medium text-ink-soft">{t.target.label}</span>
                    )}
                  </div>
                  <p className="truncate text-sm text-ink-soft">
                    “{t.preview}” — {t.createdByName ?? "a former member"}
                  </p>
                </div>
                <div className="flex shrink-0 items-baseline gap-3 text-xs text-ink-soft">
                  <span>
                    <span className="num">{t.commentCount}</span> comment{t.commentCount === 1 ? "" : "s"}
                  </span>
                  <span className="num">{formatDateTime(t.lastActivityAt)}</span>
                  <Button size="sm" variant="secondary" onClick={() => setExpanded(t.id)} data-testid="open-thread">
                    Open
                  </Button>
                </div>
              </div>
            )}
          </li>
        ))}
      </ul>
      {pages > 1 && (
        <div className="mt-2 flex items-center justify-end gap-2 text-xs text-ink-soft">
          <Button size="sm" variant="ghost" disabled={page <= 1} onClick={() => setPage(page - 1)}>
            Previous
          </Button>
          <span>
            page <span className="num">{page}</span> of <span className="num">{pages}</span>
          </span>
          <Button size="sm" variant="ghost" disabled={page >= pages} onClick={() => setPage(page + 1)}>
            Next
          </Button>
        </div>
      )}
    </div>
  );
}
