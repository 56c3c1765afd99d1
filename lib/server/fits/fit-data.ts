/**
 * The data of a fit: each requested datum becomes a measurement of the fitting core, read from a
 * finished readout of this lab or typed in, with a record of where it came from. A readout gives
 * its Fourier wavelength, or for spots its nearest-neighbour spacing; the fit converts spacings to
 * Fourier wavelengths (λ = (√3/2)·a, SCIENCE.md §4) and says so.
 */
import "server-only";
import type { WavelengthDatum } from "@/lib/fitting";
import type { DomainSpec } from "@/lib/stability";
import type { FitDatumInput } from "@/lib/contracts/fit";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { database } from "../services";
import { collectConditionSpellings } from "@/lib/spacing";
import { headlineOf, MEASURE_LABELS, type ReadoutResult } from "../readouts/result";
import type { FitDatumSource } from "./spec-types";

/** a = (2/√3)·λ: a Fourier uncertainty becomes a spacing uncertainty by the same factor. */
const FOURIER_TO_SPACING = 2 / Math.sqrt(3);

const bad = (field: string, message: string) => new AppError("bad_input", `${field}: ${message}`, { field });
const cannot = (field: string, message: string) => new AppError("unprocessable", `${field}: ${message}`, { field });

function toDomain(d: FitDatumInput["domain"]): DomainSpec | undefined {
  if (!d) return undefined;
  return d.kind === "interval"
    ? { kind: "interval", length: d.length, units: "um" }
    : { kind: "rectangle", lx: d.lx, ly: d.ly, units: "um" };
}

export interface ResolvedData {
  data: WavelengthDatum<DomainSpec>[];
  sources: FitDatumSource[];
}

