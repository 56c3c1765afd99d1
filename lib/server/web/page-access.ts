/**
 * Access for server-rendered pages: sign-in redirect, 404 for labs you are not in, 403 (the
 * forbidden page, which says in words what the role may not do) for a page of your lab that your
 * role may not use.
 */
import "server-only";
import { forbidden, notFound, redirect } from "next/navigation";
import type { Action } from "@/lib/access/permissions";
import { can } from "@/lib/access/permissions";
import { requireLab, type LabContext } from "../access";
import { getActor, type Actor } from "../accounts/actor";
import { AppError } from "../errors";

export async function pageActor(next?: string): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect(next ? `/login?callbackUrl=${encodeURIComponent(next)}` : "/login");
  return actor;
}

export async function pageLab(labId: string, action: Action = "lab.read"): Promise<LabContext> {
  const actor = await pageActor(`/labs/${labId}`);
  let ctx: LabContext;
  try {
    ctx = await requireLab(actor, labId);
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
  if (!can(ctx.role, action)) forbidden();
  return ctx;
}

/** Runs a data-access call and turns its 404 into the page's not-found. */
export async function orNotFound<T>(p: Promise<T>): Promise<T> {
  try {
    return await p;
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
}
