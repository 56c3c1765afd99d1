/**
 * Server-side records of browser sessions. next-auth's Credentials provider needs JWT sessions;
 * each JWT carries a session id (`sid`) whose row in next-auth's `sessions` table must exist for
 * the cookie to work. Signing out deletes the row, a password change deletes the account's rows,
 * so an old cookie stops working at once instead of living out its 30 days.
 */
import "server-only";
import { randomBytes } from "node:crypto";
import { Op } from "sequelize";
import { readOne } from "../db-read";
import { database } from "../services";

export const SESSION_DAYS = 30;

interface SessionRow {
  sessionToken: string;
  userId: string;
  expires: Date;
}

export async function openSession(userId: string): Promise<string> {
  const m = await database();
  // Expired records of this account go when it opens a new one, so the table does not grow forever.
  await m.AuthSession.destroy({ where: { userId, expires: { [Op.lt]: new Date() } } });
  const sid = randomBytes(24).toString("base64url");
  await m.AuthSession.create({
    sessionToken: sid,
    userId,
    expires: new Date(Date.now() + SESSION_DAYS * 86_400_000),
  } as never);
  return sid;
}

/** True when `sid` is an open session of `userId`. */
export async function sessionIsOpen(sid: unknown, userId: string): Promise<boolean> {
  if (typeof sid !== "string" || !sid) return false;
  const m = await database();
  // Every signed-in page and request asks this: a written-out SELECT (db-read.ts), no model instance.
  const row = (await readOne(m.AuthSession, {
    where: { sessionToken: sid },
    attributes: ["userId", "expires"],
  })) as unknown as Pick<SessionRow, "userId" | "expires"> | null;
  return !!row && row.userId === userId && new Date(row.expires).getTime() > Date.now();
}

export async function closeSession(sid: unknown): Promise<void> {
  if (typeof sid !== "string" || !sid) return;
  const m = await database();
  await m.AuthSession.destroy({ where: { sessionToken: sid } });
}

/** Ends every session of the account except `keepSid` (the one that asked, if any). */
export async function closeOtherSessions(userId: string, keepSid?: string | null): Promise<number> {
  const m = await database();
  return m.AuthSession.destroy({ where: { userId, ...(keepSid ? { sessionToken: { [Op.ne]: keepSid } } : {}) } });
}
