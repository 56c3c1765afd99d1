/**
 * Who is asking: a signed-in browser session (next-auth JWT cookie) or a script with
 * `Authorization: Bearer mk_…` (a personal API token). Returns a small DTO, never a user row.
 */
import "server-only";
import { getServerSession } from "next-auth";
import { cache } from "react";
import { authOptions } from "./auth";
import { expiryDate, isExpired, recordTokenExpiry } from "./tokens";
import { AppError } from "../errors";
import { readOne, select, selectList, rowOf, tableOf } from "../db-read";
import { sha256Hex } from "../secrets";
import type { Role } from "@/lib/access/roles";
import type { Actor } from "./actor-type";
import { database } from "../services";

export type { Actor } from "./actor-type";

/** A token's lastUsedAt is written at most once per this interval (ms). */
const LAST_USED_EVERY_MS = 60_000;
const TOKEN_COLUMNS = ["id", "lastUsedAt", "expiresAt", "expiryRecordedAt"] as const;
const USER_COLUMNS = ["id", "email", "name"] as const;
interface TokenRow {
  id: string;
  lastUsedAt: Date | null;
  expiresAt: Date | null;
  expiryRecordedAt: Date | null;
}

/** When this process last wrote each token's lastUsedAt: concurrent requests write it once. */
const lastUsedWrites = new Map<string, number>();

/** The caller's membership of one lab, read together with the token (see `tokenActorInLab`). */
export interface TokenMembership {
  role: Role;
  labName: string;
}

/** A token's actor, its membership of the lab asked about, and when the token expires (null: never). */
export interface TokenActor {
  actor: Actor;
  membership: TokenMembership | null;
  expiresAt: Date | null;
}

/**
 * The token's actor, and with `labId` its membership of that lab (null when not a member), in one
 * SELECT: every API request with a token starts here.
 */
async function actorFromToken(secret: string, labId: string | null = null): Promise<TokenActor | null> {
  const m = await database();
  const lab = labId
    ? {
        columns: `, "ms"."role" AS "ms.role", "l"."name" AS "ms.labName"`,
        joins: ` LEFT JOIN ${tableOf(m.Membership)} "ms" ON "ms"."user_id" = "t"."user_id" AND "ms"."lab_id" = $2
                 LEFT JOIN ${tableOf(m.Lab)} "l" ON "l"."id" = "ms"."lab_id"`,
      }
    : { columns: "", joins: "" };
  const [row] = await select(
    `SELECT ${selectList(m.ApiToken, "t", "", TOKEN_COLUMNS)}, ${selectList(m.User, "u", "user.", USER_COLUMNS)}${lab.columns}
       FROM ${tableOf(m.ApiToken)} "t" LEFT JOIN ${tableOf(m.User)} "u" ON "u"."id" = "t"."user_id"${lab.joins}
      WHERE "t"."token_hash" = $1 AND "t"."revoked_at" IS NULL`,
    labId ? [sha256Hex(secret), labId] : [sha256Hex(secret)],
  );
  if (!row) return null;
  const token = rowOf<TokenRow>(m.ApiToken, row);
  if (isExpired(token)) {
    if (!token.expiryRecordedAt) await recordTokenExpiry(token.id); // once per token
    throw new AppError(
      "unauthenticated",
      `that API token expired on ${expiryDate(token.expiresAt!)}; create a new one on your account page`,
    );
  }
  if (row["user.id"] == null) return null;
  const user = rowOf<{ id: string; email: string; name: string | null }>(m.User, row, "user.");
  // lastUsedAt is for people ("used 3 minutes ago"), so a minute's precision is enough: writing it
  // on every request made every API call a write and queued behind uploads.
  const now = Date.now();
  const last = Math.max(token.lastUsedAt?.getTime() ?? 0, lastUsedWrites.get(token.id) ?? 0);
  if (now - last >= LAST_USED_EVERY_MS) {
    lastUsedWrites.set(token.id, now);
    await m.ApiToken.update({ lastUsedAt: new Date(now) }, { where: { id: token.id } }).catch((err) =>
      console.error(`could not record the last use of token ${token.id}`, err),
    );
  }
  // A membership counts with its lab (an inner join in requireLab).
  const membership =
    row["ms.role"] != null && row["ms.labName"] != null
      ? { role: row["ms.role"] as Role, labName: row["ms.labName"] as string }
      : null;
  return {
    actor: { userId: user.id, email: user.email, name: user.name, via: "token" },
    membership,
    expiresAt: token.expiresAt,
  };
}

/** The token of a `Bearer` header, or null without an Authorization header. */
function bearerSecret(request?: Request): string | null {
  const header = request?.headers.get("authorization");
  if (!header) return null;
  const match = /^Bearer\s+(\S+)$/i.exec(header);
  if (!match) throw new AppError("unauthenticated", "the Authorization header must be `Bearer <token>`");
  return match[1];
}

/**
 * For a request with a token: its actor and membership of `labId` (null for a lab id that is not a
 * UUID or a lab the actor is not in), with the same 401s as `requireActor`. Null without a token.
 */
export async function tokenActorInLab(request: Request, labId: string | null): Promise<TokenActor | null> {
  const secret = bearerSecret(request);
  if (secret === null) return null;
  const found = await actorFromToken(secret, labId);
  if (!found) throw new AppError("unauthenticated", "that API token is unknown or revoked");
  return found;
}

/**
 * The signed-in browser session, if its server-side record is still open: next-auth's session
 * callback (lib/server/accounts/auth.ts) drops the user of a closed session, so a cookie kept after
 * sign-out or a password change answers as signed out.
 */
const actorFromSession = cache(async (): Promise<(Actor & { sid: string | null }) | null> => {
  const session = await getServerSession(authOptions());
  const id = session?.user?.id;
  if (!id) return null;
  const m = await database();
  const user = await readOne(m.User, { where: { id }, attributes: ["id", "email", "name"] });
  return user
    ? { userId: user.id, email: user.email, name: user.name, via: "session", sid: session.sid ?? null }
    : null;
});

/** The session id of the signed-in browser, for "end my other sessions" (null for API tokens). */
export async function currentSessionId(request?: Request): Promise<string | null> {
  if (request?.headers.get("authorization")) return null;
  return (await actorFromSession())?.sid ?? null;
}

/** The actor or null. With a request, a Bearer header wins over the cookie. */
export async function getActor(request?: Request): Promise<Actor | null> {
  if (request?.headers.get("authorization")) return (await tokenActorInLab(request, null))!.actor;
  const s = await actorFromSession();
  return s ? { userId: s.userId, email: s.email, name: s.name, via: s.via } : null;
}

export async function requireActor(request?: Request): Promise<Actor> {
  const actor = await getActor(request);
  if (!actor) throw new AppError("unauthenticated", "sign in first (or send an API token)");
  return actor;
}
