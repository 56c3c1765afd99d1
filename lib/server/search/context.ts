/** The short line under a search hit: a few facts joined, in the words the lab's pages use. */
import "server-only";
import type { JobStatus } from "@/models/job";
import { formatPlusMinus } from "@/lib/format/measurement";

/** The same status words as the fit and readout lists. */
const STATUS_WORDS: Record<JobStatus, string> = {
  queued: "queued",
  running: "running",
  succeeded: "finished",
  failed: "failed",
  cancelled: "cancelled",
};

export function statusWord(status: string): string {
  return STATUS_WORDS[status as JobStatus] ?? status;
}

/** Facts joined by " · ", empty ones left out. */
export function joinContext(parts: (string | null | undefined | false)[]): string {
  return parts.filter((p): p is string => typeof p === "string" && p.trim() !== "").join(" · ");
}

/** "λ 41.2 ± 0.8 µm", or null when there is no wavelength. */
export function wavelengthText(wavelengthUm: number | null, uncertaintyUm: number | null): string | null {
  return wavelengthUm === null || !Number.isFinite(wavelengthUm)
    ? null
    : `λ ${formatPlusMinus(wavelengthUm, uncertaintyUm, "µm")}`;
}

const SNIPPET_CHARS = 120;

/** The part of a comment around the first match, on one line, with "…" where it was cut. */
export function snippetAround(text: string, q: string): string {
  const flat = text.replace(/\s+/g, " ").trim();
  if (flat.length <= SNIPPET_CHARS) return flat;
  const at = Math.max(0, flat.toLowerCase().indexOf(q.toLowerCase()));
  const start = Math.max(0, Math.min(at - 40, flat.length - SNIPPET_CHARS));
  const piece = flat.slice(start, start + SNIPPET_CHARS);
  return `${start > 0 ? "…" : ""}${piece}${start + SNIPPET_CHARS < flat.length ? "…" : ""}`;
}
