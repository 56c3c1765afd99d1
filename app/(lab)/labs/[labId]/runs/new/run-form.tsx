"use client";
/** The run form: kinetics and parameters (prefilled from a kinetics page), grid, time, seed, snapshots, an optional gradient. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ApiError, sendJson } from "@/lib/client/api";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { RunDetailDto } from "@/lib/server/runs/types";
import type { RunStartOption } from "@/lib/server/runs/start";
import { RunDomainPanel } from "./run-domain-panel";
import { RunInitialPanel } from "./run-initial-panel";
import { RunKineticsPanel } from "./run-kinetics-panel";
import { buildRunBody } from "./run-request-body";
import { useRunDraft, type RunPrefill } from "./use-run-draft";

export type { RunPrefill } from "./use-run-draft";

export function RunForm({
  labId,
  kinetics,
  prefill,
  limits,
  earlierRuns,
}: {
  labId: string;
  kinetics: KineticsInfoDto[];
  prefill: RunPrefill;
  limits: string[];
  earlierRuns: RunStartOption[];
}) {
  const router = useRouter();
  const d = useRunDraft(kinetics, prefill, earlierRuns);
  const { info } = d;
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!info) return;
    setBusy(true);
    setError(null);
    const body = buildRunBody(d, info, prefill);
    try {
      const run = await sendJson<RunDetailDto>("POST", `/api/v1/labs/${labId}/runs`, body);
      router.push(`/labs/${labId}/runs/${run.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : String(err));
      setBusy(false);
    }
  }

  if (kinetics.length === 0) return <Notice>No kinetics to simulate. Open Kinetics and add one.</Notice>;
  return (
    <form onSubmit={submit} className="space-y-5" data-testid="run-form">
      <div className="grid gap-5 lg:grid-cols-3">
        <RunKineticsPanel d={d} kinetics={kinetics} prefill={prefill} />
        <RunDomainPanel d={d} />
        <RunInitialPanel d={d} earlierRuns={earlierRuns} />
      </div>
      {error && (
        <Notice tone="error" testId="run-error">
          {error}
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={busy} data-testid="start-run">
          {busy ? "Checking…" : "Start run"}
        </Button>
        <ul className="text-xs text-ink-soft">
          {limits.map((l) => (
            <li key={l}>Limit: {l}.</li>
          ))}
        </ul>
      </div>
    </form>
  );
}
