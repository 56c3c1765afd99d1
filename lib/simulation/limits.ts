/**
 * Hard limits of the solver, exported so callers (API schemas, CLI) can show them.
 * Grid sizes per axis must be powers of two because fft.js only transforms such sizes; the
 * solver never pads or resamples silently (a padded cosine basis would change the domain).
 */
export const SIMULATION_LIMITS = {
  /** Fewest cells along an axis. */
  minCellsPerAxis: 4,
  /** Most cells of a 1-D interval. */
  maxCells1D: 65_536,
  /** Most cells along one axis of a 2-D rectangle. */
  maxCellsPerAxis2D: 2_048,
  /** Most species a reaction system may have. */
  maxSpecies: 6,
  /** Most time steps in one run. */
  maxSteps: 10_000_000,
  /** Most snapshots in one run. */
  maxSnapshots: 200,
} as const;

/** True when n is a power of two (1 excluded). */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n > 1 && (n & (n - 1)) === 0;
}

/** The powers of two just below and above n, for error messages. */
export function neighbouringPowersOfTwo(n: number): [number, number] {
  const up = 2 ** Math.ceil(Math.log2(Math.max(n, 2)));
  return [Math.max(2, up === n ? n : up / 2), up];
}
