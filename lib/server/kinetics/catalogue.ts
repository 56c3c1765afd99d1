/**
 * What a kinetics is, for the analysis pages: the published catalogue (the same for everyone) and
 * any lab kinetics version, as one DTO shape.
 */
import "server-only";
import { CATALOGUE, type CatalogueKinetics, type KineticsDefinition } from "@/lib/kinetics";
import { notFound } from "../errors";

export interface KineticsParameterDto {
  name: string;
  meaning: string;
  default: number;
  /** null: no lower/upper bound. */
  min: number | null;
  max: number | null;
  unit: string | null;
}

/** What the analysis page needs to know about any kinetics, catalogue or lab. */
export interface KineticsInfoDto {
  kind: "catalogue" | "lab";
  id: string;
  name: string;
  source: string;
  form: string | null;
  species: string[];
  parameters: KineticsParameterDto[];
  units: "dimensional" | "non-dimensional";
  reactions: string[];
  diffusion: string[][];
  /** Lab kinetics only: the version described. */
  version: number | null;
}

const FINITE_MAX = Number.MAX_VALUE;
const bound = (v: number | undefined) =>
  v === undefined || !Number.isFinite(v) || Math.abs(v) >= FINITE_MAX ? null : v;

function catalogueInfo(k: CatalogueKinetics): KineticsInfoDto {
  return {
    kind: "catalogue",
    id: k.id,
    name: k.name,
    source: k.source,
    form: k.form,
    species: [...k.species],
    parameters: k.parameters.map((p) => ({
      name: p.name,
      meaning: p.meaning,
      default: p.default,
      min: bound(p.min),
      max: bound(p.max),
      unit: p.unit ?? null,
    })),
    units: k.units,
    reactions: [...k.reactionExpressions],
    diffusion: k.diffusionExpressions.map((r) => [...r]),
    version: null,
  };
}

export function listCatalogue(): KineticsInfoDto[] {
  return CATALOGUE.map(catalogueInfo);
}

export function getCatalogueEntry(id: string): KineticsInfoDto {
  const k = CATALOGUE.find((c) => c.id === id);
  if (!k) throw notFound("kinetics");
  return catalogueInfo(k);
}

export function definitionInfo(id: string, version: number, def: KineticsDefinition): KineticsInfoDto {
  const n = def.species.length;
  const diffusion = Array.isArray(def.diffusion[0])
    ? (def.diffusion as (string | number)[][]).map((r) => r.map(String))
    : Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => (i === j ? String((def.diffusion as (string | number)[])[i]) : "0")),
      );
  return {
    kind: "lab",
    id,
    name: def.name,
    source: def.source ?? "",
    form: null,
    species: [...def.species],
    parameters: def.parameters.map((p) => ({
      name: p.name,
      meaning: p.meaning ?? "",
      default: p.default,
      min: bound(p.min),
      max: bound(p.max),
      unit: p.unit ?? null,
    })),
    units: def.units ?? "non-dimensional",
    reactions: def.reactions.map(String),
    diffusion,
    version,
  };
}
