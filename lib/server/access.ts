/**
 * Lab access: membership decides what exists for you. A lab you are not a member of, and every
 * object in it, answers 404 (not 403), so ids cannot be probed.
 */
import "server-only";
import { can, type Action } from "@/lib/access/permissions";
import { describeRefusal } from "@/lib/access/refusals";
import type { Role } from "@/lib/access/roles";
import type { Actor } from "./accounts/actor-type";
import type { InferAttributes, Model, ModelStatic } from "sequelize";
import { readOne, select, tableOf } from "./db-read";
import { AppError, forbidden, notFound } from "./errors";
import { database } from "./services";

export interface LabContext {
  actor: Actor;
  labId: string;
  labName: string;
  role: Role;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isUuid(s: string): boolean {
  return UUID.test(s);
}

export async function requireLab(actor: Actor, labId: string): Promise<LabContext> {
  if (!isUuid(labId)) throw notFound("lab");
  const m = await database();
  // One SELECT for the membership and its lab's name: every lab request starts here.
  const [row] = await select(
    `SELECT "ms"."role" AS "role", "l"."name" AS "labName"
       FROM ${tableOf(m.Membership)} "ms" JOIN ${tableOf(m.Lab)} "l" ON "l"."id" = "ms"."lab_id"
      WHERE "ms"."lab_id" = $1 AND "ms"."user_id" = $2`,
    [labId, actor.userId],
  );
  if (!row) throw notFound("lab");
  const membership = { role: row.role as Role };
  const lab = { name: row.labName as string };
  return { actor, labId, labName: lab.name, role: membership.role };
}

/**
 * Throws 403 unless the role allows the action (on an object created by `ownerId`); the message
 * says what the role may and may not do ("Collaborators can read fits but not start them.").
 */
export function authorize(ctx: LabContext, action: Action, ownerId?: string | null): void {
  const allowed =
    ownerId === undefined ? can(ctx.role, action) : can(ctx.role, action, { ownerId, actorId: ctx.actor.userId });
  if (!allowed) {
    throw ownerId === undefined
      ? forbidden(describeRefusal(ctx.role, action))
      : forbidden("only its creator or a lab manager may change or delete this");
  }
}

/**
 * One row of the lab by id, as plain attributes for reading (db-read.ts); 404 naming `what` when
 * it is not in the lab — or the id is no UUID, which no row has.
 */
export async function readInLab<M extends Model>(
  ctx: LabContext,
  model: ModelStatic<M>,
  id: string,
  what: string,
): Promise<InferAttributes<M>> {
  const row = isUuid(id) ? await readOne(model, { where: { id, labId: ctx.labId } }) : null;
  if (!row) throw notFound(what);
  return row;
}

/**
 * A read and the check of its parent (e.g. the study whose specimens are listed), sent together:
 * one wait for the database instead of two in a row. The check's error wins — the 404 for a parent
 * that is not the lab's — even when the read fails first on the same id (PostgreSQL refuses a
 * non-UUID id in a query; readInLab answers 404 for it without one).
 */
export async function readAfterCheck<T>(check: Promise<unknown>, read: Promise<T>): Promise<T> {
  const [, value] = await Promise.all([
    check,
    read.catch(async (err: unknown) => {
      await check;
      throw err;
    }),
  ]);
  return value;
}

export async function requireLabAction(actor: Actor, labId: string, action: Action): Promise<LabContext> {
  const ctx = await requireLab(actor, labId);
  authorize(ctx, action);
  return ctx;
}

export { AppError };
