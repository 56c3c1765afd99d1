/**
 * The convex hull (Andrew's monotone chain, Andrew 1979, Inf. Process. Lett. 9:216) of a mask's
 * row ends, in source pixels: a polygon that the ROI editor can show and the user can correct.
 * At most ~64 vertices (rows are sampled).
 */
export function outlineMask(
  mask: Uint8Array,
  grid: { width: number; height: number; binFactor: number; x0: number; y0: number },
): Array<[number, number]> {
  const { width, height, binFactor: f, x0, y0 } = grid;
  const pts: Array<[number, number]> = [];
  for (let y = 0; y < height; y++) {
    let lo = -1,
      hi = -1;
    for (let x = 0; x < width; x++)
      if (mask[y * width + x]) {
        if (lo < 0) lo = x;
        hi = x;
      }
    if (lo >= 0) pts.push([lo, y], [hi + 1, y], [lo, y + 1], [hi + 1, y + 1]);
  }
  pts.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const cross = (o: number[], a: number[], b: number[]) =>
    (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const half = (list: Array<[number, number]>) => {
    const h: Array<[number, number]> = [];
    for (const p of list) {
      while (h.length >= 2 && cross(h[h.length - 2], h[h.length - 1], p) <= 0) h.pop();
      h.push(p);
    }
    h.pop();
    return h;
  };
  let hull = [...half(pts), ...half([...pts].reverse())];
  if (hull.length > 64) {
    const step = hull.length / 64;
    hull = Array.from({ length: 64 }, (_, k) => hull[Math.floor(k * step)]);
  }
  return hull.map(([x, y]) => [x0 + x * f, y0 + y * f]);
}
