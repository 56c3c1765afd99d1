"use client";
/** Condition comparison of a study: mean ± 95 % CI per condition, a dot plot, Welch's t-test, CSV. */
import { useState } from "react";
import useSWR from "swr";
import { ConditionDots } from "@/components/charts/condition-dots";
import { formatSig } from "@/components/charts/spectrum-format";
import { Notice } from "@/components/ui/notice";
import { EmptyState, Panel } from "@/components/ui/panel";
import { fetchJson } from "@/lib/client/api";
import type { ConditionComparison as Comparison } from "@/lib/server/readouts/comparison-types";

const selectClass = "rounded-md border border-rule bg-card px-2 py-1 text-sm";

function formatP(p: number): string {
  return p < 1e-4 ? p.toExponential(1) : formatSig(p, 2);
}

export function ConditionComparison({ labId, studyId }: { labId: string; studyId: string }) {
  const [a, setA] = useState("");
  const [b, setB] = useState("");
  const [replicate, setReplicate] = useState<"specimen" | "image">("specimen");
  const query = new URLSearchParams({
    ...(a ? { a } : {}),
    ...(b ? { b } : {}),
    ...(replicate === "image" ? { replicate } : {}),
  }).toString();
  const base = `/api/v1/labs/${labId}/studies/${studyId}/comparison`;
  const { data, error } = useSWR<Comparison>(`${base}${query ? `?${query}` : ""}`, fetchJson, {
    keepPreviousData: true,
    refreshInterval: 5000,
  });
  const csvHref = `${base}/csv${query ? `?${query}` : ""}`;
  return (
    <Panel
      title="Condition comparison"
      actions={
        data && data.groups.length > 0 ? (
          <a href={csvHref} className="text-sm font-medium text-moss hover:underline" data-testid="comparison-csv">
            Export CSV
          </a>
        ) : null
      }
    >
      <div data-testid="condition-comparison" className="space-y-4">
        {error && <Notice tone="error">{error.message}</Notice>}
        {!data && !error && <p className="text-sm text-ink-soft">Loading…</p>}
        {data && data.groups.length === 0 && (
          <EmptyState title="No finished readouts yet.">
            Upload images or spacing tables to the specimens; each is read automatically and its latest finished readout
            appears here, grouped by condition.
          </EmptyState>
        )}
        {data && data.groups.length > 0 && (
          <>
            <p className="text-sm text-ink-soft">
              The latest finished readout of each upload, grouped by the specimen&apos;s condition. Values:{" "}
              {Object.values(data.measures).join("; ")} (µm).
            </p>
            <div className="flex flex-wrap items-center gap-2 text-sm" data-testid="replicate-choice">
              <span className="text-ink-soft">Replicates:</span>
              <select
                className={selectClass}
                value={replicate}
                onChange={(e) => setReplicate(e.target.value === "image" ? "image" : "specimen")}
                aria-label="what counts as a replicate"
                data-testid="replicate"
              >
                <option value="specimen">specimens (images of a specimen averaged first)</option>
                <option value="image">every image (pseudo-replicated)</option>
              </select>
              {data.replicate === "specimen" && (
                <span className="text-xs text-ink-soft">
                  Specimens are the biological replicates; several images of one specimen are technical replicates,
                  averaged before the statistics.
                </span>
              )}
            </div>
            <div className="grid gap-5 lg:grid-cols-[1fr_auto]">
              <table className="h-fit w-full text-sm" data-testid="comparison-table">
                <thead>
                  <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-ink-soft">
                    <th className="py-1.5 pr-3 font-medium">Condition</th>
                    <th className="py-1.5 pr-3 font-medium">n</th>
                    <th className="py-1.5 pr-3 font-medium">Specimens · images</th>
                    <th className="py-1.5 pr-3 font-medium">Mean</th>
                    <th className="py-1.5 pr-3 font-medium">SD</th>
                    <th className="py-1.5 font-medium">95 % CI of the mean</th>
                  </tr>
                </thead>
                <tbody>
                  {data.groups.map((g) => (
                    <tr key={g.condition} className="border-b border-rule/60" data-testid="comparison-row">
                      <td className="max-w-[12rem] py-1.5 pr-3 font-medium [overflow-wrap:anywhere]">{g.condition}</td>
                      <td className="num py-1.5 pr-3" data-testid="comparison-n">
                        {g.n}
                      </td>
                      <td className="num py-1.5 pr-3" data-testid="comparison-counts">
                        {g.nSpecimens} · {g.nImages}
                      </td>
                      <td className="num py-1.5 pr-3 text-moss">{formatSig(g.meanUm)} µm</td>
                      <td className="num py-1.5 pr-3">{g.sdUm === null ? "—" : `${formatSig(g.sdUm, 3)} µm`}</td>
                      <td className="num py-1.5">
                        {g.ci95Um ? `${formatSig(g.ci95Um[0])} – ${formatSig(g.ci95Um[1])} µm` : "— (n < 2)"}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <ConditionDots
                groups={data.groups.map((g) => ({
                  condition: g.condition,
                  mean: g.meanUm,
                  ci95: g.ci95Um,
                  values:
                    data.replicate === "specimen"
                      ? g.specimens.map((x) => ({
                          value: x.wavelengthUm,
                          label: `${x.specimenLabel} · mean of ${x.images} image${x.images === 1 ? "" : "s"}`,
                        }))
                      : g.points.map((p) => ({ value: p.wavelengthUm, label: `${p.specimenLabel} · ${p.filename}` })),
                }))}
                yLabel="wavelength (µm)"
              />
            </div>
            <div className="space-y-2 rounded-md border border-rule bg-paper px-3 py-2" data-testid="welch">
              <div className="flex flex-wrap items-center gap-2 text-sm">
                <span className="font-medium">Welch&apos;s t-test</span>
                <select
                  className={selectClass}
                  value={a || data.test.a || ""}
                  onChange={(e) => setA(e.target.value)}
                  aria-label="first condition"
                  data-testid="welch-a"
                >
                  {data.conditions.map((c) => (
                    <option key={c} value={c}>
                      {c}
                    </option>
                  ))}
                </select>
                <span>vs</span>
                <select
                  className={selectClass}
                  value={b || data.test.b || ""}
                  onChange={(e) => setB(e.target.value)}
                  aria-label="second condition"
                  data-testid="welch-b"
                >
                  {data.conditions.map((c) => (
                    <option key={c} value={c}>
                      {c}
                    </option>
                  ))}
                </select>
              </div>
              {data.test.welch ? (
                <p className="text-sm" data-testid="welch-result">
                  difference of means <span className="num">{formatSig(data.test.welch.meanDifference)} µm</span> (95 %
                  CI{" "}
                  <span className="num">
                    {formatSig(data.test.welch.ci95[0])} – {formatSig(data.test.welch.ci95[1])} µm
                  </span>
                  ) · t = <span className="num">{formatSig(data.test.welch.t, 3)}</span>, df ={" "}
                  <span className="num">{formatSig(data.test.welch.df, 3)}</span> · p ={" "}
                  <span className="num font-semibold">{formatP(data.test.welch.pValue)}</span> · Hedges&apos; g ={" "}
                  <span className="num">{formatSig(data.test.welch.hedgesG, 3)}</span>
                </p>
              ) : (
                <p className="text-sm text-ink-soft">{data.test.note}</p>
              )}
            </div>
          </>
        )}
        {data?.warnings.map((w) => (
          <Notice key={w} tone="warning">
            {w}
          </Notice>
        ))}
        {data && data.excluded.length > 0 && (
          <details className="text-sm text-ink-soft">
            <summary>{data.excluded.length} upload(s) not included</summary>
            <ul className="mt-1 list-disc pl-5">
              {data.excluded.map((x) => (
                <li key={x.uploadId}>
                  {x.specimenLabel} · {x.filename} ({x.condition}): {x.reason}
                </li>
              ))}
            </ul>
          </details>
        )}
      </div>
    </Panel>
  );
}
