import { SpacingError } from "./errors";
import { computeNearestNeighbours, type Field, type NearestNeighbourResult } from "./nearest-neighbours";
import type { Grid } from "./grid";
import { extractColumns, parseTable, resolveColumnMapping, type ColumnMapping } from "./parse-table";
import { spacingsFromPositions } from "./positions-1d";
import { summarize, type Summary } from "./summarize";

/** The readout of a measurement table; lengths in µm. */
export type SpacingTableReadout =
  | { kind: "positions-1d"; n: number; spacingUm: Summary; meanSpacingUm: number; warnings: string[] }
  | {
      kind: "centroids-2d";
      n: number;
      nearestNeighbourUm: Summary;
      interiorNearestNeighbourUm: Summary | null;
      clarkEvansR: number;
      densityPerUm2: number;
      equivalentHexWavelengthUm: number;
      warnings: string[];
    }
  | { kind: "spacings"; n: number; spacingUm: Summary; warnings: string[] };

/**
 * Reads a CSV/TSV of 1-D positions, 2-D centroids or spacings (as the mapping says) and summarises
 * it. For centroids the field defaults to the points' bounding box.
 */
export function readSpacingTable(text: string, mapping: ColumnMapping, field?: Field): SpacingTableReadout {
  return summarizeColumns(parseTable(text, mapping), field);
}

/** The same for a grid already read (delimited text or a workbook sheet). */
export function readSpacingGrid(grid: Grid, mapping: ColumnMapping, field?: Field): SpacingTableReadout {
  resolveColumnMapping(mapping);
  return summarizeColumns(extractColumns(grid, mapping), field);
}

/** Summarises columns in µm: x and y as centroids, else positions, else spacings. */
export function summarizeColumns(cols: Record<string, Float64Array>, field?: Field): SpacingTableReadout {
  const warnings: string[] = [];
  if (cols.x && cols.y) {
    if (cols.x.length < 2)
      throw new SpacingError(
        `At least 2 points are needed for nearest-neighbour distances (got ${cols.x.length}).`,
        "points",
      );
    const nn: NearestNeighbourResult = computeNearestNeighbours(cols.x, cols.y, field);
    if (!nn.interior)
      warnings.push(
        "Too few interior points (at least their NN distance from the edge) for an edge-corrected summary.",
      );
    let dup = 0;
    for (const d of nn.distances) if (d === 0) dup++;
    if (dup > 0) warnings.push(`${dup} points coincide with another point (NN distance 0).`);
    return {
      kind: "centroids-2d",
      n: cols.x.length,
      nearestNeighbourUm: nn.all,
      interiorNearestNeighbourUm: nn.interior,
      clarkEvansR: nn.clarkEvansR,
      densityPerUm2: nn.density,
      equivalentHexWavelengthUm: nn.equivalentHexWavelength,
      warnings,
    };
  }
  if (cols.position) {
    const s = spacingsFromPositions(cols.position);
    if (s.spacings.some((v) => v === 0)) warnings.push("Some positions are repeated (spacing 0).");
    return {
      kind: "positions-1d",
      n: cols.position.length,
      spacingUm: s.summary,
      meanSpacingUm: s.meanSpacing,
      warnings,
    };
  }
  const sp = cols.spacing!;
  if (sp.length < 2)
    throw new SpacingError(`At least 2 spacings are needed for a summary (got ${sp.length}).`, "spacing");
  if (sp.some((v) => v <= 0)) warnings.push("Some spacings are zero or negative.");
  return { kind: "spacings", n: sp.length, spacingUm: summarize(sp), warnings };
}
