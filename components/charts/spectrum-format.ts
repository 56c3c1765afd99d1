/** Number formatting for the readout plots and tables: significant figures, no exponent clutter. */
export function formatSig(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  // e-notation only beyond what a lab meets every day (as lib/format/measurement.ts).
  if (a >= 1e7 || a < 1e-4) return v.toExponential(Math.max(0, digits - 1));
  return Number(v.toPrecision(digits)).toString();
}
