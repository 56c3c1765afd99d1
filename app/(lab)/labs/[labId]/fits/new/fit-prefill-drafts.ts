/** The builder's starting drafts: empty, or filled in from a fit being changed ("Change and re-run"). */
import type { FitCandidateDto } from "@/lib/server/fits/candidates";
import type { FitPrefill } from "@/lib/server/fits/prefill";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { Pick, Tissue, Typed } from "./fit-data-drafts";
import { newModel, type ModelDraft } from "./fit-model-editor";

export interface StartingDrafts {
  name: string;
  picks: Record<string, Pick>;
  typed: Typed[];
  tissues: Record<string, Tissue>;
  models: ModelDraft[];
  profiles: boolean;
  uncertainty: "per-readout" | "with-specimen-spread";
  replicates: "specimens" | "images";
}

export function startingDrafts(
  candidates: FitCandidateDto[],
  first: KineticsInfoDto,
  prefill: FitPrefill | null,
  initialReadout: string | null = null,
): StartingDrafts {
  const picks = Object.fromEntries(
    candidates.map((c): [string, Pick] => {
      const was = prefill?.picks.find((p) => p.readoutId === c.readoutId);
      return [
        c.readoutId,
        was
          ? { on: true, condition: was.condition, kind: was.kind }
          : { on: c.readoutId === initialReadout, condition: c.condition, kind: c.defaultKind },
      ];
    }),
  );
  return {
    name: prefill?.name ?? "",
    picks,
    typed: prefill?.typed ?? [],
    tissues: prefill?.tissues ?? {},
    models: prefill?.models.length ? prefill.models.map((m, i) => ({ ...m, key: `m${i}` })) : [newModel(first, "m0")],
    profiles: prefill?.profiles ?? true,
    uncertainty: prefill?.uncertainty ?? "with-specimen-spread",
    replicates: prefill?.replicates ?? "specimens",
  };
}
