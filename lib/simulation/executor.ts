import { createSpectralBasis } from "./spectral-basis";
import { runDiffusionStage, type SpeciesBuffers, type StageMode } from "./diffusion-stage";
import type { Grid } from "./grid";
import type { SpeciesCoefficients } from "./schemes";

/** Everything the spectral stage needs, allocated once per run through the executor. */
export interface DiffusionLayout {
  grid: Grid;
  buffers: SpeciesBuffers[];
  coefficients: SpeciesCoefficients[];
}

/**
 * Runs the spectral stage of every species. The serial executor lives here; a worker-thread
 * executor (lib/parallel/worker-executor.ts) shares buffers through SharedArrayBuffer. `run` is
 * synchronous so the step loop stays synchronous.
 */
export interface DiffusionExecutor {
  /** A zeroed Float64Array of `length` the executor can reach (shared memory for workers). */
  allocate(length: number): Float64Array;
  /** Called once, after every buffer and coefficient of `layout` is allocated and filled. */
  prepare(layout: DiffusionLayout): void;
  /**
   * Runs the stage for all species on work buffer `workIndex`; returns the largest |value| of
   * the new fields (NaN when any value is NaN or infinite).
   */
  run(mode: StageMode, workIndex: 0 | 1): number;
  /** Releases threads, if any. */
  dispose(): void;
}

/** Runs every species on the calling thread. */
export function createSerialExecutor(): DiffusionExecutor {
  let layout: DiffusionLayout | null = null;
  let basis: ReturnType<typeof createSpectralBasis> | null = null;
  return {
    allocate: (length) => new Float64Array(length),
    prepare(l) {
      layout = l;
      basis = createSpectralBasis(l.grid);
    },
    run(mode, workIndex) {
      const l = layout!;
      let maxAbs = 0;
      for (let s = 0; s < l.buffers.length; s++) {
        const m = runDiffusionStage(basis!, l.coefficients[s], l.buffers[s], mode, workIndex);
        if (!(m <= maxAbs)) maxAbs = Number.isNaN(maxAbs) ? maxAbs : m; // NaN sticks
      }
      return maxAbs;
    },
    dispose() {
      layout = null;
      basis = null;
    },
  };
}
