/**
 * A measured value with its uncertainty, printed the way a paper prints it: the uncertainty to two
 * significant digits and the value to the same decimal place (GUM, JCGM 100:2008 §7.2.6: "not with an
 * excessive number of digits … at most two significant digits" for the uncertainty), e.g.
 * 15.403 ± 0.012. No e-notation for magnitudes a lab meets every day (10⁻⁴ … 10⁷).
 */
export function formatMeasurement(value: number, uncertainty: number): { value: string; uncertainty: string } {
  if (!Number.isFinite(value)) return { value: "—", uncertainty: "—" };
  if (!(Number.isFinite(uncertainty) && uncertainty > 0))
    return { value: formatPlain(value, 4), uncertainty: uncertainty === 0 ? "0" : "—" };
  // The decimal place of the uncertainty's second significant digit.
  const place = Math.floor(Math.log10(uncertainty)) - 1;
  const decimals = Math.max(0, -place);
  const step = 10 ** place;
  const roundTo = (v: number) => (place >= 0 ? (Math.round(v / step) * step).toFixed(0) : v.toFixed(decimals));
  const u = roundTo(uncertainty);
  // Rounding may carry the uncertainty to a third digit (0.0996 → 0.100): keep what it shows.
  return { value: roundTo(value), uncertainty: u };
}

/** "15.403 ± 0.012 µm" (or the value alone to 4 significant digits when there is no uncertainty). */
export function formatPlusMinus(value: number, uncertainty: number | null | undefined, unit: string): string {
  const suffix = unit ? ` ${unit}` : "";
  if (uncertainty === null || uncertainty === undefined) return `${formatPlain(value, 4)}${suffix}`;
  const m = formatMeasurement(value, uncertainty);
  return `${m.value} ± ${m.uncertainty}${suffix}`;
}

/** Significant digits without e-notation between 10⁻⁴ and 10⁷. */
export function formatPlain(v: number, digits = 4): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e7 || a < 1e-4) return v.toExponential(Math.max(0, digits - 1));
  const decimals = Math.max(0, digits - 1 - Math.floor(Math.log10(a)));
  return a >= 10 ** digits
    ? Math.round(v).toString()
    : v
        .toFixed(decimals)
        .replace(/(\.\d*?)0+$/, "$1")
        .replace(/\.$/, "");
}

/**
 * A pixel size as its metadata holds it: up to 6 significant digits, so the float noise of a unit
 * conversion (0.65000000000001 from px/cm) disappears and no digit the file states is dropped.
 */
export function formatPixelSize(um: number): string {
  return formatPlain(um, 6);
}
