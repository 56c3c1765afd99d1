"use client";
/** Readouts of a specimen's uploads: progress while they run, then the headline numbers. */
import Link from "next/link";
import useSWR from "swr";
import { Badge, EmptyState, Panel } from "@/components/ui/panel";
import { LongName } from "@/components/ui/long-name";
import { fetchJson } from "@/lib/client/api";
import { formatDateTime } from "@/lib/client/format";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import type { ListResult } from "@/lib/server/web/list";
import { useEffect } from "react";
import {
  formatSig,
  pixelSizeLabel,
  plusMinus,
  settingsSummary,
  STATUS_TONE,
  STATUS_WORDS,
} from "../../readouts/readout-format";

const active = (s: string) => s === "queued" || s === "running";

function Numbers({ r }: { r: ReadoutDto }) {
  if (active(r.status)) {
    return (
      <div className="w-40" data-testid="readout-progress">
        <div className="h-1.5 overflow-hidden rounded bg-paper-deep">
          <div className="h-full bg-moss" style={{ width: `${Math.round(r.progress * 100)}%` }} />
        </div>
        <span className="num text-xs text-ink-soft">
          {Math.round(r.progress * 100)} %{r.progressNote ? ` · ${r.progressNote}` : ""}
        </span>
      </div>
    );
  }
  if (r.status !== "succeeded")
    return (
      <span className="text-sm text-brick" data-testid="readout-error">
        {r.error ?? "no reason recorded"}
      </span>
    );
  const h = r.headline!;
  if (!h.periodFound)
    return (
      <span className="text-sm text-ochre">
        no significant period <span className="num">({formatSig(h.significance, 3)}× background)</span>
      </span>
    );
  const label = {
    "fourier-wavelength": "λ",
    "mean-spacing-1d": "mean spacing",
    "hex-equivalent-from-nn": "λ (hex, from NN)",
    "mean-spacing-table": "mean spacing",
  }[h.measure];
  return (
    <span className="text-sm">
      <span className="text-ink-soft">{label} </span>
      <span className="num font-semibold text-moss" data-testid="readout-headline">
        {plusMinus(h.wavelengthUm, h.uncertaintyUm, "µm")}
      </span>
      {h.symmetry && <span className="text-ink-soft"> · {h.symmetry}</span>}
      {h.symmetry === "hexagonal" && h.nearestNeighbourUm ? (
        <span className="text-ink-soft">
          {" "}
          · NN spacing <span className="num">{formatSig(h.nearestNeighbourUm)} µm</span>
        </span>
      ) : null}
      {h.significance !== undefined && (
        <span className="text-ink-soft">
          {" "}
          · <span className="num">{formatSig(h.significance, 3)}×</span> background
        </span>
      )}
      {h.n !== undefined && (
        <span className="text-ink-soft">
          {" "}
          · n = <span className="num">{h.n}</span>
        </span>
      )}
    </span>
  );
}

export function ReadoutsPanel({
  labId,
  specimenId,
  refreshKey,
}: {
  labId: string;
  specimenId: string;
  refreshKey: number;
}) {
  const { data, mutate } = useSWR<ListResult<ReadoutDto>>(
    `/api/v1/labs/${labId}/readouts?specimenId=${specimenId}&pageSize=200`,
    fetchJson,
    {
      refreshInterval: (d) => (d?.items.some((r) => active(r.status)) ? 1000 : 0),
      // Coming back from a readout page (maybe after a re-run) must show the new readouts.
      revalidateOnMount: true,
      dedupingInterval: 0,
    },
  );
  useEffect(() => {
    if (refreshKey) void mutate();
  }, [refreshKey, mutate]);
  const items = [...(data?.items ?? [])].sort(
    (a, b) => a.filename.localeCompare(b.filename) || b.createdAt.localeCompare(a.createdAt),
  );
  return (
    <Panel title="Readouts">
      {data && items.length === 0 ? (
        <EmptyState title="No readouts yet.">
          Each uploaded image or table is read automatically; upload a file above to start one.
        </EmptyState>
      ) : (
        // Scrolls inside its panel on a phone rather than widening the page.
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="readouts-table">
            <thead>
              <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-ink-soft">
                <th className="py-1.5 pr-3 font-medium">File</th>
                <th className="py-1.5 pr-3 font-medium">Status</th>
                <th className="py-1.5 pr-3 font-medium">Result</th>
                <th className="hidden py-1.5 pr-3 font-medium sm:table-cell">Settings</th>
                <th className="hidden py-1.5 pr-3 font-medium sm:table-cell">Started</th>
                <th className="py-1.5 font-medium" />
              </tr>
            </thead>
            <tbody>
              {items.map((r) => (
                <tr key={r.id} className="border-b border-rule/60 align-top" data-testid="readout-row">
                  <td className="py-1.5 pr-3 font-medium">
                    <LongName text={r.filename} />
                  </td>
                  <td className="py-1.5 pr-3">
                    <Badge tone={STATUS_TONE[r.status]}>{STATUS_WORDS[r.status]}</Badge>
                  </td>
                  <td className="py-1.5 pr-3">
                    <Numbers r={r} />
                  </td>
                  <td className="hidden py-1.5 pr-3 text-xs text-ink-soft sm:table-cell">
                    {settingsSummary(r)}
                    <br />
                    <span className="num">{pixelSizeLabel(r.pixelSizeUm, r.pixelSizeSource)}</span>
                  </td>
                  <td className="num hidden py-1.5 pr-3 text-xs text-ink-soft sm:table-cell">
                    {formatDateTime(r.createdAt)}
                  </td>
                  <td className="py-1.5">
                    <Link
                      href={`/labs/${labId}/readouts/${r.id}`}
                      className="font-medium text-moss hover:underline"
                      data-testid="open-readout"
                    >
                      Open
                    </Link>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
