/**
 * Discussions: comment threads on lab objects. Shared by the route handlers (validation) and the
 * Discussion component (types of what the API answers).
 */
import { z } from "zod";

/**
 * What a thread may be about. Later work adds its kind here and one resolver line in
 * `lib/server/discussions/targets.ts`.
 */
export const DISCUSSION_TARGET_TYPES = ["readout", "fit", "upload"] as const;
export type DiscussionTargetType = (typeof DISCUSSION_TARGET_TYPES)[number];

export const THREAD_STATUSES = ["open", "resolved"] as const;
export type ThreadStatus = (typeof THREAD_STATUSES)[number];

/** Longest comment body, characters. */
export const MAX_COMMENT_CHARS = 10_000;

const uuid = (field: string) => z.string().uuid(`${field} must be a UUID`);

export const commentBodySchema = z
  .string("write a comment")
  .trim()
  .min(1, "write a comment")
  .max(MAX_COMMENT_CHARS, `at most ${MAX_COMMENT_CHARS} characters`);

export const targetTypeSchema = z.enum(DISCUSSION_TARGET_TYPES, `must be one of ${DISCUSSION_TARGET_TYPES.join(", ")}`);

export const threadCreateSchema = z.object({
  targetType: targetTypeSchema,
  targetId: uuid("targetId"),
  body: commentBodySchema,
});

export const commentCreateSchema = z.object({
  body: commentBodySchema,
  /** The comment replied to; a reply to a reply joins its parent (one level of nesting). */
  parentId: uuid("parentId").nullable().optional(),
});

export const commentUpdateSchema = z.object({ body: commentBodySchema });

export const threadUpdateSchema = z.object({ status: z.enum(THREAD_STATUSES, `must be “open” or “resolved”`) });

/** Filters of GET …/threads besides page/pageSize/sort/dir/q. */
export const threadFilterSchema = z
  .object({
    targetType: targetTypeSchema.optional(),
    targetId: uuid("targetId").optional(),
    status: z.enum(THREAD_STATUSES, `must be “open” or “resolved”`).optional(),
  })
  .refine((f) => (f.targetType === undefined) === (f.targetId === undefined), {
    message: "give targetType and targetId together",
    path: ["targetId"],
  });
export type ThreadFilter = z.infer<typeof threadFilterSchema>;

export interface DiscussionTarget {
  type: DiscussionTargetType;
  id: string;
  /** What people read: “the file “a.png” of specimen E12-3”. */
  label: string;
  /** Path of the page that shows the target and its discussion, or null when it was deleted. */
  path: string | null;
}

export interface CommentDto {
  id: string;
  threadId: string;
  parentId: string | null;
  authorId: string | null;
  authorName: string | null;
  authorEmail: string | null;
  /** Raw text as typed; empty once deleted. */
  body: string;
  /** Sanitised HTML rendered on the server from `body`; empty once deleted. */
  bodyHtml: string;
  mentions: { userId: string; name: string | null; email: string }[];
  createdAt: string;
  editedAt: string | null;
  deleted: boolean;
  canEdit: boolean;
  canDelete: boolean;
}

export interface ThreadDto {
  id: string;
  labId: string;
  target: DiscussionTarget;
  status: ThreadStatus;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: string;
  lastActivityAt: string;
  resolvedAt: string | null;
  resolvedByName: string | null;
  commentCount: number;
  /** The first comment's text, shortened (for lists). */
  preview: string;
  /** Every comment, oldest first (replies beside their parent's id); in the lab-wide list: omitted. */
  comments?: CommentDto[];
}

/** Whether the people who should hear about a comment were told. A failure never loses the comment. */
export interface NotificationOutcome {
  notified: boolean;
  /** How many e-mails went out. */
  recipients: number;
  /** Why some or all were not sent. */
  reason?: string;
}

export interface CommentPosted extends NotificationOutcome {
  thread: ThreadDto;
  comment: CommentDto;
}
