/** Display words for readouts, shared by the readout, specimen and study pages. Pure functions. */
import { formatSig } from "@/components/charts/spectrum-format";
import { formatPixelSize, formatPlusMinus } from "@/lib/format/measurement";
import type { JobStatus } from "@/models/job";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";

export { formatSig };

const SOURCES: Record<string, string> = {
  "tiff-resolution": "TIFF resolution tags",
  "png-phys": "PNG pHYs chunk",
  "ome-xml": "OME-XML metadata",
  "jfif-density": "JPEG JFIF density",
  uploader: "typed by the uploader",
  "readout settings": "typed for this readout",
};

export function pixelSizeLabel(pixelSizeUm: number | null, source: string | null): string {
  if (pixelSizeUm === null) return "none (not needed for a table in µm, nm or mm)";
  return `${formatPixelSize(pixelSizeUm)} µm/px (${source ? (SOURCES[source] ?? source) : "source not recorded"})`;
}

export const STATUS_WORDS: Record<JobStatus, string> = {
  queued: "queued",
  running: "running",
  succeeded: "finished",
  failed: "failed",
  cancelled: "cancelled",
};

export const STATUS_TONE: Record<JobStatus, "plain" | "moss" | "ochre" | "brick"> = {
  queued: "plain",
  running: "ochre",
  succeeded: "moss",
  failed: "brick",
  cancelled: "plain",
};

/** "8.003 ± 0.012 µm" */
export function plusMinus(
  value: number | null | undefined,
  u: number | null | undefined,
  unit: string,
  digits = 4,
): string {
  if (value === null || value === undefined) return "—";
  return u === null || u === undefined ? `${formatSig(value, digits)} ${unit}` : formatPlusMinus(value, u, unit);
}

/** One line saying how a readout was made: ROI, channel, flattening, window; or the table mapping. */
export function settingsSummary(r: ReadoutDto): string {
  const s = r.settings;
  if (s.kind === "image") {
    const roi = s.roi
      ? s.roi.kind === "rect"
        ? `ROI ${s.roi.width}×${s.roi.height} px at (${s.roi.x}, ${s.roi.y})`
        : `polygon ROI, ${s.roi.points.length} vertices`
      : "whole image";
    // A stack's plane and time point, counted from 1, when other than the first (older readouts lack them).
    const plane = s.projection === "max-z" ? "max over z" : s.plane ? `plane ${s.plane + 1}` : null;
    const time = s.timePoint ? `time point ${s.timePoint + 1}` : null;
    return [
      roi,
      `channel ${s.channel}`,
      plane,
      time,
      s.invert ? "inverted" : null,
      `flatten ${s.flatten}`,
      `window ${s.window}`,
    ]
      .filter(Boolean)
      .join(" · ");
  }
  const c = s.columns;
  const cols = c
    ? Object.entries(c)
        .filter(([, v]) => v)
        .map(([k, v]) => `${k} = ${v}`)
        .join(", ")
    : "columns from the header";
  return `${cols}${s.unit ? ` · unit ${s.unit}` : ""}`;
}
