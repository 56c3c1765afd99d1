/**
 * Provenance that holds: an upload whose readouts, or a lab kinetics whose versions, a fit or a
 * verification run used cannot be deleted — the refusal lists what depends on it, so a result's
 * sources never turn into "Not found" and a fit can always be re-run.
 */
import "server-only";
import type { Transaction } from "sequelize";
import type { LabContext } from "./access";
import { recordAudit } from "./audit";
import { AppError } from "./errors";
import type { Models } from "@/models";

export interface Dependent {
  kind: "fit" | "run";
  id: string;
  name: string;
}

interface ProvenanceLike {
  data?: Array<{ readoutId?: string | null }>;
  kinetics?: Array<{ kind?: string; id?: string }>;
}
interface RunPlanLike {
  fromFit?: { readouts?: Array<{ readoutId?: string }> } | null;
}

/** Fits and runs of the lab that used any of these readouts, or this lab kinetics. */
export async function findDependents(
  m: Models,
  labId: string,
  what: { readoutIds?: string[]; kineticsId?: string },
  transaction?: Transaction,
): Promise<Dependent[]> {
  const readouts = new Set(what.readoutIds ?? []);
  if (readouts.size === 0 && !what.kineticsId) return [];
  const [fits, runs] = await Promise.all([
    m.Fit.findAll({ where: { labId }, attributes: ["id", "name", "provenance"], transaction }),
    m.SimulationRun.findAll({
      where: { labId },
      attributes: ["id", "name", "kineticsKind", "kineticsRef", "plan"],
      transaction,
    }),
  ]);
  const out: Dependent[] = [];
  for (const f of fits) {
    const p = (f.provenance ?? {}) as ProvenanceLike;
    const usesReadout = (p.data ?? []).some((d) => d.readoutId && readouts.has(d.readoutId));
    const usesKinetics =
      !!what.kineticsId && (p.kinetics ?? []).some((k) => k.kind === "lab" && k.id === what.kineticsId);
    if (usesReadout || usesKinetics) out.push({ kind: "fit", id: f.id, name: f.name });
  }
  for (const r of runs) {
    const plan = (r.plan ?? {}) as RunPlanLike;
    const usesReadout = (plan.fromFit?.readouts ?? []).some((d) => d.readoutId && readouts.has(d.readoutId));
    const usesKinetics = !!what.kineticsId && r.kineticsKind === "lab" && r.kineticsRef === what.kineticsId;
    if (usesReadout || usesKinetics) out.push({ kind: "run", id: r.id, name: r.name });
  }
  return out;
}

const quoteList = (names: string[]) => {
  const shown = names.slice(0, 5).map((n) => `“${n}”`);
  return names.length > 5 ? `${shown.join(", ")} and ${names.length - 5} more` : shown.join(", ");
};

/** 409 naming what depends on `subject`, in words; the dependents travel in `details` for the page. */
export function refuseWithDependents(subject: string, usedBy: string, deps: Dependent[]): AppError {
  const fits = deps.filter((d) => d.kind === "fit").map((d) => d.name);
  const runs = deps.filter((d) => d.kind === "run").map((d) => d.name);
  const parts = [
    fits.length ? `${fits.length} fit${fits.length > 1 ? "s" : ""} (${quoteList(fits)})` : null,
    runs.length ? `${runs.length} verification run${runs.length > 1 ? "s" : ""} (${quoteList(runs)})` : null,
  ].filter(Boolean);
  return new AppError(
    "conflict",
    `${subject} cannot be deleted: ${usedBy} used by ${parts.join(" and ")}. Results keep their sources, so they can be checked and re-run; delete those results first if they are no longer needed.`,
    { dependents: deps },
  );
}

/**
 * Runs a delete; when it is refused because results depend on it, the refusal goes into the audit
 * trail too (after the delete's transaction rolled back), then reaches the caller unchanged.
 */
export async function auditRefusal<T>(
  m: Models,
  ctx: LabContext,
  target: { action: string; targetType: string; targetId: string; what: string },
  run: () => Promise<T>,
): Promise<T> {
  try {
    return await run();
  } catch (err) {
    const deps =
      err instanceof AppError ? (err.details as { dependents?: Dependent[] } | undefined)?.dependents : undefined;
    if (deps?.length)
      await recordAudit(m, {
        labId: ctx.labId,
        actor: ctx.actor,
        action: target.action,
        targetType: target.targetType,
        targetId: target.targetId,
        summary: `${ctx.actor.email} tried to delete ${target.what}; kept, because ${deps.length} result(s) used it`,
        details: { dependents: deps },
      });
    throw err;
  }
}
