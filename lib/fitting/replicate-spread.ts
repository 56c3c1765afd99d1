/**
 * Specimen-to-specimen spread as part of each datum's uncertainty. A readout's own uncertainty
 * says how well one image pins its wavelength; replicate specimens of one condition also differ
 * biologically. Adding the condition's sample SD in quadrature, u'ᵢ = √(uᵢ² + s²), weights every
 * datum by both (independent errors add in variance: common practice, no source).
 */
import type { WavelengthDatum } from "./wavelength-spec";

export interface ConditionSpread {
  condition: string;
  kind: WavelengthDatum["kind"];
  /** Data of this condition and kind. */
  n: number;
  /** Sample SD (n − 1) of their wavelengths, µm; 0 when n < 2 (nothing to estimate it from). */
  sdUm: number;
}

export function addReplicateSpread<D>(data: readonly WavelengthDatum<D>[]): {
  data: WavelengthDatum<D>[];
  spreads: ConditionSpread[];
} {
  const groups = new Map<string, number[]>();
  const key = (d: WavelengthDatum<D>) => `${d.kind}\u0000${d.condition}`;
  data.forEach((d, i) => groups.set(key(d), [...(groups.get(key(d)) ?? []), i]));
  const sd = new Map<string, number>();
  const spreads: ConditionSpread[] = [];
  for (const [k, idx] of groups) {
    const values = idx.map((i) => data[i].wavelengthUm);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const s = values.length < 2 ? 0 : Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
    sd.set(k, s);
    spreads.push({ condition: data[idx[0]].condition, kind: data[idx[0]].kind, n: values.length, sdUm: s });
  }
  return {
    data: data.map((d) => ({ ...d, uncertaintyUm: Math.hypot(d.uncertaintyUm, sd.get(key(d)) ?? 0) })),
    spreads,
  };
}
