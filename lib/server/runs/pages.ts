/** Data for the run pages, one call per page. */
import "server-only";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { listCatalogue } from "../kinetics/catalogue";
import { listLabKineticsInfos } from "../kinetics/pages";
import { readFitStart, type FitStart, type RunFitRef } from "./fit-start";
import { readRunPrefill } from "./prefill";
import { listRunStartOptions } from "./start";

/** The run form lists at most this many lab kinetics (by name) beside the catalogue. */
const RUN_FORM_LAB_KINETICS = 200;

/**
 * The new-run form: every kinetics, the earlier runs it may start from and, when the link came
 * from a fit, that fit's parameters. A fit that cannot seed a run (unfinished, no such condition)
 * is a normal case for a stale link: `fitNotice` says why and the form opens empty. `changeId`
 * (a "Change and run again" link) fills the form in from that run of this lab (404 otherwise),
 * offering the lab kinetics version it ran and, if it started from a fit, that fit again.
 */
export async function loadNewRunPage(ctx: LabContext, asked: RunFitRef | null, changeId?: string) {
  const change = changeId ? await readRunPrefill(ctx, changeId) : null;
  const fit = change ? (change.fit ?? null) : asked;
  const pin =
    change && change.version !== undefined ? { id: change.kinetics, version: Number(change.version) } : undefined;
  const [lab, earlierRuns, fromFit] = await Promise.all([
    listLabKineticsInfos(ctx, { limit: RUN_FORM_LAB_KINETICS, pin }),
    listRunStartOptions(ctx),
    fit ? readFitStartOrReason(ctx, fit) : Promise.resolve({ start: null, reason: null }),
  ]);
  if (change?.startFrom && !earlierRuns.some((r) => r.id === change.startFrom))
    change.notes.push(
      "The run it continued is no longer among the finished runs offered; it starts from the steady state.",
    );
  return {
    kinetics: [...listCatalogue(), ...lab.infos],
    earlierRuns,
    fitStart: fromFit.start,
    fitNotice: fromFit.reason,
    change,
  };
}

async function readFitStartOrReason(
  ctx: LabContext,
  ref: RunFitRef,
): Promise<{ start: FitStart | null; reason: string | null }> {
  try {
    return { start: await readFitStart(ctx, ref), reason: null };
  } catch (err) {
    if (!(err instanceof AppError)) throw err;
    return { start: null, reason: err.message };
  }
}
