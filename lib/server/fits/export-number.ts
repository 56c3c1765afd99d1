/** Numbers in exports: 4 significant figures, exponents for very small or large values. */
import "server-only";

export function formatFitNumber(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return "—";
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a >= 1e5 || a < 1e-3) return x.toExponential(digits - 1).replace("e+", "e");
  return Number(x.toPrecision(digits)).toString();
}
