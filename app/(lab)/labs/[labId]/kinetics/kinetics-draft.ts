/** The editor's form state and its conversion to the API's definition (numbers where the text is a number). */
import type { KineticsDefinition } from "@/lib/kinetics/definition-schema";

export interface ParameterDraft {
  name: string;
  default: string;
  min: string;
  max: string;
  meaning: string;
}

export interface KineticsDraft {
  name: string;
  description: string;
  units: "non-dimensional" | "dimensional";
  nonNegative: boolean;
  species: { name: string; reaction: string }[];
  parameters: ParameterDraft[];
  diffusionMode: "diagonal" | "full";
  /** Diagonal entries, one per species. */
  diagonal: string[];
  /** Full matrix, row-major. */
  full: string[][];
}

export const MIN_SPECIES = 2;
export const MAX_SPECIES = 6;

export function emptyDraft(): KineticsDraft {
  return {
    name: "",
    description: "",
    units: "non-dimensional",
    nonNegative: true,
    species: [
      { name: "u", reaction: "" },
      { name: "v", reaction: "" },
    ],
    parameters: [{ name: "", default: "", min: "", max: "", meaning: "" }],
    diffusionMode: "diagonal",
    diagonal: ["1", ""],
    full: [
      ["1", "0"],
      ["0", ""],
    ],
  };
}

const str = (v: string | number | undefined) => (v === undefined ? "" : String(v));

export function draftFromDefinition(def: KineticsDefinition, description: string | null): KineticsDraft {
  const n = def.species.length;
  const full = Array.isArray(def.diffusion[0]);
  const diag = full
    ? (def.diffusion as (string | number)[][]).map((r, i) => str(r[i]))
    : (def.diffusion as (string | number)[]).map(str);
  return {
    name: def.name,
    description: description ?? "",
    units: def.units ?? "non-dimensional",
    nonNegative: def.nonNegative ?? true,
    species: def.species.map((s, i) => ({ name: s, reaction: str(def.reactions[i]) })),
    parameters: def.parameters.map((p) => ({
      name: p.name,
      default: str(p.default),
      min: str(p.min),
      max: str(p.max),
      meaning: p.meaning ?? "",
    })),
    diffusionMode: full ? "full" : "diagonal",
    diagonal: diag,
    full: full
      ? (def.diffusion as (string | number)[][]).map((r) => r.map(str))
      : Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? diag[i] : "0"))),
  };
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
/** A number when the text is one; otherwise the text itself, so the server names the field. */
const numberOrText = (s: string): number | string => (NUMBER.test(s.trim()) ? Number(s.trim()) : s.trim());

export function definitionFromDraft(d: KineticsDraft): unknown {
  return {
    name: d.name.trim(),
    units: d.units,
    nonNegative: d.nonNegative,
    species: d.species.map((s) => s.name.trim()),
    parameters: d.parameters
      .filter((p) => p.name.trim() !== "" || p.default.trim() !== "")
      .map((p) => ({
        name: p.name.trim(),
        default: numberOrText(p.default),
        ...(p.min.trim() ? { min: numberOrText(p.min) } : {}),
        ...(p.max.trim() ? { max: numberOrText(p.max) } : {}),
        ...(p.meaning.trim() ? { meaning: p.meaning.trim() } : {}),
      })),
    reactions: d.species.map((s) => s.reaction.trim()),
    diffusion: d.diffusionMode === "diagonal" ? d.diagonal.map(numberOrText) : d.full.map((r) => r.map(numberOrText)),
  };
}

/** Resizes the diffusion entries when species are added or removed. */
export function resizeDiffusion(d: KineticsDraft, n: number): Pick<KineticsDraft, "diagonal" | "full"> {
  const diagonal = Array.from({ length: n }, (_, i) => d.diagonal[i] ?? "1");
  const full = Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => d.full[i]?.[j] ?? (i === j ? "1" : "0")),
  );
  return { diagonal, full };
}
