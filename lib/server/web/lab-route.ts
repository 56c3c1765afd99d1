/**
 * Route wrappers: every handler under /api/v1 goes through one of these, so every request is
 * authenticated, scoped to a lab the actor belongs to (404 otherwise) and checked against the
 * permission table before the handler body runs.
 */
import "server-only";
import type { Action } from "@/lib/access/permissions";
import { authorize, requireLab, type LabContext } from "../access";
import { requireActor, type Actor } from "../accounts/actor";
import { route } from "./http";

export function labRoute<P extends { labId: string }>(
  action: Action,
  fn: (ctx: LabContext, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => {
    const p = await params;
    const actor = await requireActor(request);
    const ctx = await requireLab(actor, p.labId);
    authorize(ctx, action);
    return fn(ctx, request, p);
  });
}

export function userRoute<P = Record<string, never>>(
  fn: (actor: Actor, request: Request, params: P) => Promise<Response>,
) {
  return route<P>(async (request, { params }) => fn(await requireActor(request), request, await params));
}

export function publicRoute<P = Record<string, never>>(fn: (request: Request, params: P) => Promise<Response>) {
  return route<P>(async (request, { params }) => fn(request, await params));
}
