/** A two-class split of a sample by Otsu's method. */
export interface OtsuSplit {
  threshold: number;
  /** Means of the classes below and above the threshold. */
  lowMean: number;
  highMean: number;
  /** Between-class variance ÷ total variance (Otsu's separability η, 0..1). */
  separability: number;
}

/**
 * Otsu's threshold (Otsu 1979, IEEE Trans. Syst. Man Cybern. 9:62): the cut of a 256-bin
 * histogram that maximises the between-class variance. Values where `use` is 0 are ignored.
 */
export function otsuSplit(values: Float32Array, use: Uint8Array | null): OtsuSplit | null {
  let lo = Infinity,
    hi = -Infinity,
    n = 0;
  for (let i = 0; i < values.length; i++) {
    if (use && !use[i]) continue;
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
    n++;
  }
  if (n < 2 || !(hi > lo)) return null;
  const bins = 256;
  const hist = new Float64Array(bins);
  const width = (hi - lo) / bins;
  let total = 0,
    totalSq = 0;
  for (let i = 0; i < values.length; i++) {
    if (use && !use[i]) continue;
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    hist[Math.min(bins - 1, Math.floor((v - lo) / width))]++;
    total += v;
    totalSq += v * v;
  }
  const centre = (b: number) => lo + (b + 0.5) * width;
  let w0 = 0,
    s0 = 0,
    best = -1,
    bestK = 0;
  for (let k = 0; k < bins - 1; k++) {
    w0 += hist[k];
    s0 += hist[k] * centre(k);
    const w1 = n - w0;
    if (w0 === 0 || w1 === 0) continue;
    const m0 = s0 / w0,
      m1 = (total - s0) / w1;
    const between = (w0 * w1 * (m0 - m1) ** 2) / (n * n);
    if (between > best) {
      best = between;
      bestK = k;
    }
  }
  const threshold = lo + (bestK + 1) * width;
  let a = 0,
    na = 0,
    b = 0,
    nb = 0;
  for (let i = 0; i < values.length; i++) {
    if (use && !use[i]) continue;
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    if (v < threshold) {
      a += v;
      na++;
    } else {
      b += v;
      nb++;
    }
  }
  const variance = totalSq / n - (total / n) ** 2;
  return {
    threshold,
    lowMean: na ? a / na : lo,
    highMean: nb ? b / nb : hi,
    separability: variance > 0 ? Math.max(0, best) / variance : 0,
  };
}
