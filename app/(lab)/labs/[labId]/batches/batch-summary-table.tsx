"use client";
/** A batch's files, one row each: λ ± u (µm), symmetry, significance, status, a link to the readout. */
import Link from "next/link";
import { Badge } from "@/components/ui/panel";
import type { BatchRowStatus, BatchSummaryRow } from "@/lib/server/batches/summary";
import { formatSig, plusMinus } from "../readouts/readout-format";

export interface BatchTableRow {
  key: string;
  filename: string;
  specimenLabel: string | null;
  specimenId: string | null;
  readoutId: string | null;
  wavelengthUm: number | null;
  uncertaintyUm: number | null;
  symmetry: string | null;
  significance: number | null;
  /** Upload phases before the server's summary knows the file, then the summary's status. */
  status: BatchRowStatus | "waiting" | "uploading" | "stored";
  statusText: string;
  /** 0..1 while uploading or reading. */
  progress: number | null;
}

/** A row of the server's summary as a table row. */
export function tableRowOf(r: BatchSummaryRow, key: string): BatchTableRow {
  return {
    key,
    filename: r.filename,
    specimenLabel: r.specimenLabel,
    specimenId: r.specimenId,
    readoutId: r.readoutId,
    wavelengthUm: r.wavelengthUm,
    uncertaintyUm: r.uncertaintyUm,
    symmetry: r.symmetry,
    significance: r.significance,
    status: r.status,
    statusText: r.statusText,
    progress: r.status === "reading" || r.status === "queued" ? r.progress : null,
  };
}

const TONE: Record<BatchTableRow["status"], "plain" | "moss" | "ochre" | "brick"> = {
  waiting: "plain",
  uploading: "ochre",
  stored: "plain",
  queued: "plain",
  reading: "ochre",
  read: "moss",
  "no-period": "ochre",
  failed: "brick",
  cancelled: "plain",
};

export function BatchSummaryTable({ labId, rows }: { labId: string; rows: BatchTableRow[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="batch-table">
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th className="py-1.5 pr-3">File</th>
            <th className="py-1.5 pr-3">Specimen</th>
            {/* normal-case: an upper-case λ would read as Λ */}
            <th className="py-1.5 pr-3 normal-case">λ ± u (µm)</th>
            <th className="py-1.5 pr-3">Symmetry</th>
            <th className="py-1.5 pr-3">Significance</th>
            <th className="py-1.5 pr-3">Status</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-rule align-top" data-testid="batch-row" data-status={r.status}>
              <td className="py-1.5 pr-3 font-medium" data-testid="batch-row-file">
                {r.filename}
              </td>
              <td className="py-1.5 pr-3">
                {r.specimenId ? (
                  <Link className="text-moss hover:underline" href={`/labs/${labId}/specimens/${r.specimenId}`}>
                    {r.specimenLabel}
                  </Link>
                ) : (
                  <span className="text-ink-soft">—</span>
                )}
              </td>
              <td className="num whitespace-nowrap py-1.5 pr-3" data-testid="batch-row-wavelength">
                {r.readoutId && r.wavelengthUm !== null ? (
                  <Link
                    className="font-semibold text-moss hover:underline"
                    href={`/labs/${labId}/readouts/${r.readoutId}`}
                  >
                    {plusMinus(r.wavelengthUm, r.uncertaintyUm, "").trim()}
                  </Link>
                ) : (
                  "—"
                )}
              </td>
              <td className="py-1.5 pr-3">{r.symmetry ?? "—"}</td>
              <td className="num py-1.5 pr-3">{r.significance === null ? "—" : `${formatSig(r.significance, 3)}×`}</td>
              <td className="py-1.5 pr-3" data-testid="batch-row-status">
                <Badge tone={TONE[r.status]}>{r.status === "no-period" ? "no significant period" : r.status}</Badge>
                {r.statusText !== r.status && r.status !== "no-period" && (
                  <span className={`ml-2 ${r.status === "failed" ? "text-brick" : "text-ink-soft"}`}>
                    {r.statusText.replace(/^failed: /, "")}
                  </span>
                )}
                {r.progress !== null && (r.status === "uploading" || r.status === "reading") && (
                  <div className="mt-1 h-1.5 w-32 overflow-hidden rounded bg-paper-deep">
                    <div className="h-full bg-moss" style={{ width: `${Math.round(r.progress * 100)}%` }} />
                  </div>
                )}
                {r.readoutId && r.wavelengthUm === null && (
                  <Link className="ml-2 text-moss hover:underline" href={`/labs/${labId}/readouts/${r.readoutId}`}>
                    readout
                  </Link>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
