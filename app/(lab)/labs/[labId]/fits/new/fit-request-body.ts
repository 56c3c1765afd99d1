/** Builds the body of POST /api/v1/labs/:labId/fits from the fit builder's drafts; the server checks it. */
import type { FitCandidateDto } from "@/lib/server/fits/candidates";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { Pick, Tissue, Typed } from "./fit-data-drafts";
import { keyOf, modelBody, num, type ModelDraft } from "./fit-model-editor";

export interface FitDrafts {
  name: string;
  candidates: FitCandidateDto[];
  picks: Record<string, Pick>;
  typed: Typed[];
  tissues: Record<string, Tissue>;
  conditions: string[];
  models: ModelDraft[];
  kinetics: KineticsInfoDto[];
  profiles: boolean;
  uncertainty: "per-readout" | "with-specimen-spread";
  replicates: "specimens" | "images";
  /** Options the builder has no field for, kept from the fit being changed. */
  otherOptions?: Record<string, unknown>;
  /** The fit being changed ("Change and re-run"). */
  changedFrom?: string;
}

export function buildFitBody({
  name,
  candidates,
  picks,
  typed,
  tissues,
  conditions,
  models,
  kinetics,
  profiles,
  uncertainty,
  replicates,
  otherOptions = {},
  changedFrom,
}: FitDrafts) {
  const domainOf = (condition: string) => {
    const t = tissues[condition];
    if (!t || t.kind === "none") return {};
    return {
      domain:
        t.kind === "interval"
          ? { kind: "interval", length: num(t.a) }
          : { kind: "rectangle", lx: num(t.a), ly: num(t.b) },
    };
  };
  const data = [
    ...candidates
      .filter((c) => picks[c.readoutId].on)
      .map((c) => {
        const p = picks[c.readoutId];
        return {
          readoutId: c.readoutId,
          kind: p.kind,
          ...(p.condition.trim() !== c.condition ? { condition: p.condition.trim() } : {}),
          ...domainOf(p.condition.trim()),
        };
      }),
    ...typed.map((t) => ({
      condition: t.condition.trim(),
      kind: t.kind,
      wavelengthUm: num(t.wavelengthUm),
      uncertaintyUm: num(t.uncertaintyUm),
      ...domainOf(t.condition.trim()),
    })),
  ];
  return {
    name:
      name.trim() ||
      `${models.map((m) => kinetics.find((k) => keyOf(k) === m.kinetics)?.name).join(" vs ")} — ${conditions.join(" vs ")}`,
    data,
    models: models.map((m) => modelBody(m, kinetics)),
    options: { ...otherOptions, profiles },
    uncertainty,
    replicates,
    ...(changedFrom ? { changedFrom } : {}),
  };
}