/** Reads every datum (readouts in one query); errors name `data[i].field`. */
export async function resolveFitData(ctx: LabContext, input: FitDatumInput[]): Promise<ResolvedData> {
  if (input.length === 0) throw bad("data", "select at least one readout or type a measured wavelength");
  const m = await database();
  const ids = [...new Set(input.flatMap((d) => (d.readoutId ? [d.readoutId] : [])))];
  const readouts = new Map(
    (ids.length ? await m.Readout.findAll({ where: { id: ids, labId: ctx.labId } }) : []).map((r) => [r.id, r]),
  );
  const specimens = new Map(
    (readouts.size
      ? await m.Specimen.findAll({ where: { id: [...new Set([...readouts.values()].map((r) => r.specimenId))] } })
      : []
    ).map((s) => [s.id, s]),
  );
  const studies = new Map(
    (specimens.size
      ? await m.Study.findAll({
          where: { id: [...new Set([...specimens.values()].map((s) => s.studyId))] },
          attributes: ["id", "name"],
        })
      : []
    ).map((s) => [s.id, s]),
  );
  const uploads = new Map(
    (readouts.size
      ? await m.Upload.findAll({
          where: { id: [...new Set([...readouts.values()].map((r) => r.uploadId))] },
          attributes: ["id", "filename"],
        })
      : []
    ).map((u) => [u.id, u]),
  );

  const data: WavelengthDatum<DomainSpec>[] = [];
  const sources: FitDatumSource[] = [];
  // Conditions are matched without regard to case and spaces ("Kontrolle" = "kontrolle"), shown as first spelled.
  const spellings = collectConditionSpellings(
    input.map(
      (d) =>
        d.condition ??
        (d.readoutId ? specimens.get(readouts.get(d.readoutId)?.specimenId ?? "")?.condition : undefined) ??
        "",
    ),
  );
  input.forEach((d, i) => {
    const f = `data[${i}]`;
    const domain = toDomain(d.domain);
    if (!d.readoutId) {
      for (const k of ["condition", "kind", "wavelengthUm", "uncertaintyUm"] as const) {
        if (d[k] === undefined) throw bad(`${f}.${k}`, `a typed measurement needs ${k} (or give a readoutId instead)`);
      }
      const typedCondition = spellings.displayOf(d.condition!);
      data.push({
        condition: typedCondition,
        wavelengthUm: d.wavelengthUm!,
        uncertaintyUm: d.uncertaintyUm!,
        kind: d.kind!,
        ...(domain ? { domain } : {}),
      });
      sources.push({
        index: i,
        source: "typed",
        condition: typedCondition,
        kind: d.kind!,
        readoutId: null,
        measure: null,
        filename: null,
        specimenLabel: null,
        studyId: null,
        studyName: null,
        inputSha256: null,
        readoutSoftwareVersion: null,
        specimenId: null,
      });
      return;
    }
    for (const k of ["wavelengthUm", "uncertaintyUm"] as const) {
      if (d[k] !== undefined)
        throw bad(`${f}.${k}`, `a readout's ${k} is read from the readout; leave ${k} out or leave out readoutId`);
    }
    const r = readouts.get(d.readoutId);
    if (!r) throw cannot(`${f}.readoutId`, "no readout with this id in this lab");
    const filename = uploads.get(r.uploadId)?.filename ?? "a deleted file";
    if (r.status !== "succeeded" || !r.result)
      throw cannot(
        `${f}.readoutId`,
        `the readout of “${filename}” has not finished (${r.status}); wait for it or leave it out`,
      );
    const h = headlineOf(r.result as unknown as ReadoutResult);
    if (!h.periodFound || h.wavelengthUm === null)
      throw cannot(`${f}.readoutId`, `the readout of “${filename}” found no significant period; leave it out`);
    const nnAvailable =
      h.nearestNeighbourUm !== null &&
      h.nearestNeighbourUm !== undefined &&
      (h.measure === "hex-equivalent-from-nn" || h.symmetry === "hexagonal");
    const kind = d.kind ?? (h.measure === "hex-equivalent-from-nn" ? "nearest-neighbour" : "fourier");
    let wavelengthUm: number, uncertaintyUm: number | null, measure: string;
    if (kind === "nearest-neighbour") {
      if (!nnAvailable)
        throw cannot(
          `${f}.kind`,
          `the readout of “${filename}” has no nearest-neighbour spacing of hexagonal spots (${MEASURE_LABELS[h.measure]}${h.symmetry ? `, ${h.symmetry}` : ""}); use kind "fourier"`,
        );
      wavelengthUm = h.nearestNeighbourUm!;
      uncertaintyUm = h.uncertaintyUm === null ? null : h.uncertaintyUm * FOURIER_TO_SPACING;
      measure = "nearest-neighbour spacing a of hexagonal spots";
    } else {
      if (h.measure === "hex-equivalent-from-nn")
        throw cannot(
          `${f}.kind`,
          `the readout of “${filename}” measured nearest-neighbour distances of centroids; use kind "nearest-neighbour" so the fit converts them itself`,
        );
      wavelengthUm = h.wavelengthUm;
      uncertaintyUm = h.uncertaintyUm;
      measure = MEASURE_LABELS[h.measure];
    }
    if (!(uncertaintyUm !== null && uncertaintyUm > 0))
      throw cannot(
        `${f}.readoutId`,
        `the readout of “${filename}” has no uncertainty, so it cannot be weighted; type the measurement with an uncertainty instead`,
      );
    const s = specimens.get(r.specimenId);
    const condition = spellings.displayOf(d.condition ?? s?.condition ?? "");
    if (!condition) throw bad(`${f}.condition`, "the readout's specimen has no condition; give one");
    const study = s ? studies.get(s.studyId) : undefined;
    data.push({ condition, wavelengthUm, uncertaintyUm, kind, ...(domain ? { domain } : {}) });
    sources.push({
      index: i,
      source: "readout",
      condition,
      kind,
      readoutId: r.id,
      measure,
      filename,
      specimenLabel: s?.label ?? null,
      studyId: study?.id ?? null,
      studyName: study?.name ?? null,
      inputSha256: r.inputSha256,
      readoutSoftwareVersion: r.softwareVersion,
      specimenId: r.specimenId,
    });
  });
  return { data, sources };
}
