/**
 * Replicates as biologists count them (SCIENCE.md §6): specimens are the biological replicates;
 * several images (readouts) of one specimen are technical replicates and are averaged first, so a
 * specimen imaged three times counts once. The same input file (same SHA-256) read twice for one
 * specimen is one measurement, not two: the repeat is kept in the provenance and left out of the mean.
 * Typed measurements are each their own specimen.
 */
import "server-only";
import type { WavelengthDatum } from "@/lib/fitting";
import type { DomainSpec } from "@/lib/stability";
import { conditionKey } from "@/lib/spacing";
import type { FitDatumSource } from "./spec-types";

export interface PooledData {
  data: WavelengthDatum<DomainSpec>[];
  /** One per input datum, with the index of the pooled datum it fed (or null for a repeated file). */
  sources: FitDatumSource[];
  counts: { specimens: number; images: number; repeatedFiles: number };
}

/**
 * The mean of a specimen's images, with the larger of two uncertainties of that mean: the images' own,
 * √(Σuᵢ²)/n, and their scatter, SD/√n (common practice, no source).
 */
function poolImages(group: WavelengthDatum<DomainSpec>[]): WavelengthDatum<DomainSpec> {
  const n = group.length;
  if (n === 1) return group[0];
  const mean = group.reduce((s, d) => s + d.wavelengthUm, 0) / n;
  const own = Math.sqrt(group.reduce((s, d) => s + d.uncertaintyUm ** 2, 0)) / n;
  const sd = Math.sqrt(group.reduce((s, d) => s + (d.wavelengthUm - mean) ** 2, 0) / (n - 1));
  return { ...group[0], wavelengthUm: mean, uncertaintyUm: Math.max(own, sd / Math.sqrt(n)) };
}

export function poolBySpecimen(data: WavelengthDatum<DomainSpec>[], sources: FitDatumSource[]): PooledData {
  const groups = new Map<string, number[]>();
  const seenFiles = new Set<string>();
  const repeated = new Set<number>();
  data.forEach((d, i) => {
    const s = sources[i];
    const specimen = s.source === "readout" && s.specimenId ? s.specimenId : `typed:${i}`;
    const key = [specimen, conditionKey(d.condition), d.kind, JSON.stringify(d.domain ?? null)].join("\u0000");
    if (s.source === "readout" && s.inputSha256) {
      const file = `${key}\u0000${s.inputSha256}`;
      if (seenFiles.has(file)) {
        repeated.add(i);
        return;
      }
      seenFiles.add(file);
    }
    groups.set(key, [...(groups.get(key) ?? []), i]);
  });
  const pooled: WavelengthDatum<DomainSpec>[] = [];
  const datumOf = new Map<number, number>();
  for (const idx of groups.values()) {
    for (const i of idx) datumOf.set(i, pooled.length);
    pooled.push(poolImages(idx.map((i) => data[i])));
  }
  return {
    data: pooled,
    sources: sources.map((s, i) => ({
      ...s,
      datumIndex: datumOf.get(i) ?? null,
      ...(repeated.has(i) ? { note: "the same file as an earlier image of this specimen; counted once" } : {}),
    })),
    counts: { specimens: pooled.length, images: data.length - repeated.size, repeatedFiles: repeated.size },
  };
}

/**
 * The fitted datum a source fed: its recorded datumIndex, or (fits made before pooling) its input index,
 * which is its position in the list.
 */
export function datumIndexOf(s: FitDatumSource, position: number): number | null {
  return s.datumIndex === undefined ? (s.index ?? position) : s.datumIndex;
}

/** Readout ids behind fitted datum i, joined by ";" (several images of one specimen). */
export function readoutIdsOfDatum(sources: FitDatumSource[], i: number): string {
  return sources
    .filter((s, position) => datumIndexOf(s, position) === i && s.readoutId)
    .map((s) => s.readoutId)
    .join(";");
}
