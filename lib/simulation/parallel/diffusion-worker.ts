/** Worker side of createWorkerExecutor: runs the spectral stage of its species on shared buffers. */
import { workerData } from "node:worker_threads";
import { createCosineBasis } from "../cosine-basis";
import { runDiffusionStage, type StageMode } from "../diffusion-stage";
import type { DiffusionLayout } from "../executor";

const { layout, species, ctrl, slot } = workerData as { layout: DiffusionLayout; species: number[]; ctrl: Int32Array; slot: number };
const WORDS = 4;
const basis = createCosineBasis(layout.grid);
let seen = 0;
for (;;) {
  Atomics.wait(ctrl, slot * WORDS, seen);
  seen = Atomics.load(ctrl, slot * WORDS);
  const mode = ctrl[slot * WORDS + 1];
  if (mode < 0) break;
  const workIndex = ctrl[slot * WORDS + 2] as 0 | 1;
  for (const s of species) runDiffusionStage(basis, layout.coefficients[s], layout.buffers[s], mode as StageMode, workIndex);
  Atomics.store(ctrl, slot * WORDS + 3, seen);
  Atomics.notify(ctrl, slot * WORDS + 3);
}
