/** A condition comparison as CSV: `#` lines name the study, the units, the replicates and the Welch test; then one row per value. */
import "server-only";
import { csvComment, csvRow } from "../web/csv";
import type { ConditionComparison } from "./comparison-types";

export function comparisonToCsv(c: ConditionComparison): string {
  const lines: string[] = [];
  lines.push(
    csvComment(
      `Condition comparison of study ${c.studyName}; lengths in µm; latest finished readout per upload; replicates: ${c.replicate === "specimen" ? "specimens (the images of a specimen averaged first)" : "images (pseudo-replicated)"}`,
    ),
  );
  if (c.test.welch) {
    const w = c.test.welch;
    lines.push(
      csvComment(
        `Welch t-test ${c.test.a} vs ${c.test.b}: difference ${w.meanDifference} um; t ${w.t}; df ${w.df}; p ${w.pValue}; 95% CI ${w.ci95[0]} to ${w.ci95[1]} um; Hedges g ${w.hedgesG}`,
      ),
    );
  } else if (c.test.note) lines.push(csvComment(c.test.note));
  lines.push(
    [
      "condition",
      "specimen",
      "file",
      "readout_id",
      "measure",
      "wavelength_um",
      "uncertainty_um",
      "pixel_size_um_per_px",
      "readout_created_at",
      "specimen_mean_um",
      "specimen_images",
      "condition_n",
      "condition_specimens",
      "condition_images",
      "condition_mean_um",
      "condition_sd_um",
      "condition_ci95_low_um",
      "condition_ci95_high_um",
    ].join(","),
  );
  for (const g of c.groups) {
    const ofSpecimen = new Map(g.specimens.map((x) => [x.specimenId, x]));
    for (const p of g.points) {
      const sp = ofSpecimen.get(p.specimenId)!;
      lines.push(
        csvRow([
          p.condition,
          p.specimenLabel,
          p.filename,
          p.readoutId,
          p.measure,
          p.wavelengthUm,
          p.uncertaintyUm,
          p.pixelSizeUm,
          p.readoutCreatedAt,
          sp.wavelengthUm,
          sp.images,
          g.n,
          g.nSpecimens,
          g.nImages,
          g.meanUm,
          g.sdUm,
          g.ci95Um?.[0] ?? null,
          g.ci95Um?.[1] ?? null,
        ]),
      );
    }
  }
  return lines.join("\n") + "\n";
}
