/** Search hits among what the lab made of its data: kinetics, fits, verification runs, discussions. */
import "server-only";
import { Op } from "sequelize";
import { CATALOGUE } from "@/lib/kinetics";
import type { SearchHit } from "@/lib/contracts/search";
import { describeTargets } from "../discussions/targets";
import { joinContext, snippetAround, statusWord, wavelengthText } from "./context";
import { anyColumnMatches, containsFolded } from "./match";
import { fetchSize, keepLimit, NEWEST_FIRST, type KindFound, type KindSearch } from "./kind-search";

interface KineticsRefs {
  kinetics?: Array<{ kind?: string; id?: string; label?: string }>;
}

/** Lab kinetics by name and description, and the catalogue entries this lab's fits or runs used. */
export async function searchKinetics(s: KindSearch): Promise<KindFound> {
  const [lab, catalogue] = await Promise.all([
    s.m.LabKinetics.findAll({
      where: { labId: s.labId, ...anyColumnMatches(s.match, ["labKinetics.name", "labKinetics.description"]) },
      attributes: ["id", "name", "latestVersion"],
      order: [
        ["updatedAt", "DESC"],
        ["id", "ASC"],
      ],
      limit: fetchSize(s),
    }),
    searchUsedCatalogue(s),
  ]);
  const labHits: SearchHit[] = lab.map((k) => ({
    kind: "kinetics",
    id: k.id,
    name: k.name,
    context: joinContext(["lab kinetics", `version ${k.latestVersion}`]),
    href: `/labs/${s.labId}/kinetics/${k.id}`,
  }));
  return keepLimit(s, [...labHits, ...catalogue]);
}

/**
 * The catalogue is the same for every lab and small, so it is matched in memory (by the same
 * rule as the database); only entries a fit or run of this lab used are this lab's hits.
 */
async function searchUsedCatalogue(s: KindSearch): Promise<SearchHit[]> {
  const named = CATALOGUE.filter((k) => containsFolded(k.name, s.q) || containsFolded(k.id, s.q));
  if (named.length === 0) return [];
  const ids = named.map((k) => k.id);
  const [runs, fits] = await Promise.all([
    s.m.SimulationRun.findAll({
      where: { labId: s.labId, kineticsKind: "catalogue", kineticsRef: { [Op.in]: ids } },
      attributes: ["kineticsRef"],
    }),
    // Which kinetics a fit used is in its provenance (JSON), read here rather than by a dialect's JSON operators.
    s.m.Fit.findAll({ where: { labId: s.labId }, attributes: ["provenance"] }),
  ]);
  const fitCount = new Map<string, number>();
  for (const f of fits) {
    const used = new Set(
      ((f.provenance ?? {}) as KineticsRefs).kinetics?.filter((k) => k.kind === "catalogue").map((k) => k.id),
    );
    for (const id of used) if (id) fitCount.set(id, (fitCount.get(id) ?? 0) + 1);
  }
  const runCount = new Map<string, number>();
  for (const r of runs) runCount.set(r.kineticsRef, (runCount.get(r.kineticsRef) ?? 0) + 1);
  return named
    .filter((k) => fitCount.has(k.id) || runCount.has(k.id))
    .map((k) => {
      const nf = fitCount.get(k.id) ?? 0;
      const nr = runCount.get(k.id) ?? 0;
      return {
        kind: "kinetics" as const,
        id: k.id,
        name: k.name,
        context: joinContext([
          "catalogue",
          nf > 0 && `used by ${nf} fit${nf > 1 ? "s" : ""}`,
          nr > 0 && `${nr} run${nr > 1 ? "s" : ""}`,
        ]),
        href: `/labs/${s.labId}/kinetics/${k.id}`,
      };
    });
}

export async function searchFits(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.Fit.findAll({
    where: { labId: s.labId, ...anyColumnMatches(s.match, ["fit.name"]) },
    attributes: ["id", "name", "kind", "status", "provenance", "createdAt"],
    order: NEWEST_FIRST,
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((f) => {
      const kinetics = ((f.provenance ?? {}) as KineticsRefs).kinetics?.map((k) => k.label).filter(Boolean) ?? [];
      return {
        kind: "fit",
        id: f.id,
        name: f.name,
        context: joinContext([
          f.kind === "comparison" ? "comparison" : "fit",
          statusWord(f.status),
          kinetics.join(", "),
        ]),
        href: `/labs/${s.labId}/fits/${f.id}`,
      };
    }),
  );
}

export async function searchRuns(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.SimulationRun.findAll({
    where: { labId: s.labId, ...anyColumnMatches(s.match, ["simulationRun.name", "simulationRun.kinetics_name"]) },
    attributes: ["id", "name", "status", "kineticsName", "wavelengthUm", "uncertaintyUm", "createdAt"],
    order: NEWEST_FIRST,
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((r) => ({
      kind: "run",
      id: r.id,
      name: r.name,
      context: joinContext([statusWord(r.status), r.kineticsName, wavelengthText(r.wavelengthUm, r.uncertaintyUm)]),
      href: `/labs/${s.labId}/runs/${r.id}`,
    })),
  );
}

/** Matching comments looked at per search: enough to name the threads shown, bounded for a busy lab. */
const COMMENTS_SCANNED = 500;

/** Threads with a comment that contains the text; the newest matching comment is the context. */
export async function searchDiscussions(s: KindSearch): Promise<KindFound> {
  const comments = await s.m.Comment.findAll({
    where: { labId: s.labId, deletedAt: { [Op.is]: null }, ...anyColumnMatches(s.match, ["comment.body"]) },
    attributes: ["threadId", "body"],
    order: NEWEST_FIRST,
    limit: COMMENTS_SCANNED,
  });
  if (comments.length === 0) return { items: [], more: false };
  const newestMatch = new Map<string, string>();
  for (const c of comments) if (!newestMatch.has(c.threadId)) newestMatch.set(c.threadId, c.body);
  const threads = await s.m.CommentThread.findAll({
    where: { labId: s.labId, id: { [Op.in]: [...newestMatch.keys()] } },
    attributes: ["id", "targetType", "targetId", "status"],
    order: [
      ["lastActivityAt", "DESC"],
      ["id", "ASC"],
    ],
    limit: fetchSize(s),
  });
  const targets = await describeTargets(
    s.m,
    s.labId,
    threads.map((t) => ({ type: t.targetType, id: t.targetId })),
  );
  return keepLimit(
    s,
    threads.map((t) => {
      const target = targets.get(`${t.targetType}:${t.targetId}`)!;
      return {
        kind: "discussion",
        id: t.id,
        name: `Discussion on ${target.label}`,
        context: joinContext([t.status, `“${snippetAround(newestMatch.get(t.id) ?? "", s.q)}”`]),
        // A thread whose object was deleted is still listed with the lab's open discussions.
        href: target.path ?? `/labs/${s.labId}`,
      };
    }),
  );
}
