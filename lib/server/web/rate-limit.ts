/**
 * Rate limits and the failed-password lockout. Counters live in the `rate_limits` table, so every
 * web process (and a restart) sees the same counts; each hit is one atomic upsert, no transaction.
 * Fixed windows of RATE_LIMIT_WINDOW_MINUTES: simple and good enough for abuse control (a burst
 * at a window's edge can reach twice the limit; common practice, no source).
 *
 * Reuse: `await enforceRateLimit("passwordReset", { account: email, address: clientAddress(request) })`
 * before the work; it throws a 429 AppError carrying Retry-After.
 */
import "server-only";
import { QueryTypes } from "sequelize";
import type { Config } from "../config";
import { clientAddress } from "./client-address";
import { AppError } from "../errors";
import { services } from "../services";

export type LimitName = Exclude<keyof Config["rateLimits"], "windowMinutes">;

/** A 429: the route answers with `Retry-After: retryAfterS` (lib/server/web/http.ts). */
export class RateLimitedError extends AppError {
  constructor(
    message: string,
    public retryAfterS: number,
  ) {
    super("rate_limited", message, { retryAfterS });
  }
}

const WHAT: Record<LimitName, string> = {
  signIn: "sign-in attempts",
  signInLink: "sign-in link requests",
  signUp: "sign-ups",
  invitation: "invitations",
  passwordReset: "password reset requests",
};

export function minutesText(seconds: number): string {
  const min = Math.max(1, Math.ceil(seconds / 60));
  return min === 1 ? "1 minute" : `${min} minutes`;
}

interface CounterRow {
  count: number;
  window_started_ms: number;
}

/** Counts one hit on `key` in a window of `windowMs`; returns the count and when the window ends. */
async function hit(key: string, windowMs: number, now = Date.now()): Promise<{ count: number; resetsAtMs: number }> {
  const { db } = services();
  await db.ready;
  // Every SET expression reads the row's old values, so both CASEs test the same old window.
  // (Sequelize's sqlite dialect runs an INSERT without returning rows, so the count is read after;
  // a hit from elsewhere in between can only make this count higher, never let one through.)
  await db.sequelize.query(
    `INSERT INTO rate_limits (key, count, window_started_ms) VALUES (:key, 1, :now)
     ON CONFLICT (key) DO UPDATE SET
       count = CASE WHEN rate_limits.window_started_ms <= :stale THEN 1 ELSE rate_limits.count + 1 END,
       window_started_ms = CASE WHEN rate_limits.window_started_ms <= :stale THEN :now ELSE rate_limits.window_started_ms END`,
    { replacements: { key, now, stale: now - windowMs } },
  );
  const rows = await db.sequelize.query<CounterRow>(
    "SELECT count, window_started_ms FROM rate_limits WHERE key = :key",
    { replacements: { key }, type: QueryTypes.SELECT },
  );
  // Now and then, forget counters whose window ended a day ago and that lock nothing.
  if (Math.random() < 0.01) {
    await db.sequelize.query(
      "DELETE FROM rate_limits WHERE window_started_ms < :old AND (locked_until_ms IS NULL OR locked_until_ms < :now)",
      { replacements: { old: now - 86_400_000, now } },
    );
  }
  const row = rows[0];
  return { count: Number(row.count), resetsAtMs: Number(row.window_started_ms) + windowMs };
}

/**
 * Counts this attempt against the per-account and per-address limits of `name`; throws a
 * RateLimitedError (429) when either is over. An unknown address (no header) shares one bucket.
 */
export async function enforceRateLimit(
  name: LimitName,
  who: { account?: string | null; address?: string | null },
): Promise<void> {
  const { config } = services();
  const rule = config.rateLimits[name];
  const windowMs = config.rateLimits.windowMinutes * 60_000;
  const now = Date.now();
  const checks: [string, number, string][] = [];
  if (who.account) checks.push([`${name}:account:${who.account.toLowerCase()}`, rule.perAccount, "for this account"]);
  checks.push([`${name}:address:${who.address || "unknown"}`, rule.perAddress, "from your network address"]);
  for (const [key, limit, scope] of checks) {
    const { count, resetsAtMs } = await hit(key, windowMs, now);
    if (count > limit) {
      const retryAfterS = Math.max(1, Math.ceil((resetsAtMs - now) / 1000));
      throw new RateLimitedError(
        `too many ${WHAT[name]} ${scope} (at most ${limit} in ${config.rateLimits.windowMinutes} minutes); try again in ${minutesText(retryAfterS)}`,
        retryAfterS,
      );
    }
  }
}

const lockKey = (email: string) => `lockout:${email.toLowerCase()}`;

/** Seconds until the account's failed-password lockout ends, or 0. */
export async function lockedForS(email: string, now = Date.now()): Promise<number> {
  const { db } = services();
  await db.ready;
  const rows = await db.sequelize.query<{ locked_until_ms: number | null }>(
    "SELECT locked_until_ms FROM rate_limits WHERE key = :key",
    { replacements: { key: lockKey(email) }, type: QueryTypes.SELECT },
  );
  const until = Number(rows[0]?.locked_until_ms ?? 0);
  return until > now ? Math.ceil((until - now) / 1000) : 0;
}

export function lockoutMessage(seconds: number): string {
  return `Too many failed sign-ins for this account; try again in ${minutesText(seconds)} or use a sign-in link.`;
}

/**
 * Counts a wrong password; the LOCKOUT_FAILURES-th within LOCKOUT_MINUTES locks the account for
 * LOCKOUT_MINUTES. Returns the end of the lockout this failure started, else null.
 */
export async function recordFailedPassword(email: string): Promise<Date | null> {
  const { config, db } = services();
  const lockMs = config.lockoutMinutes * 60_000;
  const now = Date.now();
  const { count } = await hit(lockKey(email), lockMs, now);
  if (count >= config.lockoutFailures) {
    await db.sequelize.query(
      "UPDATE rate_limits SET locked_until_ms = :until, count = 0, window_started_ms = :now WHERE key = :key",
      { replacements: { key: lockKey(email), until: now + lockMs, now } },
    );
    return new Date(now + lockMs);
  }
  return null;
}

/** A correct password clears the failure count (not a running lockout: that is checked first). */
export async function clearFailedPasswords(email: string): Promise<void> {
  const { db } = services();
  await db.sequelize.query(
    "DELETE FROM rate_limits WHERE key = :key AND (locked_until_ms IS NULL OR locked_until_ms <= :now)",
    { replacements: { key: lockKey(email), now: Date.now() } },
  );
}

/** Ends the account's lockout and failure count (after a password reset proved the owner has the mail). */
export async function endLockout(email: string): Promise<void> {
  const { db } = services();
  await db.sequelize.query("DELETE FROM rate_limits WHERE key = :key", { replacements: { key: lockKey(email) } });
}

/** The request's client address as configured (TRUST_PROXY). */
export function addressOf(request: Request): string {
  return clientAddress(request, services().config.trustProxyHops);
}
