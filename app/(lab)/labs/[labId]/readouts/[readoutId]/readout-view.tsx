"use client";
import Link from "next/link";
import useSWR from "swr";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import { fetchJson } from "@/lib/client/api";
import { formatDateTime } from "@/lib/client/format";
import type { ReadoutDetailDto, ReadoutDto } from "@/lib/server/readouts/readouts";
import type { ListResult } from "@/lib/server/web/list";
import { pixelSizeLabel, plusMinus, settingsSummary, STATUS_TONE, STATUS_WORDS } from "../readout-format";
import { ImageResult } from "./image-result";
import { RerunForm } from "./rerun-form";
import { TableResult } from "./table-result";

const active = (s: string) => s === "queued" || s === "running";

export function ReadoutView({
  labId,
  initial,
  canRerun,
}: {
  labId: string;
  initial: ReadoutDetailDto;
  canRerun: boolean;
}) {
  const { data } = useSWR<ReadoutDetailDto>(`/api/v1/labs/${labId}/readouts/${initial.id}`, fetchJson, {
    fallbackData: initial,
    // `d` is undefined while only the server-rendered fallback is known: poll from that status too.
    refreshInterval: (d) => (active((d ?? initial).status) ? 800 : 0),
  });
  const r = data ?? initial;
  // Keyed by this readout too: after a re-run the new page must not reuse the list the previous
  // page fetched a moment ago (SWR dedupes identical keys for 2 s).
  const { data: siblings } = useSWR<ListResult<ReadoutDto>>(
    `/api/v1/labs/${labId}/uploads/${r.uploadId}/readouts?pageSize=50&seenFrom=${r.id}`,
    fetchJson,
    { refreshInterval: active(r.status) ? 2000 : 0 },
  );
  return (
    <div className="space-y-5" data-testid="readout-view">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <Badge tone={STATUS_TONE[r.status]}>
          <span data-testid="readout-status">{STATUS_WORDS[r.status]}</span>
        </Badge>
        <span className="text-ink-soft">
          Pixel size{" "}
          <span className="num text-ink" data-testid="readout-pixel-size">
            {pixelSizeLabel(r.pixelSizeUm, r.pixelSizeSource)}
          </span>
        </span>
      </div>
      {active(r.status) && (
        <Panel title="Reading the pattern…">
          <div
            className="h-2 w-full max-w-md overflow-hidden rounded bg-paper-deep"
            role="progressbar"
            aria-valuenow={Math.round(r.progress * 100)}
            aria-valuemin={0}
            aria-valuemax={100}
          >
            <div className="h-full bg-moss transition-all" style={{ width: `${Math.round(r.progress * 100)}%` }} />
          </div>
          <p className="mt-2 text-sm text-ink-soft" data-testid="readout-progress">
            <span className="num">{Math.round(r.progress * 100)} %</span>
            {r.progressNote ? ` · ${r.progressNote}` : r.status === "queued" ? " · waiting for earlier jobs" : ""}
          </p>
        </Panel>
      )}
      {(r.status === "failed" || r.status === "cancelled") && (
        <Notice tone="error" testId="readout-error">
          This readout {r.status === "failed" ? "failed" : "was cancelled"}: {r.error ?? "no reason was recorded"}. The
          uploaded file is kept; change the settings below and run it again.
        </Notice>
      )}
      {r.status === "succeeded" && r.result?.type === "image" && <ImageResult readout={r} result={r.result} />}
      {r.status === "succeeded" && r.result?.type === "table" && <TableResult result={r.result} />}
      <Provenance r={r} />
      {canRerun && <RerunForm labId={labId} readout={r} />}
      <Panel title="All readouts of this file">
        <ul className="divide-y divide-rule text-sm" data-testid="sibling-readouts">
          {(siblings?.items ?? []).map((s) => (
            <li key={s.id} className="flex flex-wrap items-center gap-3 py-1.5">
              <Badge tone={STATUS_TONE[s.status]}>{STATUS_WORDS[s.status]}</Badge>
              {s.id === r.id ? (
                <span className="font-medium">this readout</span>
              ) : (
                <Link className="text-moss hover:underline" href={`/labs/${labId}/readouts/${s.id}`}>
                  open
                </Link>
              )}
              <span className="num">
                {s.headline
                  ? s.headline.periodFound
                    ? plusMinus(s.headline.wavelengthUm, s.headline.uncertaintyUm, "µm")
                    : "no significant period"
                  : "—"}
              </span>
              <span className="num text-ink-soft">{formatDateTime(s.createdAt)}</span>
              <span className="text-xs text-ink-soft">{settingsSummary(s)}</span>
            </li>
          ))}
        </ul>
      </Panel>
    </div>
  );
}

function Provenance({ r }: { r: ReadoutDetailDto }) {
  return (
    <Panel title="Provenance">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="text-ink-soft">Settings</dt>
        <dd data-testid="readout-settings">{settingsSummary(r)}</dd>
        <dt className="text-ink-soft">Pixel size</dt>
        <dd className="num">{pixelSizeLabel(r.pixelSizeUm, r.pixelSizeSource)}</dd>
        <dt className="text-ink-soft">Input SHA-256</dt>
        <dd className="num break-all text-xs">{r.inputSha256}</dd>
        <dt className="text-ink-soft">Software</dt>
        <dd className="num">{r.softwareVersion}</dd>
        <dt className="text-ink-soft">Readout id</dt>
        <dd className="num text-xs">{r.id}</dd>
      </dl>
    </Panel>
  );
}
