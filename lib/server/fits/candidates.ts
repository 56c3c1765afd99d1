/**
 * Readouts the fit builder offers as data: the latest finished readout of every upload that
 * found a period, with its specimen's condition and study, and which measurement kinds it has.
 */
import "server-only";
import type { Models } from "@/models";
import type { LabContext } from "../access";
import { database } from "../services";
import { headlineOf, MEASURE_LABELS, type ReadoutResult } from "../readouts/result";

export interface FitCandidateDto {
  readoutId: string;
  studyId: string;
  studyName: string;
  specimenLabel: string;
  condition: string;
  filename: string;
  measure: string;
  /** Fourier-scale value and its uncertainty, µm (what kind "fourier" uses). */
  wavelengthUm: number;
  uncertaintyUm: number | null;
  /** Nearest-neighbour spacing of hexagonal spots, µm, when the readout has one. */
  nearestNeighbourUm: number | null;
  /** The kind the fit uses unless told otherwise. */
  defaultKind: "fourier" | "nearest-neighbour";
  createdAt: string;
}

/** Most candidates listed (newest uploads first). */
const MAX_CANDIDATES = 500;

export async function listFitCandidates(ctx: LabContext): Promise<FitCandidateDto[]> {
  const m = await database();
  const readouts = await m.Readout.findAll({
    where: { labId: ctx.labId, status: "succeeded", periodFound: true },
    order: [
      ["createdAt", "desc"],
      ["id", "desc"],
    ],
    limit: 4 * MAX_CANDIDATES,
  });
  const latest = new Map<string, (typeof readouts)[number]>();
  for (const r of readouts) if (!latest.has(r.uploadId)) latest.set(r.uploadId, r);
  const rows = [...latest.values()].slice(0, MAX_CANDIDATES);
  if (rows.length === 0) return [];
  // Specimens (then their studies) and uploads do not depend on each other: read them together.
  const [{ specimens, studies }, uploads] = await Promise.all([
    readSpecimensAndStudies(
      m,
      rows.map((r) => r.specimenId),
    ),
    m.Upload.findAll({ where: { id: rows.map((r) => r.uploadId) }, attributes: ["id", "filename"] }).then(
      (found) => new Map(found.map((u) => [u.id, u])),
    ),
  ]);
  return rows
    .flatMap((r): FitCandidateDto[] => {
      const h = headlineOf(r.result as unknown as ReadoutResult);
      const s = specimens.get(r.specimenId);
      if (h.wavelengthUm === null || !s) return [];
      const hexNn =
        h.nearestNeighbourUm !== null &&
        h.nearestNeighbourUm !== undefined &&
        (h.measure === "hex-equivalent-from-nn" || h.symmetry === "hexagonal")
          ? h.nearestNeighbourUm
          : null;
      return [
        {
          readoutId: r.id,
          studyId: s.studyId,
          studyName: studies.get(s.studyId)?.name ?? "",
          specimenLabel: s.label,
          condition: s.condition,
          filename: uploads.get(r.uploadId)?.filename ?? "",
          measure: MEASURE_LABELS[h.measure],
          wavelengthUm: h.wavelengthUm,
          uncertaintyUm: h.uncertaintyUm,
          nearestNeighbourUm: hexNn,
          defaultKind: h.measure === "hex-equivalent-from-nn" ? "nearest-neighbour" : "fourier",
          createdAt: r.createdAt.toISOString(),
        },
      ];
    })
    .sort(
      (a, b) =>
        a.studyName.localeCompare(b.studyName) ||
        a.condition.localeCompare(b.condition) ||
        a.specimenLabel.localeCompare(b.specimenLabel),
    );
}

async function readSpecimensAndStudies(m: Models, specimenIds: string[]) {
  const specimens = new Map(
    (await m.Specimen.findAll({ where: { id: [...new Set(specimenIds)] } })).map((s) => [s.id, s]),
  );
  const studies = new Map(
    (
      await m.Study.findAll({
        where: { id: [...new Set([...specimens.values()].map((s) => s.studyId))] },
        attributes: ["id", "name"],
      })
    ).map((s) => [s.id, s]),
  );
  return { specimens, studies };
}
