/** A batch's summary as CSV: `#` lines name the batch and the units; then one row per file. */
import "server-only";
import { csvComment, csvRow } from "../web/csv";
import type { BatchSummary } from "./summary";

export const BATCH_CSV_COLUMNS = [
  "file",
  "specimen",
  "wavelength_um",
  "uncertainty_um",
  "symmetry",
  "significance",
  "status",
  "message",
  "measure",
  "pixel_size_um_per_px",
  "upload_id",
  "readout_id",
] as const;

export function batchSummaryToCsv(s: BatchSummary): string {
  const lines = [
    csvComment(`Batch ${s.name} (${s.createdAt}); lengths in µm; the readout each file got with the batch`),
    csvRow(BATCH_CSV_COLUMNS),
    ...s.rows.map((r) =>
      csvRow([
        r.filename,
        r.specimenLabel,
        r.wavelengthUm,
        r.uncertaintyUm,
        r.symmetry,
        r.significance,
        r.status,
        r.message,
        r.measure,
        r.pixelSizeUm,
        r.uploadId,
        r.readoutId,
      ]),
    ),
  ];
  return lines.join("\n") + "\n";
}
