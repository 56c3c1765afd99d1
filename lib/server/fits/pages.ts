/** Data for the fit pages, one call per page. */
import "server-only";
import type { LabContext } from "../access";
import { listCatalogue } from "../kinetics/catalogue";
import { listLabKineticsInfos } from "../kinetics/pages";
import { listFitCandidates } from "./candidates";
import { readFitKineticsPin, readFitPrefill } from "./prefill";

/** The builder lists at most this many lab kinetics (by name) beside the catalogue. */
const BUILDER_LAB_KINETICS = 100;

/**
 * The new-fit builder: readouts to choose from and every kinetics (catalogue, then the lab's).
 * `kinetics`/`version` come from a "Fit this kinetics" link; a version that does not exist is
 * replaced by the latest and `notice` says so. `from` (a "Change and re-run" link) fills the
 * builder in from that fit of this lab (404 otherwise), offering the lab kinetics version it used.
 */
export async function loadNewFitPage(ctx: LabContext, asked: { kinetics?: string; version?: string; from?: string }) {
  const version = asked.version && /^\d+$/.test(asked.version) ? Number(asked.version) : undefined;
  const pin = asked.from
    ? await readFitKineticsPin(ctx, asked.from)
    : asked.kinetics && version !== undefined
      ? { id: asked.kinetics, version }
      : undefined;
  const [candidates, lab] = await Promise.all([
    listFitCandidates(ctx),
    listLabKineticsInfos(ctx, { limit: BUILDER_LAB_KINETICS, pin }),
  ]);
  const kinetics = [...listCatalogue(), ...lab.infos];
  const prefill = asked.from ? await readFitPrefill(ctx, asked.from, candidates, kinetics) : null;
  return { candidates, kinetics, notice: lab.notice, prefill };
}
