/**
 * What the web processes of one server tell each other through the cluster's primary
 * (lib/cli/web-processes.ts): a job was queued, or a running job should stop. Plain data, so the
 * launcher and the job bus share the one definition.
 */
import "server-only";

export type SiblingMessage = { morphokin: "job-queued" } | { morphokin: "job-cancel"; jobId: string };

export function isSiblingMessage(m: unknown): m is SiblingMessage {
  if (typeof m !== "object" || m === null) return false;
  const kind = (m as { morphokin?: unknown }).morphokin;
  return kind === "job-queued" || (kind === "job-cancel" && typeof (m as { jobId?: unknown }).jobId === "string");
}
