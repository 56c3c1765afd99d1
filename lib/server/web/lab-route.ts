/**
 * Route wrappers: every handler under /api/v1 goes through one of these, so every request is
 * authenticated, scoped to a lab the actor belongs to (404 otherwise) and checked against the
 * permission table before the handler body runs.
 */
import "server-only";
import type { Action } from "@/lib/access/permissions";
import { authorize, isUuid, requireLab, type LabContext } from "../access";
import { requireActor, tokenActorInLab, type Actor } from "../accounts/actor";
import { notFound } from "../errors";
import type { Database } from "../db";
import { sha256Hex } from "../secrets";
import { services } from "../services";
import { answerPath, offerKeptAnswers, type KeptAnswer } from "@/lib/web/kept-answers";
import { AnswerCache } from "./answer-cache";
import { route } from "./http";

const ANSWERS_OF = Symbol.for("morphokin.answers-of");

export function labRoute<P extends { labId: string }>(
  action: Action,
  fn: (ctx: LabContext, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => {
    const p = await params;
    const { ctx } = await requireLabOf(request, p.labId);
    authorize(ctx, action);
    return fn(ctx, request, p);
  });
}

/**
 * Each database's kept answers (a test's stack has a database of its own), on globalThis: one map
 * for the process whichever copy of this module a route's bundle loaded, so the front door's
 * lookup sees every route's answers.
 */
const g = globalThis as { [ANSWERS_OF]?: WeakMap<Database, AnswerCache> };
const answersOf = (g[ANSWERS_OF] ??= new WeakMap<Database, AnswerCache>());

/** The kept answers of this process's database, for tests and the bench. */
export function labAnswers(): AnswerCache {
  const db = services().db;
  let answers = answersOf.get(db);
  if (!answers) answersOf.set(db, (answers = new AnswerCache()));
  return answers;
}

/**
 * labRoute for a GET of a list or a detail whose JSON answer depends only on the lab's data, the
 * asker's role and the URL: an API script's answer is kept and given again while the database is
 * unchanged (answer-cache.ts says exactly when). Browser sessions, and PostgreSQL (no change mark),
 * always get a fresh answer.
 */
export function labReadRoute<P extends { labId: string }>(
  action: Action,
  fn: (ctx: LabContext, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => {
    const p = await params;
    const authorization = request.headers.get("authorization");
    const db = services().db;
    await db.ready;
    const mark = authorization ? await db.changeMark() : null;
    const respond = async () => {
      const { ctx, tokenExpiresAt } = await requireLabOf(request, p.labId);
      authorize(ctx, action);
      return { response: await fn(ctx, request, p), validUntil: tokenExpiresAt?.getTime() };
    };
    if (mark === null) return (await respond()).response;
    const make = async () => {
      const { value, tables } = await db.tablesReadBy(respond);
      return { ...value, reads: tables };
    };
    return labAnswers().answer(answerKey(authorization!, answerPath(request.url)), mark, make);
  });
}

/** An answer's key: the token's SHA-256 and the path and query. */
const answerKey = (authorization: string, pathAndQuery: string) => `${sha256Hex(authorization)} ${pathAndQuery}`;

/**
 * The front door's lookup (lib/web/kept-answers.ts): the kept answer for this token and URL, when
 * labReadRoute would give it again now (or the one being made, once made), without Next's routing.
 */
async function keptAnswerFor(authorization: string, pathAndQuery: string): Promise<KeptAnswer | null> {
  const db = services().db;
  await db.ready;
  const mark = await db.changeMark();
  return mark === null ? null : labAnswers().keptOrBeingMade(answerKey(authorization, pathAndQuery), mark);
}
offerKeptAnswers(keptAnswerFor);

/**
 * The lab context of a request: with a token, the token, its user and the membership in one query
 * (every API script's request); with a browser session, the session's actor and then the membership.
 * 401 before 404, as before: a bad token answers 401 whatever the lab id.
 */
async function requireLabOf(
  request: Request,
  labId: string,
): Promise<{ ctx: LabContext; tokenExpiresAt: Date | null }> {
  const viaToken = await tokenActorInLab(request, isUuid(labId) ? labId : null);
  if (!viaToken) return { ctx: await requireLab(await requireActor(request), labId), tokenExpiresAt: null };
  if (!viaToken.membership) throw notFound("lab");
  return {
    ctx: { actor: viaToken.actor, labId, labName: viaToken.membership.labName, role: viaToken.membership.role },
    tokenExpiresAt: viaToken.expiresAt,
  };
}

export function userRoute<P = Record<string, never>>(
  fn: (actor: Actor, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => fn(await requireActor(request), request, await params));
}

export function publicRoute<P = Record<string, never>>(fn: (request: Request, params: P) => Promise<Response>) {
  return route<P>(async (request, { params }) => fn(request, await params));
}
