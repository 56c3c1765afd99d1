import { distanceInside } from "./mask-shape";

/**
 * Window for an irregular region: w = sin²(π/2 · min(1, d/D)), d the distance to the region's
 * edge (or the grid's), D half the largest such distance. It falls smoothly to 0 at every edge of
 * the mask, as a Hann window does at the edges of a rectangle (Harris 1978, Proc. IEEE 66:51), so
 * the tissue boundary does not leak into the spectrum. The weighted mean is removed first, so
 * the windowed region has no zero-frequency power to spill into low rings. Outside: 0.
 */
export function applyMaskTaper(data: Float32Array, width: number, height: number, mask: Uint8Array): void {
  const d = distanceInside(mask, width, height);
  let dMax = 0;
  for (const v of d) if (v > dMax) dMax = v;
  const taperPx = Math.max(1, dMax / 2);
  const w = new Float32Array(d.length);
  let sw = 0,
    swx = 0;
  for (let i = 0; i < d.length; i++) {
    if (!mask[i]) continue;
    const s = Math.sin((Math.PI / 2) * Math.min(1, d[i] / taperPx));
    w[i] = s * s;
    sw += w[i];
    swx += w[i] * data[i];
  }
  const mean = sw > 0 ? swx / sw : 0;
  for (let i = 0; i < data.length; i++) data[i] = mask[i] ? (data[i] - mean) * w[i] : 0;
}
