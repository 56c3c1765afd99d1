/** Shared words and tones of fit pages. */
import type { JobStatus } from "@/models/job";

export const FIT_STATUS_WORDS: Record<JobStatus, string> = {
  queued: "queued",
  running: "fitting",
  succeeded: "finished",
  failed: "failed",
  cancelled: "cancelled",
};
export const FIT_STATUS_TONE: Record<JobStatus, "plain" | "moss" | "iris" | "ochre" | "brick"> = {
  queued: "plain",
  running: "iris",
  succeeded: "moss",
  failed: "brick",
  cancelled: "ochre",
};
export const VERDICT_TONE: Record<string, "moss" | "ochre" | "brick"> = {
  fits: "moss",
  "fits only outside the Turing region": "ochre",
  "cannot reach the measured wavelength": "brick",
};
export const isActive = (s: JobStatus) => s === "queued" || s === "running";
