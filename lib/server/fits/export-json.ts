/** A finished fit as one JSON document: spec (the command line's FIT.json), provenance, result. */
import "server-only";
import type { FitDetailDto } from "./fits";

export function fitToJson(fit: FitDetailDto): string {
  return JSON.stringify(
    {
      fit: {
        id: fit.id,
        name: fit.name,
        kind: fit.kind,
        status: fit.status,
        createdAt: fit.createdAt,
        createdByEmail: fit.createdByEmail,
        rerunOf: fit.rerunOf,
      },
      caution: "Model fits are hypotheses to be tested, not measurements.",
      units: { length: "µm", time: "s", diffusivity: "µm²/s", rate: "1/s" },
      softwareVersion: fit.softwareVersion,
      inputSha256: fit.inputSha256,
      spec: fit.spec,
      provenance: fit.provenance,
      result: fit.result,
    },
    null,
    2,
  );
}
