"use client";
import Link from "next/link";
/** A fit while it runs (progress from its job) and when done: ranking, one kinetics in detail, provenance, exports. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import useSWR from "swr";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { ApiError, fetchJson, sendJson } from "@/lib/client/api";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import type { JobDto } from "@/lib/server/jobs/queue";
import { FIT_STATUS_TONE, FIT_STATUS_WORDS, isActive, VERDICT_TONE } from "../fit-format";
import { FitModelDetail } from "./fit-model-detail";
import { FitProvenance } from "./fit-provenance";

const action = "rounded-md border border-rule bg-card px-2.5 py-1 text-sm hover:bg-paper-deep";

/** The run form filled in with one kinetics of a fit (by label) at its fitted parameters for one condition. */
function verifyBestHref(labId: string, d: FitDetailDto, label: string, condition: string | undefined): string {
  const q = new URLSearchParams({ fit: d.id, model: label, condition: condition ?? "" });
  return `/labs/${labId}/runs/new?${q.toString()}`;
}

export function FitView({
  labId,
  initial,
  canSimulate = false,
}: {
  labId: string;
  initial: FitDetailDto;
  canSimulate?: boolean;
}) {
  const router = useRouter();
  const base = `/api/v1/labs/${labId}/fits/${initial.id}`;
  const fit = useSWR<FitDetailDto>(base, fetchJson, {
    fallbackData: initial,
    refreshInterval: (d) => (isActive((d ?? initial).status) ? 1500 : 0),
  });
  const d = fit.data ?? initial;
  const job = useSWR<JobDto>(
    d.jobId && isActive(d.status) ? `/api/v1/labs/${labId}/jobs/${d.jobId}` : null,
    fetchJson,
    {
      refreshInterval: 800,
      onSuccess: (j) => {
        if (!isActive(j.status)) void fit.mutate();
      },
    },
  );
  const [selected, setSelected] = useState<string | null>(null);
  const [rerunError, setRerunError] = useState<string | null>(null);
  const r = d.result;
  const best = r ? (r.comparison?.ranking[0]?.label ?? r.models[0].label) : null;
  const shown = r?.models.find((m) => m.label === (selected ?? best)) ?? null;
  const progress = job.data?.progress ?? d.progress;
  const note = job.data?.progressNote ?? d.progressNote;

  async function rerun() {
    setRerunError(null);
    try {
      const again = await sendJson<FitDetailDto>("POST", `${base}/rerun`);
      router.push(`/labs/${labId}/fits/${again.id}`);
    } catch (err) {
      setRerunError(err instanceof ApiError ? err.message : String(err));
    }
  }

  return (
    <div className="space-y-6">
      <Notice tone="warning" testId="fit-caution">
        Research use: a fit says which parameter values of a model would reproduce the measured spacing. It is a
        hypothesis to test (for example by a verification run or an experiment), not a measurement.
      </Notice>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div className="flex items-center gap-2">
          <Badge tone={FIT_STATUS_TONE[d.status]}>{FIT_STATUS_WORDS[d.status]}</Badge>
          {r && shown && <Badge tone={VERDICT_TONE[shown.fit.verdict] ?? "plain"}>{shown.fit.verdict}</Badge>}
        </div>
        <div className="flex flex-wrap items-center gap-2" data-testid="fit-actions">
          {r &&
            (["csv", "json", "methods"] as const).map((x) => (
              <a
                key={x}
                className="rounded-md border border-rule bg-card px-2.5 py-1 text-sm hover:bg-paper-deep"
                href={`${base}/export?format=${x}`}
                data-testid={`export-${x}`}
              >
                {x === "methods" ? "Methods text" : x.toUpperCase()}
              </a>
            ))}
          {d.canRerun && !isActive(d.status) && (
            <Button variant="secondary" size="sm" onClick={rerun} data-testid="rerun-fit">
              Re-run
            </Button>
          )}
          {d.canRerun && (
            <Link className={action} href={`/labs/${labId}/fits/new?from=${d.id}`} data-testid="change-fit">
              Change and re-run
            </Link>
          )}
          {canSimulate && d.status === "succeeded" && d.kind !== "comparison" && (
            <Link
              className={action}
              href={`/labs/${labId}/runs/new?fit=${d.id}&condition=${encodeURIComponent(d.conditions[0] ?? "")}`}
              data-testid="simulate-fit"
            >
              Verify by simulation
            </Link>
          )}
        </div>
      </div>
      {rerunError && <Notice tone="error">{rerunError}</Notice>}
      {isActive(d.status) && (
        <Panel title={d.status === "queued" ? "Waiting to start" : "Fitting"}>
          <div
            className="h-2 w-full max-w-md overflow-hidden rounded bg-paper-deep"
            role="progressbar"
            aria-valuenow={Math.round(progress * 100)}
            aria-valuemin={0}
            aria-valuemax={100}
          >
            <div className="h-full bg-iris transition-all" style={{ width: `${Math.round(progress * 100)}%` }} />
          </div>
          <p className="mt-2 text-sm text-ink-soft" data-testid="fit-progress">
            <span className="num">{Math.round(progress * 100)} %</span>
            {note ? ` · ${note}` : d.status === "queued" ? " · waiting for earlier jobs" : ""}
          </p>
          <p className="mt-1 text-xs text-ink-soft">
            Runs as a background job; you can leave this page. If it takes long you get an e-mail when it ends.
          </p>
        </Panel>
      )}
      {(d.status === "failed" || d.status === "cancelled") && (
        <Notice tone="error" testId="fit-failed">
          The fit {d.status === "failed" ? "failed" : "was cancelled"}: {d.error ?? "no reason was recorded"}. Nothing
          of it was kept; change the settings and start a new one{d.canRerun ? ", or re-run it" : ""}.
        </Notice>
      )}
      {r?.comparison && (
        <Panel title="Ranking by AICc">
          <table className="w-full text-sm" data-testid="ranking-table">
            <thead className="text-left text-xs font-medium text-ink-soft">
              <tr>
                <th className="py-1">#</th>
                <th>Kinetics</th>
                <th className="text-right">AICc</th>
                <th className="text-right">ΔAICc</th>
                <th className="text-right">Akaike weight</th>
                <th className="text-right">BIC</th>
                <th className="text-right">χ²</th>
                <th className="text-right">p</th>
                <th className="pl-3">Verdict</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {r.comparison.ranking.map((x) => (
                <tr key={x.label} className={`border-t border-rule/60 ${x.label === shown?.label ? "bg-paper" : ""}`}>
                  <td className="num py-1">{x.rank}</td>
                  <td className="font-medium">{x.label}</td>
                  <td className="num text-right">{f(x.aicc)}</td>
                  <td className="num text-right">{f(x.deltaAicc)}</td>
                  <td className="num text-right">{f(x.akaikeWeight, 3)}</td>
                  <td className="num text-right">{f(x.bic)}</td>
                  <td className="num text-right">{f(x.chiSquare)}</td>
                  <td className="num text-right">{x.p}</td>
                  <td className="pl-3">
                    <Badge tone={VERDICT_TONE[x.verdict] ?? "plain"}>{x.verdict}</Badge>
                    {!x.identifiable && (
                      <span className="ml-1">
                        <Badge tone="ochre">not identifiable</Badge>
                      </span>
                    )}
                  </td>
                  <td>
                    <button type="button" className="text-moss hover:underline" onClick={() => setSelected(x.label)}>
                      details
                    </button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {canSimulate && best && (
            <p className="mt-3 text-sm" data-testid="verify-best-row">
              <Link className={action} href={verifyBestHref(labId, d, best, d.conditions[0])} data-testid="verify-best">
                Verify the best by simulation
              </Link>{" "}
              <span className="text-xs text-ink-soft">
                {best} (ranked first) at its fitted parameters for “{d.conditions[0]}”
              </span>
              {d.conditions.slice(1).map((c) => (
                <span key={c} className="text-xs">
                  {" · "}
                  <Link className="text-moss hover:underline" href={verifyBestHref(labId, d, best, c)}>
                    for “{c}”
                  </Link>
                </span>
              ))}
            </p>
          )}
          {r.comparison.notes.map((n) => (
            <p key={n} className="mt-2 text-xs text-ink-soft">
              {n}
            </p>
          ))}
          <p className="mt-2 text-xs text-ink-soft">
            AICc = χ² + 2p + 2p(p + 1)/(n − p − 1); weights exp(−Δ/2)/Σ exp(−Δ/2) give the relative support of each
            kinetics within this set (Burnham &amp; Anderson 2002).
          </p>
        </Panel>
      )}
      {shown && <FitModelDetail key={shown.label} labId={labId} fit={d} model={shown} />}
      <FitProvenance labId={labId} fit={d} />
    </div>
  );
}
