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
  const union = new Uint8Array(data.length);
  for (let i = 0; i < union.length; i++) union[i] = (saturated?.[i] ?? 0) | (found?.mask[i] ?? 0);
  const treated = growByOne(union, width, height);
  const darkGrown = found?.dark ? growByOne(found.dark, width, height) : null;
  let nSat = 0,
    nBright = 0,
    nDark = 0;
  for (let i = 0; i < treated.length; i++) {
    if (included && !included[i]) treated[i] = 0;
    if (saturated?.[i]) nSat++;
    else if (treated[i] && darkGrown?.[i]) nDark++;
    else if (treated[i]) nBright++;
  }
  const background = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++) background[i] = data[i] - residual[i];
  inpaintTreated(data, width, height, treated, background);
  for (let i = 0; i < data.length; i++) if (treated[i]) residual[i] = data[i] - background[i];
  return { changed: true, saturated: nSat, bright: nBright, dark: nDark };
}
