import { createCosineBasis, type SpectralBasis } from "./cosine-basis";
import type { Grid } from "./grid";
import { createPeriodicBasis } from "./periodic-basis";

/** The Laplacian eigenbasis matching the grid's boundary condition. */
export function createSpectralBasis(grid: Grid): SpectralBasis {
  return grid.boundary === "periodic" ? createPeriodicBasis(grid) : createCosineBasis(grid);
}
