"use client";
/** One comment: author, time, sanitised body (rendered on the server), edit/delete when allowed. */
import { useState } from "react";
import { formatDateTime } from "@/lib/client/format";
import type { CommentDto } from "@/lib/contracts/discussion";
import { CommentBox } from "./comment-box";
import type { MemberOption } from "./mention-hint";

/** Markdown output styled without a typography plugin: only the tags the server allows. */
const BODY_CLASS =
  "text-sm text-ink [&_a]:text-moss [&_a]:underline [&_blockquote]:border-l-2 [&_blockquote]:border-rule [&_blockquote]:pl-3 [&_blockquote]:text-ink-soft [&_code]:rounded [&_code]:bg-paper-deep [&_code]:px-1 [&_code]:font-mono [&_code]:text-xs [&_ol]:list-decimal [&_ol]:pl-5 [&_p]:my-1 [&_pre]:overflow-x-auto [&_pre]:rounded [&_pre]:bg-paper-deep [&_pre]:p-2 [&_ul]:list-disc [&_ul]:pl-5";

export interface CommentItemProps {
  comment: CommentDto;
  members: MemberOption[];
  onEdit: (comment: CommentDto, body: string) => Promise<void>;
  onDelete: (comment: CommentDto) => Promise<void>;
}

export function CommentItem({ comment, members, onEdit, onDelete }: CommentItemProps) {
  const [editing, setEditing] = useState(false);
  const who = comment.authorName ?? comment.authorEmail ?? "a former member";
  if (comment.deleted) {
    return (
      <div className="py-2 text-sm italic text-ink-soft" data-testid="comment" data-deleted="true">
        Comment deleted.
      </div>
    );
  }
  return (
    <div className="py-2" data-testid="comment">
      <div className="flex flex-wrap items-baseline gap-x-2 text-xs text-ink-soft">
        <span className="font-medium text-ink" data-testid="comment-author">
          {who}
        </span>
        <span className="num">{formatDateTime(comment.createdAt)}</span>
        {comment.editedAt && <span title={`edited ${formatDateTime(comment.editedAt)}`}>(edited)</span>}
        {!editing && comment.canEdit && (
          <button
            type="button"
            className="text-moss hover:underline"
            onClick={() => setEditing(true)}
            data-testid="edit-comment"
          >
            Edit
          </button>
        )}
        {!editing && comment.canDelete && (
          <button
            type="button"
            className="text-brick hover:underline"
            onClick={() => onDelete(comment)}
            data-testid="delete-comment"
          >
            Delete
          </button>
        )}
      </div>
      {editing ? (
        <div className="mt-1">
          <CommentBox
            label="Edit comment"
            submitLabel="Save"
            members={members}
            initial={comment.body}
            testId="edit-box"
            onSubmit={async (body) => {
              await onEdit(comment, body);
              setEditing(false);
            }}
            onCancel={() => setEditing(false)}
          />
        </div>
      ) : (
        // bodyHtml is sanitised on the server against an allow-list (lib/server/discussions/render.ts).
        <div className={BODY_CLASS} dangerouslySetInnerHTML={{ __html: comment.bodyHtml }} data-testid="comment-body" />
      )}
    </div>
  );
}
