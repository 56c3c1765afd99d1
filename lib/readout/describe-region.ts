import type { PreparedRegion } from "./prepare-region";

const count = (n: number, one: string, many: string) => `${n.toLocaleString("en-GB")} ${n === 1 ? one : many}`;

/** Plain-language notes on what was analysed: the tissue region and the pixels treated as outliers. */
export function describeRegion(region: PreparedRegion): string[] {
  const notes: string[] = [];
  if (region.tissueMask)
    notes.push(
      `Analysed only the tissue found in the region (${(100 * region.tissueFraction).toFixed(0)} % of it); the rest looks like slide or mounting medium.`,
    );
  const { treatedSaturatedPx: sat, treatedBrightPx: bright, treatedDarkPx: dark } = region;
  if (sat + bright + dark > 0) {
    const parts: string[] = [];
    if (sat > 0) parts.push(count(sat, "saturated pixel", "saturated pixels"));
    if (bright > 0) parts.push(count(bright, "pixel of bright debris", "pixels of bright debris (with their rim)"));
    if (dark > 0) parts.push(count(dark, "pixel of dark debris", "pixels of dark debris (with their rim)"));
    notes.push(`${parts.join(" and ")} were replaced by the surrounding intensity before the spectrum.`);
  }
  return notes;
}
