import { brusselator } from "./brusselator";
import { brusselatorThreeSpecies } from "./brusselator-three-species";
import type { CatalogueKinetics } from "./define";
import { fitzhughNagumo } from "./fitzhugh-nagumo";
import { giererMeinhardt, giererMeinhardtSaturation } from "./gierer-meinhardt";
import { grayScott } from "./gray-scott";
import { lengyelEpstein } from "./lengyel-epstein";
import { schnakenberg } from "./schnakenberg";
import { thomas } from "./thomas";
import { KineticsInputError } from "../errors";

export type { CatalogueKinetics } from "./define";

/** Every catalogue kinetics, in display order. */
export const CATALOGUE: readonly CatalogueKinetics[] = [
  schnakenberg,
  giererMeinhardt,
  giererMeinhardtSaturation,
  brusselator,
  lengyelEpstein,
  fitzhughNagumo,
  thomas,
  grayScott,
  brusselatorThreeSpecies,
];

/** Ids of the catalogue, in display order. */
export function listCatalogueIds(): string[] {
  return CATALOGUE.map((k) => k.id);
}

/** The catalogue kinetics with this id, or a {@link KineticsInputError} naming `field`. */
export function getCatalogueKinetics(id: string, field = "kinetics"): CatalogueKinetics {
  const k = CATALOGUE.find((c) => c.id === id);
  if (!k)
    throw new KineticsInputError(
      field,
      `Unknown kinetics "${id}"; the catalogue has: ${listCatalogueIds().join(", ")}.`,
    );
  return k;
}
