import { getCatalogueKinetics } from "./catalogue";
import { compileKinetics } from "./compile-kinetics";
import type { KineticsDefinition } from "./definition-schema";
import type { CompiledKinetics } from "./types";

/**
 * A serialisable reference to a kinetics (what crosses a worker or API boundary):
 * a catalogue id, or a lab definition to compile.
 */
export type KineticsSource = { catalogue: string } | { definition: KineticsDefinition };

/** Catalogue lookup or compilation of a {@link KineticsSource}. */
export function resolveKinetics(source: KineticsSource): CompiledKinetics {
  return "catalogue" in source ? getCatalogueKinetics(source.catalogue) : compileKinetics(source.definition);
}
