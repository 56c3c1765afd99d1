/**
 * "Change and re-run": the fit builder filled in from a stored fit — its readouts (condition and
 * how each is read), typed measurements, tissue sizes, kinetics with every parameter setting, and
 * its replicate, uncertainty and option choices — so a user changes one thing and starts a new fit.
 * Everything is read back from the stored spec and provenance; the original is never changed.
 *
 * Typed uncertainties: with "with-specimen-spread" the stored uncertainty is √(u² + SD²), SD the
 * sample SD of the condition's data (lib/fitting/replicate-spread.ts); the SD is recomputed from
 * the stored wavelengths (which the spread leaves unchanged), so u = √(U² − SD²) is the typed one.
 */
import "server-only";
import { SCALE_PARAMETERS } from "@/lib/fitting/kinetics-predictor";
import type { ParameterSetting } from "@/lib/fitting";
import type { LabContext } from "../access";
import type { KineticsInfoDto } from "../kinetics/catalogue";
import type { FitCandidateDto } from "./candidates";
import { findFit } from "./fits";
import { datumIndexOf } from "./specimen-pool";
import type { FitProvenance, StoredFitSpec } from "./spec-types";

type Kind = "fourier" | "nearest-neighbour";

/** The same shapes as the builder's drafts: every number as the text a field shows. */
export interface PrefillParam {
  mode: "fixed" | "free" | "per-condition";
  value: string;
  start: string;
  lower: string;
  upper: string;
  log: boolean;
}
export interface PrefillModel {
  /** The builder's kinetics key: a catalogue id, or `<lab kinetics id>@<version>`. */
  kinetics: string;
  lengthScaleUm: string;
  timeScaleS: string;
  gridSize?: number;
  params: Record<string, PrefillParam>;
}
export interface FitPrefill {
  fromFit: { id: string; name: string };
  name: string;
  picks: { readoutId: string; condition: string; kind: Kind }[];
  typed: { condition: string; kind: Kind; wavelengthUm: string; uncertaintyUm: string }[];
  tissues: Record<string, { kind: "none" | "interval" | "rectangle"; a: string; b: string }>;
  models: PrefillModel[];
  profiles: boolean;
  /** Options the builder has no field for (seed, starts, …), sent again as they were. */
  otherOptions: Record<string, unknown>;
  uncertainty: "per-readout" | "with-specimen-spread";
  replicates: "specimens" | "images";
  /** What could not be filled in as it was, in words. */
  notes: string[];
}

/** 12 significant digits: undoes floating-point noise of the square roots, keeps every typed digit. */
const text = (x: number) => String(Number(x.toPrecision(12)));
const firstOf = (v: number | Record<string, number>) => (typeof v === "number" ? v : Object.values(v)[0]);

function toParam(name: string, s: ParameterSetting, notes: string[], label: string): PrefillParam {
  const perCondition =
    s.mode === "fixed" ? typeof s.value !== "number" : s.mode === "per-condition" && typeof s.start !== "number";
  if (perCondition)
    notes.push(
      `${label}: ${name} had one ${s.mode === "fixed" ? "value" : "start"} per condition; the builder has one field, filled with the first (${text(firstOf(s.mode === "fixed" ? s.value : (s as { start: number | Record<string, number> }).start) ?? 0)}).`,
    );
  if (s.mode === "fixed") {
    const v = text(firstOf(s.value) ?? 0);
    return { mode: "fixed", value: v, start: v, lower: "", upper: "", log: false };
  }
  const start = text(firstOf(s.start) ?? 0);
  return { mode: s.mode, value: start, start, lower: text(s.lower), upper: text(s.upper), log: s.log ?? false };
}

/** The stored wavelengths' sample SD per kind and condition (the spread that was added in quadrature). */
function spreadByGroup(spec: StoredFitSpec): Map<string, number> {
  const groups = new Map<string, number[]>();
  for (const d of spec.data) {
    const k = `${d.kind}\u0000${d.condition}`;
    groups.set(k, [...(groups.get(k) ?? []), d.wavelengthUm]);
  }
  const sd = new Map<string, number>();
  for (const [k, v] of groups) {
    const mean = v.reduce((a, b) => a + b, 0) / v.length;
    sd.set(k, v.length < 2 ? 0 : Math.sqrt(v.reduce((a, x) => a + (x - mean) ** 2, 0) / (v.length - 1)));
  }
  return sd;
}

