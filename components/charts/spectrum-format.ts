/** Number formatting for the readout plots and tables: significant figures, no exponent clutter. */
export function formatSig(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e5 || a < 1e-3) return v.toExponential(Math.max(0, digits - 1));
  return Number(v.toPrecision(digits)).toString();
}
