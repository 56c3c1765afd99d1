/**
 * End-to-end readout of a 4096 × 4096 16-bit TIFF generated here: decode, ROI, flatten, window,
 * FFT, radial spectrum, peak — and the full readout (plus sub-regions and autocorrelation).
 */
import type { BenchRow } from "./run";
import { decodeImage, encodeTiff16 } from "../../lib/imaging";
import { readWavelength } from "../../lib/readout";
import { makeHexSpots } from "../../lib/synthetic";

export default async function bench(): Promise<BenchRow[]> {
  const side = 4096;
  let t = performance.now();
  const tiff = await encodeTiff16(makeHexSpots({ width: side, height: side, spacingPx: 24, angleDeg: 12, jitterPx: 1, noise: 0.05, seed: 3 }), { pixelSizeUm: 0.5 });
  const generateS = (performance.now() - t) / 1000;
  const rssBefore = process.resourceUsage().maxRSS / 1024;

  t = performance.now();
  const { image, info } = await decodeImage(tiff);
  const decodeS = (performance.now() - t) / 1000;
  t = performance.now();
  readWavelength(image, { pixelSizeUm: info.pixelSizeUm, subregions: false, autocorrelation: false });
  const coreS = (performance.now() - t) / 1000;
  t = performance.now();
  const full = readWavelength(image, { pixelSizeUm: info.pixelSizeUm });
  const fullS = (performance.now() - t) / 1000;
  const peakRssMiB = process.resourceUsage().maxRSS / 1024;
  const expectedUm = (Math.sqrt(3) / 2) * 24 * 0.5;
  const note = `λ ${full.wavelengthUm?.toFixed(4)} µm vs ${expectedUm.toFixed(4)} expected, ${full.symmetry}`;
  return [
    { name: "readout: generate + encode 4096² 16-bit TIFF (setup)", value: generateS, unit: "s" },
    { name: "readout: decode 4096² 16-bit TIFF", value: decodeS, unit: "s" },
    { name: "readout: core (ROI, flatten, window, FFT, radial, peak)", value: coreS, unit: "s" },
    { name: "readout: decode + core", value: decodeS + coreS, unit: "s", target: "< 2 s" },
    { name: "readout: full (+ 9 sub-regions, autocorrelation)", value: fullS, unit: "s", note },
    { name: "readout: peak RSS (whole process)", value: peakRssMiB, unit: "MiB", target: "< 1024 MiB", note: `${rssBefore.toFixed(0)} MiB after setup` },
  ];
}
