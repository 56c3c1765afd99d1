import { findOutliers, growByOne, inpaintTreated } from "./outliers";

/**
 * Finds outliers (bright and dark) on the flattened `residual`, grows them and the `saturated`
 * pixels by one pixel (their blurred rim), and replaces them in `data` by their surroundings;
 * `residual` gets the same treatment (so the tissue search sees no debris). Counts are of the
 * analysed grid; a rim pixel counts with the kind it was grown from (dark before bright).
 */
export function treatOutliers(
  data: Float32Array,
  residual: Float32Array,
  width: number,
  height: number,
  included: Uint8Array | null,
  saturated: Uint8Array | null,
): { changed: boolean; saturated: number; bright: number; dark: number } {
  const found = findOutliers(residual, included, saturated);
  if (!found && !saturated) return { changed: false, saturated: 0, bright: 0, dark: 0 };
  const n = data.length;
  const union = saturated ? saturated.slice() : new Uint8Array(n);
  if (found) {
    const mask = found.mask;
    for (let i = 0; i < n; i++) union[i] |= mask[i];
  }
  const treated = growByOne(union, width, height);
  const darkGrown = found?.dark ? growByOne(found.dark, width, height) : null;
  let nSat = 0,
    nBright = 0,
    nDark = 0;
  // A saturated pixel is always in `treated` (grown from the union): skipping untreated ones skips no count.
  for (let i = 0; i < n; i++) {
    if (treated[i] === 0) continue;
    const sat = saturated !== null && saturated[i] !== 0;
    if (sat) nSat++;
    if (included !== null && included[i] === 0) treated[i] = 0;
    else if (!sat) {
      if (darkGrown !== null && darkGrown[i] !== 0) nDark++;
      else nBright++;
    }
  }
  inpaintTreated(data, width, height, treated, residual);
  return { changed: true, saturated: nSat, bright: nBright, dark: nDark };
}
