/**
 * Decode + core readout of a TIFF, repeated, for a CPU profile of the readout's stages:
 * `node --cpu-prof --import tsx tests/bench/profile-readout.ts FILE [threads] [reps]`.
 */
import { readFileSync } from "node:fs";
import { setSpectrumExecutor } from "@/lib/fft";
import { decodeImage } from "@/lib/imaging";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { readWavelength } from "@/lib/readout";
import { CORE_READOUT } from "./core-readout";

async function main() {
  const [file, threadsArg, repsArg] = process.argv.slice(2);
  const threads = Number(threadsArg ?? 1) > 1 ? createSpectrumThreads() : null;
  if (threads) setSpectrumExecutor(threads);
  const bytes = readFileSync(file);
  const reps = Number(repsArg ?? 5);
  const ms: number[] = [];
  let lambda: number | null = null;
  for (let i = 0; i < reps; i++) {
    const s = performance.now();
    const { image } = await decodeImage(bytes, {});
    lambda = readWavelength(image, CORE_READOUT).wavelengthPx;
    ms.push(performance.now() - s);
  }
  console.log(JSON.stringify({ lambda, ms: ms.map((m) => Math.round(m)) }));
  threads?.dispose();
}

void main();
