/**
 * Who is asking: a signed-in browser session (next-auth JWT cookie) or a script with
 * `Authorization: Bearer mk_…` (a personal API token). Returns a small DTO, never a user row.
 */
import "server-only";
import { getServerSession } from "next-auth";
import { cache } from "react";
import { Op } from "sequelize";
import { authOptions } from "./auth";
import { expiryDate, isExpired, recordTokenExpiry } from "./tokens";
import { AppError } from "../errors";
import { sha256Hex } from "../secrets";
import type { Actor } from "./actor-type";
import { database } from "../services";

export type { Actor } from "./actor-type";

/** A token's lastUsedAt is written at most once per this interval (ms). */
const LAST_USED_EVERY_MS = 60_000;
/** When this process last wrote each token's lastUsedAt: concurrent requests write it once. */
const lastUsedWrites = new Map<string, number>();

async function actorFromToken(secret: string): Promise<Actor | null> {
  const m = await database();
  // The token and its user in one query: every API request with a token starts here.
  const token = await m.ApiToken.findOne({
    where: { tokenHash: sha256Hex(secret), revokedAt: { [Op.is]: null } },
    include: [{ model: m.User, as: "user", attributes: ["id", "email", "name"], required: false }],
  });
  if (!token) return null;
  if (isExpired(token)) {
    if (!token.expiryRecordedAt) await recordTokenExpiry(token.id); // once per token
    throw new AppError(
      "unauthenticated",
      `that API token expired on ${expiryDate(token.expiresAt!)}; create a new one on your account page`,
    );
  }
  const user = token.get("user") as { id: string; email: string; name: string | null } | null | undefined;
  if (!user) return null;
  // lastUsedAt is for people ("used 3 minutes ago"), so a minute's precision is enough: writing it
  // on every request made every API call a write and queued behind uploads.
  const now = Date.now();
  const last = Math.max(token.lastUsedAt?.getTime() ?? 0, lastUsedWrites.get(token.id) ?? 0);
  if (now - last >= LAST_USED_EVERY_MS) {
    lastUsedWrites.set(token.id, now);
    await token
      .update({ lastUsedAt: new Date(now) })
      .catch((err) => console.error(`could not record the last use of token ${token.id}`, err));
  }
  return { userId: user.id, email: user.email, name: user.name, via: "token" };
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
  const user = await m.User.findByPk(id);
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
  const header = request?.headers.get("authorization");
  if (header) {
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    if (!match) throw new AppError("unauthenticated", "the Authorization header must be `Bearer <token>`");
    const actor = await actorFromToken(match[1]);
    if (!actor) throw new AppError("unauthenticated", "that API token is unknown or revoked");
    return actor;
  }
  const s = await actorFromSession();
  return s ? { userId: s.userId, email: s.email, name: s.name, via: s.via } : null;
}

export async function requireActor(request?: Request): Promise<Actor> {
  const actor = await getActor(request);
  if (!actor) throw new AppError("unauthenticated", "sign in first (or send an API token)");
  return actor;
}
