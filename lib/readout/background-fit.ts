/**
 * Smooth background of a radial spectrum: a power law P = A·f^β fitted by least squares in
 * log–log over rings [from, to], leaving out [excludeFrom, excludeTo] (the peak) and, after a
 * first pass, rings more than a factor 10 above the fit (harmonics, second-order lattice peaks).
 * Common practice for spectral backgrounds, no single source.
 */
export interface PowerLaw {
  logA: number;
  beta: number;
}

export function evaluatePowerLaw(p: PowerLaw, f: number): number {
  return Math.exp(p.logA + p.beta * Math.log(f));
}

export function fitPowerLaw(
  freq: Float64Array,
  power: Float64Array,
  from: number,
  to: number,
  excludeFrom: number,
  excludeTo: number,
): PowerLaw {
  const use = new Uint8Array(power.length);
  for (let r = from; r <= to; r++) if ((r < excludeFrom || r > excludeTo) && power[r] > 0 && freq[r] > 0) use[r] = 1;
  let fit: PowerLaw = { logA: 0, beta: 0 };
  for (let pass = 0; pass < 3; pass++) {
    let n = 0,
      sx = 0,
      sy = 0,
      sxx = 0,
      sxy = 0;
    for (let r = from; r <= to; r++) {
      if (!use[r]) continue;
      const x = Math.log(freq[r]),
        y = Math.log(power[r]);
      n++;
      sx += x;
      sy += y;
      sxx += x * x;
      sxy += x * y;
    }
    if (n === 0) return fit;
    const d = n * sxx - sx * sx;
    const beta = n >= 3 && d > 1e-12 ? (n * sxy - sx * sy) / d : 0;
    fit = { logA: (sy - beta * sx) / n, beta };
    let dropped = 0;
    for (let r = from; r <= to; r++) {
      if (use[r] && Math.log(power[r]) - (fit.logA + fit.beta * Math.log(freq[r])) > Math.log(10) && n - dropped > 4) {
        use[r] = 0;
        dropped++;
      }
    }
    if (dropped === 0) break;
  }
  return fit;
}

/** ln f and ln P of a radial spectrum's rings, NaN where either is not positive (unusable in a log fit). */
export interface RingLogs {
  lnFreq: Float64Array;
  lnPower: Float64Array;
}

/** The logarithms localLogQuadraticAt takes, each computed once for all its calls on one spectrum. */
export function ringLogs(freq: Float64Array, power: Float64Array): RingLogs {
  const lnFreq = new Float64Array(freq.length),
    lnPower = new Float64Array(freq.length);
  for (let k = 0; k < freq.length; k++) {
    const usable = power[k] > 0 && freq[k] > 0;
    lnFreq[k] = freq[k] > 0 ? Math.log(freq[k]) : NaN;
    lnPower[k] = usable ? Math.log(power[k]) : NaN;
  }
  return { lnFreq, lnPower };
}

/**
 * log P = c₀ + c₁ ln f + c₂ (ln f)² fitted by least squares over rings [from, to] without
 * [excludeFrom, excludeTo]: a local background that also follows a bent spectrum (a blur's
 * roll-off, a residual illumination), where one power law would leave the middle above its chord.
 * Returns the background at ring r's frequency, or NaN with fewer than 4 usable rings. The
 * rings' logarithms (ringLogs) are taken once per spectrum, not once per call.
 */
export function localLogQuadraticAt(
  { lnFreq, lnPower }: RingLogs,
  from: number,
  to: number,
  excludeFrom: number,
  excludeTo: number,
  r: number,
): number {
  const x0 = lnFreq[r];
  // Normal equations of the centred fit (x = ln f − ln f_r), so the value at r is c₀.
  let n = 0,
    s1 = 0,
    s2 = 0,
    s3 = 0,
    s4 = 0,
    t0 = 0,
    t1 = 0,
    t2 = 0;
  for (let k = from; k <= to; k++) {
    const y = lnPower[k];
    if ((k >= excludeFrom && k <= excludeTo) || Number.isNaN(y)) continue;
    const x = lnFreq[k] - x0,
      x2 = x * x;
    n++;
    s1 += x;
    s2 += x2;
    s3 += x2 * x;
    s4 += x2 * x2;
    t0 += y;
    t1 += x * y;
    t2 += x2 * y;
  }
  if (n < 4) return NaN;
  // Solve [[n, s1, s2], [s1, s2, s3], [s2, s3, s4]] c = [t0, t1, t2] for c₀ by Cramer's rule.
  const det = n * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * s2) + s2 * (s1 * s3 - s2 * s2);
  if (!(Math.abs(det) > 1e-12)) return NaN;
  const c0 = (t0 * (s2 * s4 - s3 * s3) - s1 * (t1 * s4 - s3 * t2) + s2 * (t1 * s3 - s2 * t2)) / det;
  return Math.exp(c0);
}
