"use client";
/**
 * The one way a page follows the lab's jobs while they run: polls `GET /api/v1/labs/<lab>/jobs`
 * while a job of the given kinds is queued or running, every FIRST_POLL_MS at first and, while
 * nothing changes, less and less often (×1.5 up to MAX_POLL_MS); while none is, only every
 * MAX_POLL_MS (a job started in another tab must still show), and not at all in a hidden tab. A change of a job's status or progress bumps
 * `version` (give it to `DataTable`'s `refreshKey`, so lists show the new status without a
 * reload); a job that started or ended also refreshes the server component (`router.refresh()`).
 */
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import type { JobDto } from "@/lib/server/jobs/queue";
import { fetchJson } from "./api";

export const FIRST_POLL_MS = 1000;
export const MAX_POLL_MS = 10_000;

const isActive = (j: JobDto) => j.status === "queued" || j.status === "running";

export function useLiveJobs(labId: string, kinds: readonly string[]): { version: number; active: number } {
  const router = useRouter();
  const [version, setVersion] = useState(0);
  const [active, setActive] = useState(0);
  const kindsKey = kinds.join(",");
  useEffect(() => {
    const wanted = new Set(kindsKey.split(","));
    let timer: ReturnType<typeof setTimeout> | null = null;
    let stopped = false;
    let polling = false;
    let delayMs = FIRST_POLL_MS;
    let statuses: string | null = null;
    let progress: string | null = null;
    const schedule = () => {
      timer = setTimeout(() => void tick(), delayMs);
    };
    const tick = async () => {
      timer = null;
      polling = true;
      try {
        const { items } = await fetchJson<{ items: JobDto[] }>(`/api/v1/labs/${labId}/jobs`);
        if (stopped) return;
        const ours = items.filter((j) => wanted.has(j.kind));
        const nowStatuses = ours.map((j) => `${j.id}:${j.status}`).join(",");
        const nowProgress = ours.map((j) => `${j.id}:${Math.round(j.progress * 100)}`).join(",");
        const running = ours.filter(isActive).length;
        setActive(running);
        // The first answer only sets the baseline: the page was rendered from the same rows.
        const statusChanged = statuses !== null && nowStatuses !== statuses;
        const changed = statusChanged || (progress !== null && nowProgress !== progress);
        statuses = nowStatuses;
        progress = nowProgress;
        if (changed) setVersion((v) => v + 1);
        if (statusChanged) router.refresh();
        delayMs = changed ? FIRST_POLL_MS : Math.min(MAX_POLL_MS, delayMs * 1.5);
        // Nothing running: keep looking, but only every MAX_POLL_MS, for a job started in another tab or by a colleague.
        if (running === 0) delayMs = MAX_POLL_MS;
      } catch {
        // A failed poll (server restarting, offline) tries again later rather than giving up.
        delayMs = Math.min(MAX_POLL_MS, delayMs * 2);
      }
      polling = document.visibilityState === "visible";
      if (polling && !stopped) schedule();
    };
    const resume = () => {
      if (document.visibilityState !== "visible" || polling || timer || stopped) return;
      delayMs = FIRST_POLL_MS;
      void tick();
    };
    void tick();
    document.addEventListener("visibilitychange", resume);
    window.addEventListener("focus", resume);
    return () => {
      stopped = true;
      if (timer) clearTimeout(timer);
      document.removeEventListener("visibilitychange", resume);
      window.removeEventListener("focus", resume);
    };
  }, [labId, kindsKey, router]);
  return { version, active };
}
