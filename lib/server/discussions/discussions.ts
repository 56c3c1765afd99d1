/**
 * Discussions: threads about a lab object, comments with one level of replies, resolve/reopen,
 * edit/delete (own; the lab manager any), @mentions and e-mail notifications. Every write is
 * saved first and notified after, so a mail failure never loses a comment.
 */
import "server-only";
import { Op, type Transaction, type WhereOptions } from "sequelize";
import type {
  CommentPosted,
  DiscussionTargetType,
  ThreadDto,
  ThreadFilter,
  ThreadStatus,
} from "@/lib/contracts/discussion";
import type { LabContext } from "../access";
import { authorize } from "../access";
import { AppError, notFound } from "../errors";
import { containsText, type ListQuery, type ListResult, pageOptions, pageResult } from "../web/list";
import { notifyDiscussion } from "./notify";
import { database, services } from "../services";
import { recordAudit } from "../audit";
import { toCommentDto, toThreadDtos, type CommentRow, type ThreadRow } from "./dtos";
import { resolveMentions } from "./mentions";
import { renderCommentHtml } from "./render";
import { describeTarget, requireTarget } from "./targets";

export const THREAD_SORTS = ["lastActivityAt", "createdAt"] as const;

async function labMembers(ctx: LabContext) {
  const m = await database();
  const memberships = await m.Membership.findAll({ where: { labId: ctx.labId }, attributes: ["userId"] });
  const users = await m.User.findAll({
    where: { id: { [Op.in]: memberships.map((x) => x.userId) } },
    attributes: ["id", "name", "email"],
  });
  return users.map((u) => ({ userId: u.id, name: u.name, email: u.email }));
}

async function rendered(ctx: LabContext, body: string) {
  return { body, bodyHtml: renderCommentHtml(body), mentions: resolveMentions(body, await labMembers(ctx)) };
}

/**
 * Threads of one target (each with its comments, open ones first) or of the whole lab (previews
 * only), filtered by status; `q` matches comment text.
 */
export async function listThreads(
  ctx: LabContext,
  filter: ThreadFilter,
  q: ListQuery<(typeof THREAD_SORTS)[number]>,
): Promise<ListResult<ThreadDto>> {
  const m = await database();
  const where: WhereOptions = { labId: ctx.labId };
  if (filter.targetType && filter.targetId)
    Object.assign(where, { targetType: filter.targetType, targetId: filter.targetId });
  if (filter.status) Object.assign(where, { status: filter.status });
  if (q.q) {
    const hits = await m.Comment.findAll({
      where: { labId: ctx.labId, deletedAt: { [Op.is]: null }, body: containsText(q.q) },
      attributes: ["threadId"],
    });
    Object.assign(where, { id: { [Op.in]: [...new Set(hits.map((h) => h.threadId))] } });
  }
  const forTarget = filter.targetId !== undefined;
  const order: [string, string][] = [
    ...(forTarget && !filter.status ? [["status", "asc"] as [string, string]] : []),
    [q.sort, q.dir],
    ["id", "asc"],
  ];
  const { rows, count } = await m.CommentThread.findAndCountAll({
    where,
    ...pageOptions(q, order),
  });
  return pageResult(q, await toThreadDtos(ctx, rows, forTarget), count);
}

async function findThread(ctx: LabContext, threadId: string, transaction?: Transaction): Promise<ThreadRow> {
  const m = await database();
  const t = await m.CommentThread.findOne({ where: { id: threadId, labId: ctx.labId }, transaction });
  if (!t) throw notFound("discussion thread");
  return t;
}

async function findComment(ctx: LabContext, thread: ThreadRow, commentId: string): Promise<CommentRow> {
  const m = await database();
  const c = await m.Comment.findOne({ where: { id: commentId, threadId: thread.id, labId: ctx.labId } });
  if (!c) throw notFound("comment");
  return c;
}

export async function getThread(ctx: LabContext, threadId: string): Promise<ThreadDto> {
  return (await toThreadDtos(ctx, [await findThread(ctx, threadId)], true))[0];
}

async function posted(
  ctx: LabContext,
  thread: ThreadRow,
  comment: CommentRow,
  participantIds: string[],
  edited = false,
): Promise<CommentPosted> {
  const m = await database();
  const target = await describeTarget(m, ctx.labId, thread.targetType, thread.targetId);
  const outcome = await notifyDiscussion(ctx, {
    target,
    body: comment.body,
    mentionedIds: comment.mentions,
    participantIds,
    edited,
  });
  const fresh = await findThread(ctx, thread.id);
  return { thread: (await toThreadDtos(ctx, [fresh], true))[0], comment: await toCommentDto(ctx, comment), ...outcome };
}

/** Starts a thread on a target of this lab with its first comment. */
export async function createThread(
  ctx: LabContext,
  input: { targetType: DiscussionTargetType; targetId: string; body: string },
): Promise<CommentPosted> {
  authorize(ctx, "comment.create");
  const m = await database();
  const target = await requireTarget(m, ctx.labId, input.targetType, input.targetId);
  const content = await rendered(ctx, input.body);
  const now = new Date();
  const { thread, comment } = await services().db.sequelize.transaction(async (transaction) => {
    const thread = await m.CommentThread.create(
      {
        labId: ctx.labId,
        targetType: target.type,
        targetId: target.id,
        status: "open",
        createdBy: ctx.actor.userId,
        lastActivityAt: now,
      },
      { transaction },
    );
    const comment = await m.Comment.create(
      { labId: ctx.labId, threadId: thread.id, parentId: null, authorId: ctx.actor.userId, ...content },
      { transaction },
    );
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "discussion.started",
        targetType: target.type,
        targetId: target.id,
        summary: `${ctx.actor.email} started a discussion on ${target.label}`,
        details: { threadId: thread.id },
      },
      transaction,
    );
    return { thread, comment };
  });
  return posted(ctx, thread, comment, []);
}

