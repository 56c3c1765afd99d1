/**
 * One decode + core readout of a TIFF in a fresh process, for its peak memory (the side-by-side
 * bench starts it): prints one JSON line with the wavelength and the process's maximum RSS.
 * Usage: tsx tests/bench/readout-child.ts FILE [core|core-2-threads|full]
 */
import { existsSync, readFileSync } from "node:fs";
import { setSpectrumExecutor } from "@/lib/fft";
import { decodeImage } from "@/lib/imaging";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { readWavelength } from "@/lib/readout";
import { CORE_READOUT } from "./core-readout";

async function main() {
  const [file, mode] = process.argv.slice(2);
  if (mode === "core-2-threads") setSpectrumExecutor(createSpectrumThreads());
  const { image } = await decodeImage(readFileSync(file), {});
  const r = readWavelength(image, mode === "full" ? { pixelSizeUm: 1 } : CORE_READOUT);
  // VmHWM is this process's own peak; getrusage's maxRSS also counts the parent's memory at the
  // fork before exec (Linux keeps it across execve), which made a child of the bench look as big as the bench.
  const hwm = /VmHWM:\s+(\d+) kB/.exec(
    existsSync("/proc/self/status") ? readFileSync("/proc/self/status", "utf8") : "",
  );
  const rssMiB = hwm ? Number(hwm[1]) / 1024 : process.resourceUsage().maxRSS / 1024;
  console.log(JSON.stringify({ wavelengthPx: r.wavelengthPx, symmetry: r.symmetry, rssMiB }));
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
