/**
 * Condition comparison of a study: the latest finished readout of each upload, grouped by the
 * specimen's condition, with mean ± 95 % CI (t, n − 1) per condition and Welch's t-test with
 * Hedges' g between two chosen conditions (SCIENCE.md §6).
 *
 * Replicates as biologists count them: specimens are the biological replicates; several images
 * of one specimen are technical replicates and are averaged first, so n counts specimens and the
 * statistics use one value per specimen (treating images as independent is pseudo-replication;
 * Hurlbert 1984, Ecol. Monogr. 54:187–211; Lazic 2010, BMC Neurosci. 11:5). An identical file
 * (same SHA-256) uploaded again to a specimen is counted once. `replicate: "image"` counts every
 * image instead, with a warning.
 */
import "server-only";
import { collectConditionSpellings, summarize, welchTTest, type WelchResult } from "@/lib/spacing";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { database } from "../services";
import { headlineOf, MEASURE_LABELS, type ReadoutResult } from "./result";
import { findStudy } from "../studies/studies";

import type {
  ComparisonPoint,
  ConditionComparison,
  ConditionGroup,
  ReplicateUnit,
  SpecimenValue,
} from "./comparison-types";

export async function compareConditions(
  ctx: LabContext,
  studyId: string,
  query: { a?: string; b?: string; replicate?: ReplicateUnit },
): Promise<ConditionComparison> {
  const replicate: ReplicateUnit = query.replicate ?? "specimen";
  const m = await database();
  const study = await findStudy(ctx, studyId);
  const specimens = await m.Specimen.findAll({ where: { labId: ctx.labId, studyId }, order: [["label", "asc"]] });
  const bySpecimen = new Map(specimens.map((s) => [s.id, s]));
  // "Kontrolle" and "kontrolle" are one condition, shown as first spelled (SCIENCE.md §6).
  const spellings = collectConditionSpellings(specimens.map((s) => s.condition));
  const conditionOf = (s: { condition: string }) => spellings.displayOf(s.condition);
  const uploads = specimens.length
    ? await m.Upload.findAll({
        where: { labId: ctx.labId, specimenId: specimens.map((s) => s.id) },
        order: [["createdAt", "asc"]],
      })
    : [];
  const readouts = uploads.length
    ? await m.Readout.findAll({
        where: { labId: ctx.labId, uploadId: uploads.map((u) => u.id), status: "succeeded" },
        order: [
          ["createdAt", "desc"],
          ["id", "desc"],
        ],
      })
    : [];
  const latest = new Map<string, (typeof readouts)[number]>();
  for (const r of readouts) if (!latest.has(r.uploadId)) latest.set(r.uploadId, r);

  const points: ComparisonPoint[] = [];
  const excluded: ConditionComparison["excluded"] = [];
  const firstOfFile = new Map<string, string>(); // specimenId + SHA-256 → the first upload's file name
  const specimensOfFile = new Map<string, Set<string>>();
  for (const u of uploads) {
    const s = bySpecimen.get(u.specimenId)!;
    const r = latest.get(u.id);
    const base = { uploadId: u.id, filename: u.filename, specimenLabel: s.label, condition: conditionOf(s) };
    const same = firstOfFile.get(`${u.specimenId}:${u.sha256}`);
    if (same !== undefined) {
      excluded.push({
        ...base,
        reason: `the same file as “${same}” of this specimen (identical SHA-256), counted once`,
      });
      continue;
    }
    firstOfFile.set(`${u.specimenId}:${u.sha256}`, u.filename);
    specimensOfFile.set(u.sha256, (specimensOfFile.get(u.sha256) ?? new Set()).add(s.label));
    if (!r || !r.result) {
      excluded.push({ ...base, reason: "no finished readout yet" });
      continue;
    }
    const h = headlineOf(r.result as unknown as ReadoutResult);
    if (h.wavelengthUm === null) {
      excluded.push({ ...base, reason: "its latest readout found no significant period" });
      continue;
    }
    points.push({
      ...base,
      specimenId: s.id,
      readoutId: r.id,
      measure: h.measure,
      wavelengthUm: h.wavelengthUm,
      uncertaintyUm: h.uncertaintyUm,
      pixelSizeUm: r.pixelSizeUm,
      readoutCreatedAt: r.createdAt.toISOString(),
    });
  }
  const conditions = [...new Set(specimens.map(conditionOf))].sort((x, y) => x.localeCompare(y));
  const groups: ConditionGroup[] = conditions.flatMap((condition): ConditionGroup[] => {
    const mine = points.filter((p) => p.condition === condition);
    if (mine.length === 0) return [];
    const perSpecimen = averageBySpecimen(mine);
    const values = replicate === "specimen" ? perSpecimen.map((x) => x.wavelengthUm) : mine.map((p) => p.wavelengthUm);
    const counts = { nSpecimens: perSpecimen.length, nImages: mine.length, specimens: perSpecimen, points: mine };
    if (values.length < 2)
      return [{ condition, n: values.length, meanUm: values[0], sdUm: null, semUm: null, ci95Um: null, ...counts }];
    const s = summarize(values);
    return [{ condition, n: s.n, meanUm: s.mean, sdUm: s.sd, semUm: s.sem, ci95Um: s.ci95, ...counts }];
  });
  const valuesOf = (g: ConditionGroup) =>
    replicate === "specimen" ? g.specimens.map((x) => x.wavelengthUm) : g.points.map((p) => p.wavelengthUm);
  const unit = replicate === "specimen" ? "specimens" : "images";

  const chosen = {
    a: query.a ? spellings.displayOf(query.a) : undefined,
    b: query.b ? spellings.displayOf(query.b) : undefined,
  };
  for (const [k, v] of Object.entries(chosen)) {
    if (v && !conditions.includes(v))
      throw new AppError(
        "bad_input",
        `${k}: the study has no condition “${v}” (its conditions are: ${conditions.join(", ") || "none"})`,
      );
  }
  // Default pair: the conditions with the most readouts (a test needs n ≥ 2 on both sides).
  const withData = [...groups].sort((x, y) => Number(y.n >= 2) - Number(x.n >= 2)).map((g) => g.condition);
  const a = chosen.a || withData[0] || null;
  const b = chosen.b || withData.find((c) => c !== a) || null;
  let welch: WelchResult | null = null;
  let note: string | null = null;
  if (!a || !b) note = "Welch's t-test needs two conditions with readouts.";
  else if (a === b) note = "Choose two different conditions.";
  else {
    const ga = groups.find((g) => g.condition === a),
      gb = groups.find((g) => g.condition === b);
    if (!ga || !gb || ga.n < 2 || gb.n < 2)
      note = `Welch's t-test needs at least 2 ${unit} with a readout per condition (${a}: ${ga?.n ?? 0}, ${b}: ${gb?.n ?? 0}).`;
    else {
      try {
        welch = welchTTest(valuesOf(ga), valuesOf(gb));
      } catch (err) {
        note = err instanceof Error ? err.message : String(err);
      }
    }
  }
  const used = [...new Set(points.map((p) => p.measure))];
  const warnings: string[] = [];
  if (replicate === "image" && groups.some((g) => g.nImages > g.nSpecimens)) {
    warnings.push(
      "Every image counts as a replicate here, but images of one specimen are not independent (pseudo-replication): the CI and the p-value are too small. Count specimens for inference.",
    );
  }
  for (const group of spellings.merged())
    warnings.push(
      `${group.map((x) => `“${x}”`).join(" and ")} were taken as one condition (conditions are matched without regard to case and spaces).`,
    );
  for (const labels of specimensOfFile.values()) {
    if (labels.size > 1)
      warnings.push(
        `One identical file (same SHA-256) was uploaded to ${labels.size} specimens (${[...labels].sort().join(", ")}); check that each specimen has its own image.`,
      );
  }
  if (used.length > 1) {
    const converted = used.includes("hex-equivalent-from-nn")
      ? "; nearest-neighbour distances of spots were converted to Fourier wavelengths (√3/2 · a) so like is compared with like"
      : "";
    warnings.push(
      `The values mix ${used.map((u) => MEASURE_LABELS[u]).join(" and ")}; check that they measure the same period${converted}.`,
    );
  }
  return {
    studyId,
    studyName: study.name,
    conditions,
    replicate,
    groups,
    excluded,
    test: { a, b, welch, note },
    measures: Object.fromEntries(used.map((u) => [u, MEASURE_LABELS[u]])),
    warnings,
  };
}

/** Technical replicates first: the mean wavelength of each specimen's images, in first-seen order. */
function averageBySpecimen(points: ComparisonPoint[]): SpecimenValue[] {
  const by = new Map<string, SpecimenValue & { sum: number }>();
  for (const p of points) {
    const x = by.get(p.specimenId) ?? {
      specimenId: p.specimenId,
      specimenLabel: p.specimenLabel,
      wavelengthUm: 0,
      images: 0,
      sum: 0,
    };
    x.sum += p.wavelengthUm;
    x.images++;
    by.set(p.specimenId, x);
  }
  return [...by.values()].map(({ sum, ...x }) => ({ ...x, wavelengthUm: sum / x.images }));
}

/** One row per readout used, with its condition's summary repeated; Welch's result in # lines on top. */