/** A comment in a thread; a reply to a reply joins the top-level comment (one level of nesting). */
export async function addComment(
  ctx: LabContext,
  threadId: string,
  input: { body: string; parentId?: string | null },
): Promise<CommentPosted> {
  authorize(ctx, "comment.create");
  const m = await database();
  const thread = await findThread(ctx, threadId);
  let parentId: string | null = null;
  if (input.parentId) {
    const parent = await m.Comment.findOne({ where: { id: input.parentId, threadId: thread.id } });
    if (!parent) throw new AppError("not_found", "parentId: the comment replied to is not in this thread");
    parentId = parent.parentId ?? parent.id;
  }
  const content = await rendered(ctx, input.body);
  const earlier = await m.Comment.findAll({ where: { threadId: thread.id }, attributes: ["authorId"] });
  const comment = await services().db.sequelize.transaction(async (transaction) => {
    const c = await m.Comment.create(
      { labId: ctx.labId, threadId: thread.id, parentId, authorId: ctx.actor.userId, ...content },
      { transaction },
    );
    await thread.update({ lastActivityAt: c.createdAt }, { transaction });
    return c;
  });
  return posted(
    ctx,
    thread,
    comment,
    earlier.map((c) => c.authorId).filter((x): x is string => !!x),
  );
}

/** Edits the body (own comment; the lab manager any). Only people newly mentioned are e-mailed. */
export async function editComment(
  ctx: LabContext,
  threadId: string,
  commentId: string,
  input: { body: string },
): Promise<CommentPosted> {
  const thread = await findThread(ctx, threadId);
  const comment = await findComment(ctx, thread, commentId);
  authorize(ctx, "comment.edit", comment.authorId);
  if (comment.deletedAt) throw new AppError("conflict", "this comment was deleted and can no longer be edited");
  const before = comment.mentions;
  const content = await rendered(ctx, input.body);
  await comment.update({ ...content, editedAt: new Date() });
  const fresh = content.mentions.filter((id) => !before.includes(id));
  const m = await database();
  const target = await describeTarget(m, ctx.labId, thread.targetType, thread.targetId);
  const outcome = await notifyDiscussion(ctx, {
    target,
    body: comment.body,
    mentionedIds: fresh,
    participantIds: [],
    edited: true,
  });
  return {
    thread: (await toThreadDtos(ctx, [thread], true))[0],
    comment: await toCommentDto(ctx, comment),
    ...outcome,
  };
}

/** Soft delete: the text goes, a "comment deleted" placeholder stays so replies still read. */
export async function deleteComment(ctx: LabContext, threadId: string, commentId: string): Promise<void> {
  const m = await database();
  const thread = await findThread(ctx, threadId);
  const comment = await findComment(ctx, thread, commentId);
  authorize(ctx, "comment.delete", comment.authorId);
  if (comment.deletedAt) return;
  const target = await describeTarget(m, ctx.labId, thread.targetType, thread.targetId);
  const author = comment.authorId ? await m.User.findByPk(comment.authorId, { attributes: ["email"] }) : null;
  await services().db.sequelize.transaction(async (transaction) => {
    await comment.update(
      { body: "", bodyHtml: "", mentions: [], deletedAt: new Date(), deletedBy: ctx.actor.userId },
      { transaction },
    );
    const whose =
      comment.authorId === ctx.actor.userId
        ? "their own comment"
        : `a comment by ${author?.email ?? "a former member"}`;
    await recordAudit(
      m,
      {
        labId: ctx.labId,
        actor: ctx.actor,
        action: "comment.deleted",
        targetType: thread.targetType,
        targetId: thread.targetId,
        summary: `${ctx.actor.email} deleted ${whose} on ${target.label}`,
        details: { threadId: thread.id, commentId: comment.id },
      },
      transaction,
    );
  });
}

/** Resolve or reopen (anyone who may comment); audited. Setting the status it has is a no-op. */
export async function setThreadStatus(ctx: LabContext, threadId: string, status: ThreadStatus): Promise<ThreadDto> {
  authorize(ctx, "comment.create");
  const m = await database();
  const thread = await findThread(ctx, threadId);
  if (thread.status !== status) {
    const target = await describeTarget(m, ctx.labId, thread.targetType, thread.targetId);
    await services().db.sequelize.transaction(async (transaction) => {
      const resolved = status === "resolved";
      await thread.update(
        { status, resolvedBy: resolved ? ctx.actor.userId : null, resolvedAt: resolved ? new Date() : null },
        { transaction },
      );
      await recordAudit(
        m,
        {
          labId: ctx.labId,
          actor: ctx.actor,
          action: resolved ? "discussion.resolved" : "discussion.reopened",
          targetType: thread.targetType,
          targetId: thread.targetId,
          summary: `${ctx.actor.email} ${resolved ? "resolved" : "reopened"} a discussion on ${target.label}`,
          details: { threadId: thread.id },
        },
        transaction,
      );
    });
  }
  return (await toThreadDtos(ctx, [thread], true))[0];
}
