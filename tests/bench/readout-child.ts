/**
 * One decode + core readout of a TIFF in a fresh process, for its peak memory (the side-by-side
 * bench starts it): prints one JSON line with the wavelength and the process's maximum RSS.
 * Usage: tsx tests/bench/readout-child.ts FILE [full]
 */
import { readFileSync } from "node:fs";
import { decodeImage } from "@/lib/imaging";
import { readWavelength } from "@/lib/readout";
import { CORE_READOUT } from "./core-readout";

async function main() {
  const [file, mode] = process.argv.slice(2);
  const { image } = await decodeImage(readFileSync(file), {});
  const r = readWavelength(image, mode === "full" ? { pixelSizeUm: 1 } : CORE_READOUT);
  const rssMiB = process.resourceUsage().maxRSS / 1024;
  console.log(JSON.stringify({ wavelengthPx: r.wavelengthPx, symmetry: r.symmetry, rssMiB }));
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
