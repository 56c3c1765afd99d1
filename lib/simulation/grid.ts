import { failOption } from "./errors";
import { SIMULATION_LIMITS, isPowerOfTwo, neighbouringPowersOfTwo } from "./limits";

/** Options of a simulation domain: a 1-D interval [0, L] or a 2-D rectangle [0, Lx] × [0, Ly]. */
export interface GridOptions {
  /** Domain lengths in µm (or model length units): `[L]` for an interval, `[Lx, Ly]` for a rectangle. */
  lengthUm: readonly number[];
  /** Cells per axis, same order as `lengthUm`; each a power of two (fft.js sizes). */
  cells: readonly number[];
  /** Boundary condition on every side. @default "zero-flux" */
  boundary?: Boundary;
}

/** Zero-flux (Neumann, cosine modes k = mπ/L) or periodic (Fourier modes k = 2πm/L). */
export type Boundary = "zero-flux" | "periodic";

/**
 * A cell-centred grid: cell j of an axis with n cells and spacing h = L/n sits at x_j = (j + ½)h.
 * Cosine modes cos(mπx/L) sampled at those centres are exactly the DCT-II basis, so the discrete
 * zero-flux eigenfunctions equal the continuous ones at the nodes (SCIENCE.md §2).
 * Fields are stored row-major: index = iy·nx + ix.
 */
export interface Grid {
  dimensions: 1 | 2;
  boundary: Boundary;
  nx: number;
  ny: number;
  lengthXUm: number;
  lengthYUm: number;
  spacingXUm: number;
  spacingYUm: number;
  cellCount: number;
}

/** Validates grid options and returns the grid; throws SimulationOptionError with exact sentences. */
export function createGrid(options: GridOptions): Grid {
  const { lengthUm, cells } = options;
  if (!Array.isArray(lengthUm) || (lengthUm.length !== 1 && lengthUm.length !== 2)) {
    failOption("grid.lengthUm", "grid.lengthUm must list 1 (interval) or 2 (rectangle) lengths.");
  }
  if (!Array.isArray(cells) || cells.length !== lengthUm.length) {
    failOption("grid.cells", "grid.cells must list one cell count per entry of grid.lengthUm.");
  }
  const dims = lengthUm.length as 1 | 2;
  const boundary = options.boundary ?? "zero-flux";
  if (boundary !== "zero-flux" && boundary !== "periodic") {
    failOption("grid.boundary", `grid.boundary must be "zero-flux" or "periodic", got ${String(boundary)}.`);
  }
  const max = dims === 1 ? SIMULATION_LIMITS.maxCells1D : SIMULATION_LIMITS.maxCellsPerAxis2D;
  lengthUm.forEach((l, i) => {
    if (!Number.isFinite(l) || l <= 0)
      failOption("grid.lengthUm", `grid.lengthUm[${i}] must be a positive finite length, got ${l}.`);
  });
  cells.forEach((n, i) => {
    if (!Number.isInteger(n) || n < SIMULATION_LIMITS.minCellsPerAxis || n > max) {
      failOption(
        "grid.cells",
        `grid.cells[${i}] must be an integer from ${SIMULATION_LIMITS.minCellsPerAxis} to ${max}, got ${n}.`,
      );
    }
    if (!isPowerOfTwo(n)) {
      const [lo, hi] = neighbouringPowersOfTwo(n);
      failOption("grid.cells", `grid.cells[${i}] must be a power of two (fft.js sizes), got ${n}; use ${lo} or ${hi}.`);
    }
  });
  const nx = cells[0];
  const ny = dims === 2 ? cells[1] : 1;
  const lx = lengthUm[0];
  const ly = dims === 2 ? lengthUm[1] : 0;
  return {
    dimensions: dims,
    boundary,
    nx,
    ny,
    lengthXUm: lx,
    lengthYUm: ly,
    spacingXUm: lx / nx,
    spacingYUm: dims === 2 ? ly / ny : 0,
    cellCount: nx * ny,
  };
}

/** Centre of cell `i` along x in µm. */
export function cellCentreXUm(grid: Grid, ix: number): number {
  return (ix + 0.5) * grid.spacingXUm;
}

/** Centre of cell `i` along y in µm (0 for a 1-D grid). */
export function cellCentreYUm(grid: Grid, iy: number): number {
  return grid.dimensions === 2 ? (iy + 0.5) * grid.spacingYUm : 0;
}
