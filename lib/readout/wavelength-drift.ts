/**
 * Does the local wavelength change across the field? A least-squares plane λ(x, y) = c + gx·x + gy·y
 * through the sub-region wavelengths at their centres; the change across the field is the plane's
 * rise over the region along its gradient. It is flagged when it is both larger than 5 % of λ (common
 * practice, no source) and larger than 3 standard errors of that rise (so scatter is not called a trend).
 */
export interface WavelengthDrift {
  /** Plane's λ at the two ends of the region along its gradient (px of the analysed grid). */
  fromPx: number;
  toPx: number;
  /** True when the change is beyond both thresholds. */
  flagged: boolean;
}

export function measureWavelengthDrift(
  samples: Array<{ xPx: number; yPx: number; wavelengthPx: number }>,
  width: number,
  height: number,
): WavelengthDrift | null {
  const n = samples.length;
  if (n < 4) return null;
  const mx = samples.reduce((s, p) => s + p.xPx, 0) / n;
  const my = samples.reduce((s, p) => s + p.yPx, 0) / n;
  const ml = samples.reduce((s, p) => s + p.wavelengthPx, 0) / n;
  let sxx = 0,
    syy = 0,
    sxy = 0,
    sxl = 0,
    syl = 0;
  for (const p of samples) {
    const dx = p.xPx - mx,
      dy = p.yPx - my,
      dl = p.wavelengthPx - ml;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
    sxl += dx * dl;
    syl += dy * dl;
  }
  const det = sxx * syy - sxy * sxy;
  if (!(det > 0)) return null;
  const gx = (syy * sxl - sxy * syl) / det;
  const gy = (sxx * syl - sxy * sxl) / det;
  let rss = 0;
  for (const p of samples) rss += (p.wavelengthPx - (ml + gx * (p.xPx - mx) + gy * (p.yPx - my))) ** 2;
  const s2 = n > 3 ? rss / (n - 3) : 0;
  const g = Math.hypot(gx, gy);
  if (!(g > 0)) return { fromPx: ml, toPx: ml, flagged: false };
  // Extent of the region along the gradient's direction, and the SE of the slope along it.
  const ux = gx / g,
    uy = gy / g;
  const extent = Math.abs(ux) * width + Math.abs(uy) * height;
  const varSlope = (s2 * (ux * ux * syy - 2 * ux * uy * sxy + uy * uy * sxx)) / det;
  const rise = g * extent;
  const seRise = Math.sqrt(Math.max(0, varSlope)) * extent;
  return {
    fromPx: ml - rise / 2,
    toPx: ml + rise / 2,
    flagged: rise > 0.05 * ml && rise > 3 * seRise,
  };
}
