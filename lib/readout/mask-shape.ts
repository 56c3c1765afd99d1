/** Keeps the largest 8-connected component of a mask (in place); returns its size. */
export function keepLargestComponent(mask: Uint8Array, width: number, height: number): number {
  const label = new Int32Array(mask.length);
  const stack: number[] = [];
  let best = 0,
    bestLabel = 0,
    next = 0;
  for (let s = 0; s < mask.length; s++) {
    if (!mask[s] || label[s]) continue;
    next++;
    let size = 0;
    label[s] = next;
    stack.push(s);
    while (stack.length) {
      const i = stack.pop()!;
      size++;
      const x = i % width,
        y = (i - x) / width;
      for (let dy = -1; dy <= 1; dy++)
        for (let dx = -1; dx <= 1; dx++) {
          const xx = x + dx,
            yy = y + dy;
          if (xx < 0 || yy < 0 || xx >= width || yy >= height) continue;
          const j = yy * width + xx;
          if (mask[j] && !label[j]) {
            label[j] = next;
            stack.push(j);
          }
        }
    }
    if (size > best) {
      best = size;
      bestLabel = next;
    }
  }
  for (let i = 0; i < mask.length; i++) mask[i] = label[i] === bestLabel && bestLabel > 0 ? 1 : 0;
  return best;
}

/** Fills holes (in place): every 0 not 4-connected to the border becomes 1. */
export function fillHoles(mask: Uint8Array, width: number, height: number): void {
  const outside = new Uint8Array(mask.length);
  const stack: number[] = [];
  const seed = (i: number) => {
    if (!mask[i] && !outside[i]) {
      outside[i] = 1;
      stack.push(i);
    }
  };
  for (let x = 0; x < width; x++) {
    seed(x);
    seed((height - 1) * width + x);
  }
  for (let y = 0; y < height; y++) {
    seed(y * width);
    seed(y * width + width - 1);
  }
  while (stack.length) {
    const i = stack.pop()!;
    const x = i % width;
    if (x > 0) seed(i - 1);
    if (x + 1 < width) seed(i + 1);
    if (i >= width) seed(i - width);
    if (i + width < mask.length) seed(i + width);
  }
  for (let i = 0; i < mask.length; i++) if (!outside[i]) mask[i] = 1;
}

/**
 * Chamfer distance (3-4 weights ÷ 3, in px) from each pixel to the nearest pixel outside the mask
 * (Borgefors 1986, CVGIP 34:344), and to the grid's edge too when `edgeIsOutside`. 0 outside the mask.
 */
export function distanceInside(mask: Uint8Array, width: number, height: number, edgeIsOutside = true): Float32Array {
  const big = 1e9;
  const e = edgeIsOutside ? 0 : big;
  const d = new Float32Array(mask.length);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (!mask[i]) continue;
      let v = big;
      v = Math.min(v, x > 0 ? d[i - 1] + 3 : e + 3, y > 0 ? d[i - width] + 3 : e + 3);
      v = Math.min(
        v,
        x > 0 && y > 0 ? d[i - width - 1] + 4 : e + 4,
        x + 1 < width && y > 0 ? d[i - width + 1] + 4 : e + 4,
      );
      d[i] = v;
    }
  for (let y = height - 1; y >= 0; y--)
    for (let x = width - 1; x >= 0; x--) {
      const i = y * width + x;
      if (!mask[i]) continue;
      let v = d[i];
      v = Math.min(v, x + 1 < width ? d[i + 1] + 3 : e + 3, y + 1 < height ? d[i + width] + 3 : e + 3);
      v = Math.min(
        v,
        x + 1 < width && y + 1 < height ? d[i + width + 1] + 4 : e + 4,
        x > 0 && y + 1 < height ? d[i + width - 1] + 4 : e + 4,
      );
      d[i] = v;
    }
  for (let i = 0; i < d.length; i++) d[i] /= 3;
  return d;
}
