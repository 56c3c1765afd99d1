/** Worker side of createWorkerExecutor: runs the spectral stage of its species on shared buffers. */
import { workerData } from "node:worker_threads";
import { createSpectralBasis } from "../simulation/spectral-basis";
import { runDiffusionStage, type StageMode } from "../simulation/diffusion-stage";
import type { DiffusionLayout } from "../simulation/executor";
import { raiseFailureWord, type FailureWord } from "./start-worker";

const WORDS = 4;
const SPIN_LOOPS = 200_000;

function serve(data: {
  layout: DiffusionLayout;
  species: number[];
  ctrl: Int32Array;
  maxAbsOut: Float64Array;
  slot: number;
}): void {
  const { layout, species, ctrl, maxAbsOut, slot } = data;
  const basis = createSpectralBasis(layout.grid);
  let seen = 0;
  for (;;) {
    // Spin briefly for the next generation, then sleep (same reasoning as awaitWord).
    let spin = 0;
    while (Atomics.load(ctrl, slot * WORDS) === seen) {
      if (++spin > SPIN_LOOPS) Atomics.wait(ctrl, slot * WORDS, seen, 10_000);
    }
    seen = Atomics.load(ctrl, slot * WORDS);
    const mode = ctrl[slot * WORDS + 1];
    if (mode < 0) break;
    const workIndex = ctrl[slot * WORDS + 2] as 0 | 1;
    let maxAbs = 0;
    for (const s of species) {
      const m = runDiffusionStage(basis, layout.coefficients[s], layout.buffers[s], mode as StageMode, workIndex);
      if (!(m <= maxAbs)) maxAbs = Number.isNaN(maxAbs) ? maxAbs : m;
    }
    maxAbsOut[slot] = maxAbs;
    Atomics.store(ctrl, slot * WORDS + 3, seen);
    Atomics.notify(ctrl, slot * WORDS + 3);
  }
}

try {
  serve(workerData);
} catch (err) {
  // The caller blocks in Atomics.wait and cannot see this worker's "error" event (start-worker.ts).
  raiseFailureWord(workerData as { failure?: FailureWord });
  throw err;
}
