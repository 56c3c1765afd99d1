/**
 * Lab kinetics as the fit builder and the run form list them: every kinetics of the lab described
 * at its latest version (or at a version the page asked for), read in two queries whatever the count.
 */
import "server-only";
import { Op } from "sequelize";
import type { LabContext } from "../access";
import { database } from "../services";
import { getLabKinetics, getLabKineticsVersion, listKineticsVersions } from "./kinetics";
import { definitionInfo, type KineticsInfoDto } from "./catalogue";

export interface LabKineticsInfos {
  infos: KineticsInfoDto[];
  /** Set when the asked-for version does not exist: what is offered instead, in plain words. */
  notice: string | null;
}

/**
 * @param limit at most this many kinetics, by name (the pages' choosers are not paged)
 * @param pin one kinetics to describe at a given version instead of its latest (a "Fit this
 *   kinetics" link names the version the user was looking at)
 */
export async function listLabKineticsInfos(
  ctx: LabContext,
  { limit, pin }: { limit: number; pin?: { id: string; version: number } },
): Promise<LabKineticsInfos> {
  const m = await database();
  const rows = await m.LabKinetics.findAll({
    where: { labId: ctx.labId },
    attributes: ["id", "name", "latestVersion"],
    order: [
      ["name", "asc"],
      ["id", "asc"],
    ],
    limit,
  });
  if (rows.length === 0) return { infos: [], notice: null };
  const wanted = rows.map((r) => ({ kineticsId: r.id, version: r.latestVersion }));
  const pinned = pin ? rows.find((r) => r.id === pin.id) : undefined;
  if (pinned && pin && pin.version !== pinned.latestVersion)
    wanted.push({ kineticsId: pinned.id, version: pin.version });
  const versions = await m.KineticsVersion.findAll({
    where: { labId: ctx.labId, [Op.or]: wanted },
    attributes: ["kineticsId", "version", "definition"],
  });
  const byKey = new Map(versions.map((v) => [`${v.kineticsId}@${v.version}`, v]));
  let notice: string | null = null;
  const infos = rows.map((r) => {
    let v = byKey.get(`${r.id}@${r.latestVersion}`);
    if (pinned && pin && r.id === pinned.id && pin.version !== r.latestVersion) {
      const asked = byKey.get(`${r.id}@${pin.version}`);
      if (asked) v = asked;
      else
        notice = `Version ${pin.version} of “${r.name}” does not exist; its latest version, ${r.latestVersion}, is offered instead.`;
    }
    // Every saved kinetics has its latest version row (written in the same transaction), so a
    // missing one is a broken database, not a case for the user: say so loudly.
    if (!v) throw new Error(`kinetics ${r.id} has no row for its latest version ${r.latestVersion}`);
    return definitionInfo(r.id, v.version, v.definition);
  });
  return { infos, notice };
}

/**
 * A lab kinetics' page: the kinetics, the version shown (latest when `version` is omitted) and
 * every version, read at the same time. Not found (404) for another lab's kinetics or a missing version.
 */
export async function loadLabKineticsPage(ctx: LabContext, id: string, version?: number) {
  const [lab, shown, versions] = await Promise.all([
    getLabKinetics(ctx, id),
    getLabKineticsVersion(ctx, id, version),
    listKineticsVersions(ctx, id),
  ]);
  return { lab, info: definitionInfo(id, shown.version, shown.definition), versions };
}

/** The edit page: the kinetics and its latest version, read at the same time. */
export async function loadKineticsEditPage(ctx: LabContext, id: string) {
  const [kinetics, latest] = await Promise.all([getLabKinetics(ctx, id), getLabKineticsVersion(ctx, id)]);
  return { kinetics, latest };
}
