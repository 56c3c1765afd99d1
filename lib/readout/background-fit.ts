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

export function fitPowerLaw(freq: Float64Array, power: Float64Array, from: number, to: number, excludeFrom: number, excludeTo: number): PowerLaw {
  const use = new Uint8Array(power.length);
  for (let r = from; r <= to; r++) if ((r < excludeFrom || r > excludeTo) && power[r] > 0 && freq[r] > 0) use[r] = 1;
  let fit: PowerLaw = { logA: 0, beta: 0 };
  for (let pass = 0; pass < 3; pass++) {
    let n = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
    for (let r = from; r <= to; r++) {
      if (!use[r]) continue;
      const x = Math.log(freq[r]), y = Math.log(power[r]);
      n++; sx += x; sy += y; sxx += x * x; sxy += x * y;
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
