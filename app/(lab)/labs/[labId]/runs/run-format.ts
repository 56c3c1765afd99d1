/** Formatting shared by the run pages. */
import { formatSig } from "@/components/charts/spectrum-format";
import { formatPlusMinus } from "@/lib/format/measurement";

export const STOP_WORDS: Record<string, string> = {
  "end-time": "reached the end time",
  stationary: "stationary",
  cancelled: "cancelled",
  "blow-up": "blow-up",
};

/** "12.3 ± 0.4 µm", or "—". */
export function withUnit(v: number | null | undefined, unit: string, u?: number | null, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  return u !== null && u !== undefined ? formatPlusMinus(v, u, unit) : `${formatSig(v, digits)} ${unit}`;
}
