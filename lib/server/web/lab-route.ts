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
import { route } from "./http";

export function labRoute<P extends { labId: string }>(
  action: Action,
  fn: (ctx: LabContext, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => {
    const p = await params;
    const ctx = await requireLabOf(request, p.labId);
    authorize(ctx, action);
    return fn(ctx, request, p);
  });
}

/**
 * The lab context of a request: with a token, the token, its user and the membership in one query
 * (every API script's request); with a browser session, the session's actor and then the membership.
 * 401 before 404, as before: a bad token answers 401 whatever the lab id.
 */
async function requireLabOf(request: Request, labId: string): Promise<LabContext> {
  const viaToken = await tokenActorInLab(request, isUuid(labId) ? labId : null);
  if (!viaToken) return requireLab(await requireActor(request), labId);
  if (!viaToken.membership) throw notFound("lab");
  return { actor: viaToken.actor, labId, labName: viaToken.membership.labName, role: viaToken.membership.role };
}

export function userRoute<P = Record<string, never>>(
  fn: (actor: Actor, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => fn(await requireActor(request), request, await params));
}

export function publicRoute<P = Record<string, never>>(fn: (request: Request, params: P) => Promise<Response>) {
  return route<P>(async (request, { params }) => fn(request, await params));
}
