/** Personal API tokens: shown once at creation, stored as SHA-256, revocable. */
import type { Actor } from "../actor";
import { AppError, notFound } from "../errors";
import { newSecret, sha256Hex } from "../secrets";
import { database } from "../services";

export interface TokenDto {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

export const MAX_ACTIVE_TOKENS = 20;

export async function listTokens(actor: Actor): Promise<TokenDto[]> {
  const m = await database();
  const rows = await m.ApiToken.findAll({ where: { userId: actor.userId }, order: [["createdAt", "desc"]] });
  return rows.map((t) => ({ id: t.id, name: t.name, prefix: t.prefix, createdAt: t.createdAt.toISOString(), lastUsedAt: t.lastUsedAt?.toISOString() ?? null, revokedAt: t.revokedAt?.toISOString() ?? null }));
}

export async function createToken(actor: Actor, name: string): Promise<TokenDto & { secret: string }> {
  const m = await database();
  const active = await m.ApiToken.count({ where: { userId: actor.userId, revokedAt: null } });
  if (active >= MAX_ACTIVE_TOKENS) throw new AppError("conflict", `you already have ${MAX_ACTIVE_TOKENS} active tokens; revoke one first`);
  const secret = newSecret("mk", 24);
  const t = await m.ApiToken.create({ userId: actor.userId, name, tokenHash: sha256Hex(secret), prefix: secret.slice(0, 10) });
  return { id: t.id, name: t.name, prefix: t.prefix, createdAt: t.createdAt.toISOString(), lastUsedAt: null, revokedAt: null, secret };
}

export async function revokeToken(actor: Actor, tokenId: string): Promise<void> {
  const m = await database();
  const t = await m.ApiToken.findOne({ where: { id: tokenId, userId: actor.userId } });
  if (!t) throw notFound("token");
  if (t.revokedAt) throw new AppError("conflict", "this token is already revoked");
  await t.update({ revokedAt: new Date() });
}
