import "server-only";
import type { Transaction } from "sequelize";
import type { Models } from "@/models";
import type { Actor } from "./accounts/actor-type";
import { authorize, type LabContext } from "./access";
import type { ListQuery, ListResult } from "./web/list";
import { CONTAINS_TEXT, readPage } from "./db-read";
import { database } from "./services";

export interface AuditEntry {
  labId: string;
  actor: Pick<Actor, "userId" | "email"> | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  summary: string;
  details?: Record<string, unknown>;
}

export async function recordAudit(m: Models, entry: AuditEntry, transaction?: Transaction) {
  await m.AuditEvent.create(
    {
      labId: entry.labId,
      actorId: entry.actor?.userId ?? null,
      actorEmail: entry.actor?.email ?? null,
      action: entry.action,
      targetType: entry.targetType,
      targetId: entry.targetId ?? null,
      summary: entry.summary,
      details: entry.details ?? null,
    },
    { transaction },
  );
}

export interface AuditEventDto {
  id: string;
  at: string;
  actorEmail: string | null;
  action: string;
  targetType: string;
  targetId: string | null;
  summary: string;
}

export const AUDIT_SORTS = ["at", "action", "actorEmail"] as const;

export async function listAudit(
  ctx: LabContext,
  q: ListQuery<(typeof AUDIT_SORTS)[number]>,
): Promise<ListResult<AuditEventDto>> {
  const m = await database();
  const column = q.sort === "at" ? "createdAt" : q.sort;
  const { rows, count } = await readPage(m.AuditEvent, {
    where: {
      labId: ctx.labId,
      ...(q.q ? { [CONTAINS_TEXT]: { attributes: ["summary", "action", "actorEmail"], text: q.q } } : {}),
    },
    order: [
      [column, q.dir],
      ["id", "asc"],
    ],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return {
    items: rows.map((e) => ({
      id: e.id,
      at: e.createdAt.toISOString(),
      actorEmail: e.actorEmail,
      action: e.action,
      targetType: e.targetType,
      targetId: e.targetId,
      summary: e.summary,
    })),
    page: q.page,
    pageSize: q.pageSize,
    total: count,
  };
}

// ── Edits: what changed, field by field ───────────────────────────────────────────────────────

export interface FieldChange {
  /** The field as the form names it ("Tissue", "Notes"). */
  field: string;
  from: string | null;
  to: string | null;
}

/** The fields of `input` whose value differs from `before`, named by `labels` (fields without a label are skipped). */
export function changedFields<T extends object>(
  before: T,
  input: Partial<T>,
  labels: Partial<Record<keyof T, string>>,
): FieldChange[] {
  const changes: FieldChange[] = [];
  for (const key of Object.keys(input) as (keyof T)[]) {
    const label = labels[key];
    if (!label || input[key] === undefined) continue;
    const from = before[key] == null ? null : String(before[key]);
    const to = input[key] == null ? null : String(input[key]);
    if (from !== to) changes.push({ field: label, from, to });
  }
  return changes;
}

const SHOWN_CHARS = 60;
const quote = (v: string | null) =>
  v === null || v === "" ? "(empty)" : `“${v.length > SHOWN_CHARS ? `${v.slice(0, SHOWN_CHARS)}…` : v}”`;

/** `Tissue “skin” → “dorsal skin”; Notes (empty) → “fixed at E7”` — long texts shortened; the details keep them whole. */
export function describeChanges(changes: FieldChange[]): string {
  return changes.map((c) => `${c.field} ${quote(c.from)} → ${quote(c.to)}`).join("; ");
}

/** The audit summary column holds 500 characters. */
export const fitSummary = (s: string) => (s.length > 500 ? `${s.slice(0, 499)}…` : s);

// ── Account events: sign-ins and API tokens, which belong to no lab ───────────────────────────
// Where they are shown: to the account itself on the Account page ("Recent sign-ins and API
// tokens"), and to the managers of every lab the account is a member of, on the lab's audit page
// ("Members' sign-ins and API tokens"). A failed sign-in with an unknown address belongs to no
// account and is kept (for an administrator reading the database) but shown to nobody.

export type AccountAction =
  | "signin.succeeded"
  | "signin.failed"
  | "signin.locked"
  | "token.created"
  | "token.revoked"
  | "token.expired"
  | "password.changed"
  | "password.reset"
  | "name.changed"
  | "email.change-requested"
  | "email.changed";

export interface AccountEventEntry {
  userId: string | null;
  email: string | null;
  action: AccountAction;
  summary: string;
  details?: Record<string, unknown>;
}

export async function recordAccountEvent(m: Models, entry: AccountEventEntry, transaction?: Transaction) {
  await m.AccountEvent.create(
    {
      userId: entry.userId,
      email: entry.email,
      action: entry.action,
      summary: fitSummary(entry.summary),
      details: entry.details ?? null,
    },
    { transaction },
  );
}

export interface SignInAttempt {
  outcome: "succeeded" | "failed" | "locked";
  /** The address as typed (lower-cased); the account is looked up from it. */
  email: string;
  /** How: "password", "email link", … */
  method: string;
  /** Failed: why, in the user's words ("wrong password"); never the password. */
  reason?: string;
  /** Locked: until when. */
  lockedUntil?: Date;
  /** The client's address, when known. */
  ip?: string | null;
}

/**
 * Records a sign-in attempt in the audit trail (for auth.ts): success, failure and lockout.
 * Never throws: a sign-in must not fail because its audit row could not be written (logged).
 */
export async function recordSignIn(attempt: SignInAttempt): Promise<void> {
  try {
    const m = await database();
    const email = attempt.email.trim().toLowerCase();
    const user = await m.User.findOne({ where: { email }, attributes: ["id"] });
    const how = `with ${attempt.method}${attempt.ip ? ` from ${attempt.ip}` : ""}`;
    const summary =
      attempt.outcome === "succeeded"
        ? `${email} signed in ${how}`
        : attempt.outcome === "failed"
          ? `Failed sign-in as ${email} ${how}${attempt.reason ? `: ${attempt.reason}` : ""}`
          : `${email} was locked out after repeated failed sign-ins ${how}${attempt.lockedUntil ? `, until ${attempt.lockedUntil.toISOString().replace(/\.\d+Z$/, "Z")}` : ""}`;
    await recordAccountEvent(m, {
      userId: user?.id ?? null,
      email,
      action: `signin.${attempt.outcome}`,
      summary,
      details: {
        method: attempt.method,
        ...(attempt.reason ? { reason: attempt.reason } : {}),
        ...(attempt.ip ? { ip: attempt.ip } : {}),
        ...(attempt.lockedUntil ? { lockedUntil: attempt.lockedUntil.toISOString() } : {}),
      },
    });
  } catch (err) {
    console.error("could not record a sign-in in the audit trail", err);
  }
}

export interface AccountEventDto {
  id: string;
  at: string;
  email: string | null;
  action: AccountAction;
  summary: string;
}

const toAccountDto = (e: {
  id: string;
  createdAt: Date;
  email: string | null;
  action: string;
  summary: string;
}): AccountEventDto => ({
  id: e.id,
  at: e.createdAt.toISOString(),
  email: e.email,
  action: e.action as AccountAction,
  summary: e.summary,
});

/** The newest account events of one account (its Account page). */
export async function listOwnAccountEvents(userId: string, limit = 20): Promise<AccountEventDto[]> {
  const m = await database();
  const rows = await m.AccountEvent.findAll({
    where: { userId },
    order: [
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit,
  });
  return rows.map(toAccountDto);
}

/** The newest account events of the lab's current members (the lab's audit page; managers only). */
export async function listMemberAccountEvents(ctx: LabContext, limit = 50): Promise<AccountEventDto[]> {
  authorize(ctx, "audit.read");
  const m = await database();
  const members = await m.Membership.findAll({ where: { labId: ctx.labId }, attributes: ["userId"] });
  if (members.length === 0) return [];
  const rows = await m.AccountEvent.findAll({
    where: { userId: members.map((x) => x.userId) },
    order: [
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit,
  });
  return rows.map(toAccountDto);
}
