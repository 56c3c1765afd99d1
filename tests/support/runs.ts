/** What the verification-run API tests share: calling the run routes as a member, waiting for a run. */
import type { RunDetailDto } from "@/lib/server/runs/types";
import { waitForJob } from "@/lib/server/jobs/queue";
import { setupLabApi } from "./lab-api";

export const RUNS = "/api/v1/labs/[labId]/runs";
export const ONE = `${RUNS}/[runId]`;

export function setupRunsLab() {
  const lab = setupLabApi({ who: "modeller" });
  async function api(
    method: "GET" | "POST",
    path: string,
    o: { json?: unknown; runId?: string; name?: string; who?: "modeller" | "scientist" } = {},
  ) {
    const res = await lab.raw(method, path, {
      who: o.who ?? "modeller",
      params: { runId: o.runId ?? "", name: o.name ?? "" },
      json: o.json,
    });
    const type = res.headers.get("content-type") ?? "";
    return {
      status: res.status,
      body: type.includes("json") ? await res.json() : null,
      bytes: type.includes("json") ? null : new Uint8Array(await res.arrayBuffer()),
      type,
    };
  }
  async function finished(runId: string): Promise<RunDetailDto> {
    const start = await api("GET", ONE, { runId });
    await waitForJob(start.body.jobId, 90_000);
    return (await api("GET", ONE, { runId })).body as RunDetailDto;
  }
  return { lab, api, finished, RUNS, ONE };
}
