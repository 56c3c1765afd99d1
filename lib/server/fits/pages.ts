/** Data for the fit pages, one call per page. */
import "server-only";
import type { LabContext } from "../access";
import { listCatalogue } from "../kinetics/catalogue";
import { listLabKineticsInfos } from "../kinetics/pages";
import { listFitCandidates } from "./candidates";

/** The builder lists at most this many lab kinetics (by name) beside the catalogue. */
const BUILDER_LAB_KINETICS = 100;

/**
 * The new-fit builder: readouts to choose from and every kinetics (catalogue, then the lab's).
 * `kinetics`/`version` come from a "Fit this kinetics" link; a version that does not exist is
 * replaced by the latest and `notice` says so.
 */
export async function loadNewFitPage(ctx: LabContext, asked: { kinetics?: string; version?: string }) {
  const version = asked.version && /^\d+$/.test(asked.version) ? Number(asked.version) : undefined;
  const [candidates, lab] = await Promise.all([
    listFitCandidates(ctx),
    listLabKineticsInfos(ctx, {
      limit: BUILDER_LAB_KINETICS,
      pin: asked.kinetics && version !== undefined ? { id: asked.kinetics, version } : undefined,
    }),
  ]);
  return { candidates, kinetics: [...listCatalogue(), ...lab.infos], notice: lab.notice };
}
