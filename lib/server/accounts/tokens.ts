/**
 * Personal API tokens: shown once at creation, stored as SHA-256, revocable, and expiring after
 * 30, 90 (default) or 365 days. There is no "never": a token in a script on a shared lab machine
 * outlives its purpose unnoticed, and a yearly renewal of a pipeline's token is a small cost; the
 * expiry date is shown in the token list, and an expired token answers 401 saying when it expired.
 * Creation, revocation and expiry are written to the audit trail (account events, see audit.ts).
 */
import "server-only";
import { Op } from "sequelize";
import { DEFAULT_TOKEN_LIFETIME_DAYS } from "@/lib/contracts/account";
import type { Actor } from "./actor-type";
import { AppError, notFound } from "../errors";
import { newSecret, sha256Hex } from "../secrets";
import { database, services } from "../services";
import { recordAccountEvent } from "../audit";

export interface TokenDto {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
  /** Null: never expires (only tokens made before expiry existed). */
  expiresAt: string | null;
  expired: boolean;
}

export const MAX_ACTIVE_TOKENS = 20;
const DAY_MS = 86_400_000;

type TokenRow = InstanceType<Awaited<ReturnType<typeof database>>["ApiToken"]>;

const toDto = (t: TokenRow, now = new Date()): TokenDto => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: t.createdAt.toISOString(),
  lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
  revokedAt: t.revokedAt?.toISOString() ?? null,
  expiresAt: t.expiresAt?.toISOString() ?? null,
  expired: isExpired(t, now),
});

export const isExpired = (t: { expiresAt: Date | null }, now = new Date()) =>
  t.expiresAt !== null && t.expiresAt.getTime() <= now.getTime();

/** The day a token expired, as the 401 message says it (UTC date). */
export const expiryDate = (expiresAt: Date) => expiresAt.toISOString().slice(0, 10);

export async function listTokens(actor: Actor): Promise<TokenDto[]> {
  await recordExpiredTokens();
  const m = await database();
  const rows = await m.ApiToken.findAll({ where: { userId: actor.userId }, order: [["createdAt", "desc"]] });
  return rows.map((t) => toDto(t));
}

export async function createToken(
  actor: Actor,
  name: string,
  expiresInDays: number = DEFAULT_TOKEN_LIFETIME_DAYS,
): Promise<TokenDto & { secret: string }> {
  const m = await database();
  // Expired tokens no longer count as active.
  const active = await m.ApiToken.count({
    where: {
      userId: actor.userId,
      revokedAt: null,
      [Op.or]: [{ expiresAt: null }, { expiresAt: { [Op.gt]: new Date() } }],
    },
  });
  if (active >= MAX_ACTIVE_TOKENS)
    throw new AppError("conflict", `you already have ${MAX_ACTIVE_TOKENS} active tokens; revoke one first`);
  const secret = newSecret("mk", 24);
  const expiresAt = new Date(Date.now() + expiresInDays * DAY_MS);
  const t = await services().db.sequelize.transaction(async (transaction) => {
    const row = await m.ApiToken.create(
      { userId: actor.userId, name, tokenHash: sha256Hex(secret), prefix: secret.slice(0, 10), expiresAt },
      { transaction },
    );
    await recordAccountEvent(
      m,
      {
        userId: actor.userId,
        email: actor.email,
        action: "token.created",
        summary: `${actor.email} created the API token “${name}” (${row.prefix}…), expiring on ${expiryDate(expiresAt)}`,
        details: { tokenId: row.id, prefix: row.prefix, expiresAt: expiresAt.toISOString() },
      },
      transaction,
    );
    return row;
  });
  return { ...toDto(t), secret };
}

export async function revokeToken(actor: Actor, tokenId: string): Promise<void> {
  const m = await database();
  const t = await m.ApiToken.findOne({ where: { id: tokenId, userId: actor.userId } });
  if (!t) throw notFound("token");
  if (t.revokedAt) throw new AppError("conflict", "this token is already revoked");
  await services().db.sequelize.transaction(async (transaction) => {
    await t.update({ revokedAt: new Date() }, { transaction });
    await recordAccountEvent(
      m,
      {
        userId: actor.userId,
        email: actor.email,
        action: "token.revoked",
        summary: `${actor.email} revoked the API token “${t.name}” (${t.prefix}…)`,
        details: { tokenId: t.id, prefix: t.prefix },
      },
      transaction,
    );
  });
}

/**
 * Writes "token expired" to the audit trail once per token (the conditional update on
 * expiry_recorded_at makes a second caller a no-op). Called when an expired token is used, when
 * tokens are listed, and by the hourly sweep started at start-up.
 */
export async function recordTokenExpiry(tokenId: string): Promise<void> {
  const m = await database();
  const t = await m.ApiToken.findByPk(tokenId);
  if (!t || !t.expiresAt || !isExpired(t) || t.revokedAt) return;
  await services().db.sequelize.transaction(async (transaction) => {
    const [claimed] = await m.ApiToken.update(
      { expiryRecordedAt: new Date() },
      { where: { id: t.id, expiryRecordedAt: null }, transaction },
    );
    if (claimed === 0) return;
    const user = await m.User.findByPk(t.userId, { attributes: ["email"], transaction });
    await recordAccountEvent(
      m,
      {
        userId: t.userId,
        email: user?.email ?? null,
        action: "token.expired",
        summary: `The API token “${t.name}” (${t.prefix}…) of ${user?.email ?? "a deleted account"} expired on ${expiryDate(t.expiresAt!)}`,
        details: { tokenId: t.id, prefix: t.prefix, expiresAt: t.expiresAt!.toISOString() },
      },
      transaction,
    );
  });
}

/** Records every expired, not revoked token whose expiry is not yet in the audit trail. */
export async function recordExpiredTokens(): Promise<number> {
  const m = await database();
  const due = await m.ApiToken.findAll({
    where: { expiresAt: { [Op.lte]: new Date() }, expiryRecordedAt: null, revokedAt: null },
    attributes: ["id"],
  });
  for (const t of due) await recordTokenExpiry(t.id);
  return due.length;
}

/** Start-up task: records expiries now and then every hour (the timer never keeps the process alive). */
export async function startTokenExpirySweep(): Promise<void> {
  await recordExpiredTokens();
  const g = globalThis as unknown as { __morphokinTokenSweep?: ReturnType<typeof setInterval> };
  g.__morphokinTokenSweep ??= setInterval(
    () => void recordExpiredTokens().catch((err) => console.error("token expiry sweep:", err)),
    3_600_000,
  );
  g.__morphokinTokenSweep.unref();
}
