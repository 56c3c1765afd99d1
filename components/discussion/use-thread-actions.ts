"use client";
/** The writes a thread offers (reply, edit, delete, resolve/reopen), shared by every discussion view. */
import { useState } from "react";
import { ApiError, sendJson } from "@/lib/client/api";
import type { CommentPosted } from "@/lib/contracts/discussion";
import type { ThreadActions } from "./thread-card";

export type DiscussionNotice = { tone: "warning" | "success" | "error"; text: string } | null;

/** `refresh` reloads what the view shows; the notice says whether e-mail went out. */
export function useThreadActions(labId: string, refresh: () => Promise<unknown>) {
  const base = `/api/v1/labs/${labId}/threads`;
  const [notice, setNotice] = useState<DiscussionNotice>(null);

  function report(outcome: Pick<CommentPosted, "notified" | "recipients" | "reason">) {
    if (!outcome.notified)
      setNotice({
        tone: "warning",
        text: `Your comment is saved, but e-mail notifications were not sent: ${outcome.reason ?? "the mail server failed"}.`,
      });
    else if (outcome.recipients > 0)
      setNotice({
        tone: "success",
        text: `Saved; ${outcome.recipients} ${outcome.recipients === 1 ? "person was" : "people were"} notified by e-mail.`,
      });
    else setNotice(null);
  }
  async function attempt(what: string, fn: () => Promise<void>) {
    try {
      await fn();
    } catch (err) {
      setNotice({ tone: "error", text: err instanceof ApiError ? err.message : `The ${what} failed; try again.` });
    }
  }

  const actions: ThreadActions = {
    async reply(thread, body, parentId) {
      report(await sendJson<CommentPosted>("POST", `${base}/${thread.id}/comments`, { body, parentId }));
      await refresh();
    },
    async edit(thread, comment, body) {
      report(await sendJson<CommentPosted>("PATCH", `${base}/${thread.id}/comments/${comment.id}`, { body }));
      await refresh();
    },
    async remove(thread, comment) {
      if (!confirm("Delete this comment? A “comment deleted” note stays so the replies still make sense.")) return;
      await attempt("delete", async () => {
        await sendJson("DELETE", `${base}/${thread.id}/comments/${comment.id}`);
        await refresh();
      });
    },
    async setStatus(thread, status) {
      await attempt(status === "resolved" ? "resolve" : "reopen", async () => {
        await sendJson("PATCH", `${base}/${thread.id}`, { status });
        await refresh();
      });
    },
  };

  async function start(targetType: string, targetId: string, body: string) {
    report(await sendJson<CommentPosted>("POST", base, { targetType, targetId, body }));
    await refresh();
  }

  return { actions, start, notice, setNotice };
}
