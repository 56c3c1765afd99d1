/** "Changed from …" and "Changed and run again as …": the runs one run was changed from and into. */
import "server-only";
import type { LabContext } from "../access";
import { database } from "../services";
import type { RunLinkDto } from "./types";

/** Both directions for one run, one query each (newest change first). */
export async function readRunLinks(
  ctx: LabContext,
  runId: string,
  changedFrom: string | null,
): Promise<{ changedFrom: RunLinkDto | null; changedInto: RunLinkDto[] }> {
  const m = await database();
  const attributes = ["id", "name", "status"];
  const [from, into] = await Promise.all([
    changedFrom ? m.SimulationRun.findOne({ where: { id: changedFrom, labId: ctx.labId }, attributes }) : null,
    m.SimulationRun.findAll({
      where: { changedFrom: runId, labId: ctx.labId },
      attributes,
      order: [
        ["createdAt", "desc"],
        ["id", "asc"],
      ],
    }),
  ]);
  const link = (x: { id: string; name: string; status: RunLinkDto["status"] }): RunLinkDto => ({
    id: x.id,
    name: x.name,
    status: x.status,
  });
  return { changedFrom: from ? link(from) : null, changedInto: into.map(link) };
}
