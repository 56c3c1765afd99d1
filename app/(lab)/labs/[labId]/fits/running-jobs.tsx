"use client";
/** The signed-in person's jobs in this lab that are queued or running, with progress (polled). */
import Link from "next/link";
import useSWR from "swr";
import { fetchJson } from "@/lib/client/api";
import type { JobDto } from "@/lib/server/jobs/queue";

const WORDS: Record<string, string> = {
  fit: "Fit",
  "fit-comparison": "Comparison of kinetics",
  readout: "Spacing readout",
};

function linkOf(labId: string, j: JobDto): string | null {
  if (j.kind === "fit" || j.kind === "fit-comparison") return `/labs/${labId}/fits`;
  if (j.kind === "readout") return `/labs/${labId}/readouts`;
  return null;
}

export function RunningJobs({ labId }: { labId: string }) {
  const { data } = useSWR<{ items: JobDto[] }>(`/api/v1/labs/${labId}/jobs?mine=1`, fetchJson, {
    refreshInterval: (d) => (d && d.items.some((j) => j.status === "queued" || j.status === "running") ? 1500 : 10_000),
  });
  const jobs = (data?.items ?? []).filter((j) => j.status === "queued" || j.status === "running");
  if (!data) return <p className="text-sm text-ink-soft">Loading…</p>;
  if (jobs.length === 0)
    return (
      <p className="text-sm text-ink-soft" data-testid="no-running-jobs">
        Nothing of yours is running. Readouts start when you upload; fits start from{" "}
        <Link className="text-moss hover:underline" href={`/labs/${labId}/fits`}>
          Fits
        </Link>
        .
      </p>
    );
  return (
    <ul className="space-y-2" data-testid="running-jobs">
      {jobs.map((j) => {
        const href = linkOf(labId, j);
        const label = WORDS[j.kind] ?? j.kind;
        return (
          <li key={j.id} className="text-sm">
            <div className="flex justify-between gap-2">
              {href ? (
                <Link className="text-moss hover:underline" href={href}>
                  {label}
                </Link>
              ) : (
                <span>{label}</span>
              )}
              <span className="num text-xs text-ink-soft">{Math.round(j.progress * 100)} %</span>
            </div>
            <div className="mt-1 h-1.5 w-full overflow-hidden rounded bg-paper-deep">
              <div className="h-full bg-iris transition-all" style={{ width: `${Math.round(j.progress * 100)}%` }} />
            </div>
            <p className="text-xs text-ink-soft">
              {j.status === "queued" ? "waiting for earlier jobs" : (j.progressNote ?? "running")}
            </p>
          </li>
        );
      })}
    </ul>
  );
}
