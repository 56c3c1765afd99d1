/** Threads and comments as the API shows them: small DTOs with names instead of user rows. */
import "server-only";
import { Op } from "sequelize";
import { can } from "@/lib/access/permissions";
import type { CommentDto, ThreadDto, ThreadStatus } from "@/lib/contracts/discussion";
import type { Models } from "@/models";
import type { LabContext } from "../access";
import { database } from "../services";
import { describeTargets } from "./targets";

export type ThreadRow = InstanceType<Models["CommentThread"]>;
export type CommentRow = InstanceType<Models["Comment"]>;

const PREVIEW_CHARS = 160;

type People = Map<string, { name: string | null; email: string }>;

async function loadPeople(ids: (string | null)[]): Promise<People> {
  const wanted = [...new Set(ids.filter((x): x is string => !!x))];
  if (wanted.length === 0) return new Map();
  const m = await database();
  const users = await m.User.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ["id", "name", "email"] });
  return new Map(users.map((u) => [u.id, { name: u.name, email: u.email }]));
}

function commentDto(ctx: LabContext, c: CommentRow, people: People): CommentDto {
  const author = c.authorId ? people.get(c.authorId) : undefined;
  const deleted = c.deletedAt !== null && c.deletedAt !== undefined;
  const mine = { ownerId: c.authorId, actorId: ctx.actor.userId };
  return {
    id: c.id,
    threadId: c.threadId,
    parentId: c.parentId,
    authorId: c.authorId,
    authorName: author?.name ?? null,
    authorEmail: author?.email ?? null,
    body: deleted ? "" : c.body,
    bodyHtml: deleted ? "" : c.bodyHtml,
    mentions: deleted
      ? []
      : c.mentions.flatMap((id) => {
          const p = people.get(id);
          return p ? [{ userId: id, name: p.name, email: p.email }] : [];
        }),
    createdAt: c.createdAt.toISOString(),
    editedAt: c.editedAt ? c.editedAt.toISOString() : null,
    deleted,
    canEdit: !deleted && can(ctx.role, "comment.edit", mine),
    canDelete: !deleted && can(ctx.role, "comment.delete", mine),
  };
}

function previewOf(first: CommentRow | undefined): string {
  if (!first) return "";
  if (first.deletedAt) return "(comment deleted)";
  const flat = first.body.replace(/\s+/g, " ").trim();
  return flat.length > PREVIEW_CHARS ? `${flat.slice(0, PREVIEW_CHARS - 1)}…` : flat;
}

/**
 * DTOs for threads of one lab. `withComments` adds every comment (a target's discussion is shown
 * whole); lists across the lab carry a preview and a count only.
 */
export async function toThreadDtos(ctx: LabContext, threads: ThreadRow[], withComments: boolean): Promise<ThreadDto[]> {
  if (threads.length === 0) return [];
  const m = await database();
  const comments = await m.Comment.findAll({
    where: { threadId: { [Op.in]: threads.map((t) => t.id) } },
    order: [
      ["createdAt", "asc"],
      ["id", "asc"],
    ],
  });
  const people = await loadPeople([
    ...threads.flatMap((t) => [t.createdBy, t.resolvedBy]),
    ...comments.flatMap((c) => [c.authorId, ...c.mentions]),
  ]);
  const targets = await describeTargets(
    m,
    ctx.labId,
    threads.map((t) => ({ type: t.targetType, id: t.targetId })),
  );
  const out: ThreadDto[] = [];
  for (const t of threads) {
    const key = `${t.targetType}:${t.targetId}`;
    const mine = comments.filter((c) => c.threadId === t.id);
    const creator = t.createdBy ? people.get(t.createdBy) : undefined;
    const resolver = t.resolvedBy ? people.get(t.resolvedBy) : undefined;
    out.push({
      id: t.id,
      labId: t.labId,
      target: targets.get(key)!,
      status: t.status as ThreadStatus,
      createdBy: t.createdBy,
      createdByName: creator ? (creator.name ?? creator.email) : null,
      createdAt: t.createdAt.toISOString(),
      lastActivityAt: t.lastActivityAt.toISOString(),
      resolvedAt: t.status === "resolved" && t.resolvedAt ? t.resolvedAt.toISOString() : null,
      resolvedByName: t.status === "resolved" && resolver ? (resolver.name ?? resolver.email) : null,
      commentCount: mine.filter((c) => !c.deletedAt).length,
      preview: previewOf(mine[0]),
      ...(withComments ? { comments: mine.map((c) => commentDto(ctx, c, people)) } : {}),
    });
  }
  return out;
}

export async function toCommentDto(ctx: LabContext, c: CommentRow): Promise<CommentDto> {
  return commentDto(ctx, c, await loadPeople([c.authorId, ...c.mentions]));
}