function readData(spec: StoredFitSpec, prov: FitProvenance, withSpread: boolean) {
  const sd = withSpread ? spreadByGroup(spec) : new Map<string, number>();
  const picks: FitPrefill["picks"] = [];
  const typed: FitPrefill["typed"] = [];
  const tissues: FitPrefill["tissues"] = {};
  prov.data.forEach((s, position) => {
    const i = datumIndexOf(s, position);
    const d = i === null ? undefined : spec.data[i];
    if (d?.domain && !tissues[s.condition])
      tissues[s.condition] =
        d.domain.kind === "interval"
          ? { kind: "interval", a: text(d.domain.length), b: "" }
          : d.domain.kind === "rectangle"
            ? { kind: "rectangle", a: text(d.domain.lx), b: text(d.domain.ly) }
            : { kind: "none", a: "", b: "" };
    if (s.source === "readout" && s.readoutId) {
      if (!picks.some((p) => p.readoutId === s.readoutId))
        picks.push({ readoutId: s.readoutId, condition: s.condition, kind: s.kind });
    } else if (s.source === "typed" && d) {
      const spread = sd.get(`${d.kind}\u0000${d.condition}`) ?? 0;
      const u = Math.sqrt(Math.max(d.uncertaintyUm ** 2 - spread ** 2, 0));
      typed.push({ condition: s.condition, kind: s.kind, wavelengthUm: text(d.wavelengthUm), uncertaintyUm: text(u) });
    }
  });
  return { picks, typed, tissues };
}

function readModels(spec: StoredFitSpec, prov: FitProvenance, kinetics: KineticsInfoDto[], notes: string[]) {
  const models: PrefillModel[] = [];
  spec.models.forEach((m, i) => {
    const src = prov.kinetics[i];
    const key = src.kind === "lab" ? `${src.id}@${src.version}` : src.id;
    const info =
      kinetics.find((k) => (k.kind === "lab" ? `${k.id}@${k.version}` : k.id) === key) ??
      kinetics.find((k) => k.kind === src.kind && k.id === src.id);
    if (!info) {
      notes.push(`${src.label} is no longer among the lab's kinetics and is left out.`);
      return;
    }
    if (info.kind === "lab" && info.version !== src.version)
      notes.push(
        `${src.label} was fitted at version ${src.version}; the builder offers version ${info.version}, filled in with the same settings where its parameters have the same names.`,
      );
    const known = new Set([...info.parameters.map((p) => p.name), ...SCALE_PARAMETERS]);
    const params: Record<string, PrefillParam> = {};
    for (const [name, s] of Object.entries(m.parameters))
      if (known.has(name)) params[name] = toParam(name, s, notes, src.label);
    for (const scale of SCALE_PARAMETERS)
      if (params[scale])
        notes.push(
          `${src.label}: ${scale} is fitted as a parameter, as in the original; the builder sends it unchanged.`,
        );
    models.push({
      kinetics: info.kind === "lab" ? `${info.id}@${info.version}` : info.id,
      lengthScaleUm: m.lengthScaleUm !== undefined ? text(m.lengthScaleUm) : "",
      timeScaleS: m.timeScaleS !== undefined ? text(m.timeScaleS) : "",
      ...(m.gridSize !== undefined ? { gridSize: m.gridSize } : {}),
      params,
    });
  });
  return models;
}

/**
 * The builder's fields from the fit `fitId` of this lab (404 for another lab's or a missing one).
 * `candidates` and `kinetics` are what the builder offers: a readout or kinetics no longer among
 * them is left out and a note says so.
 */
export async function readFitPrefill(
  ctx: LabContext,
  fitId: string,
  candidates: FitCandidateDto[],
  kinetics: KineticsInfoDto[],
): Promise<FitPrefill> {
  const row = await findFit(ctx, fitId);
  const spec = row.spec as unknown as StoredFitSpec;
  const prov = row.provenance as unknown as FitProvenance;
  // Fits made before these choices existed weighed each image by its own uncertainty.
  const uncertainty = prov.settings.uncertainty === "with-specimen-spread" ? "with-specimen-spread" : "per-readout";
  const replicates = prov.settings.replicates === "specimens" ? "specimens" : "images";
  const notes: string[] = [];
  const data = readData(spec, prov, uncertainty === "with-specimen-spread");
  const offered = new Set(candidates.map((c) => c.readoutId));
  const missing = data.picks.filter((p) => !offered.has(p.readoutId)).length;
  if (missing)
    notes.push(
      `${missing} readout${missing > 1 ? "s" : ""} of the original fit ${missing > 1 ? "are" : "is"} no longer offered (deleted, or no longer a finished readout with a period) and left out.`,
    );
  const { profiles, ...otherOptions } = spec.options as Record<string, unknown>;
  return {
    fromFit: { id: row.id, name: row.name },
    name: `${row.name.replace(/( \(changed\))*$/, "")} (changed)`.slice(0, 200),
    picks: data.picks.filter((p) => offered.has(p.readoutId)),
    typed: data.typed,
    tissues: data.tissues,
    models: readModels(spec, prov, kinetics, notes),
    profiles: typeof profiles === "boolean" ? profiles : prov.settings.profiles !== false,
    otherOptions,
    uncertainty,
    replicates,
    notes,
  };
}

/** The lab kinetics (id and version) a fit used first, so the builder offers that version. */
export async function readFitKineticsPin(ctx: LabContext, fitId: string) {
  const prov = (await findFit(ctx, fitId)).provenance as unknown as FitProvenance;
  const lab = prov.kinetics.find((k) => k.kind === "lab" && k.version !== null);
  return lab ? { id: lab.id, version: lab.version! } : undefined;
}
