/**
 * End-to-end readout of a 4096 × 4096 16-bit TIFF generated here: decode, ROI, flatten, window,
 * FFT, radial spectrum, peak — and the full readout (plus sub-regions and autocorrelation).
 */
import { monitorEventLoopDelay } from "node:perf_hooks";
import type { BenchRow } from "./run";
import { imageReadoutSettingsSchema } from "../../lib/contracts/readout";
import { readConfig } from "../../lib/server/config";
import { readImage, readTable } from "../../lib/server/readouts/process";
import { decodeImage, encodeTiff16 } from "../../lib/imaging";
import { readWavelength } from "../../lib/readout";
import { makeHexSpots } from "../../lib/synthetic";

export default async function bench(): Promise<BenchRow[]> {
  const side = 4096;
  let t = performance.now();
  const tiff = await encodeTiff16(
    makeHexSpots({ width: side, height: side, spacingPx: 24, angleDeg: 12, jitterPx: 1, noise: 0.05, seed: 3 }),
    { pixelSizeUm: 0.5 },
  );
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
  // How long the server's event loop is held by one readout job of this image, in-process and in a child process.
  const settings = {
    ...imageReadoutSettingsSchema.parse({}),
    kind: "image" as const,
    pixelSizeUm: 0.5,
    pixelSizeSource: "bench",
  };
  const stall: Record<string, { maxMs: number; wallS: number }> = {};
  for (const mode of ["in-process", "child-process"] as const) {
    readConfig().readoutInProcess = mode === "in-process";
    const h = monitorEventLoopDelay({ resolution: 10 });
    h.enable();
    const t0 = performance.now();
    await readImage(tiff, settings, new AbortController().signal, async () => undefined);
    h.disable();
    stall[mode] = { maxMs: h.max / 1e6, wallS: (performance.now() - t0) / 1000 };
  }
  readConfig().readoutInProcess = false;
  const table = await tableStall();
  const expectedUm = (Math.sqrt(3) / 2) * 24 * 0.5;
  const note = `λ ${full.wavelengthUm?.toFixed(4)} µm vs ${expectedUm.toFixed(4)} expected, ${full.symmetry}`;
  return [
    { name: "readout: generate + encode 4096² 16-bit TIFF (setup)", value: generateS, unit: "s" },
    { name: "readout: decode 4096² 16-bit TIFF", value: decodeS, unit: "s" },
    { name: "readout: core (ROI, flatten, window, FFT, radial, peak)", value: coreS, unit: "s" },
    { name: "readout: decode + core", value: decodeS + coreS, unit: "s", target: "< 2 s" },
    { name: "readout: full (+ 9 sub-regions, autocorrelation)", value: fullS, unit: "s", note },
    {
      name: "readout job 4096², in-process: longest event-loop stall",
      value: stall["in-process"].maxMs,
      unit: "ms",
      note: `wall ${stall["in-process"].wallS.toFixed(2)} s`,
    },
    {
      name: "readout job 4096², child process: longest event-loop stall",
      value: stall["child-process"].maxMs,
      unit: "ms",
      note: `wall ${stall["child-process"].wallS.toFixed(2)} s (used by the server)`,
    },
    {
      name: "table readout job 10⁶ rows, in-process: longest event-loop stall",
      value: table["in-process"].maxMs,
      unit: "ms",
      note: `wall ${table["in-process"].wallS.toFixed(2)} s; ${table.note}`,
    },
    {
      name: "table readout job 10⁶ rows, child process: longest event-loop stall",
      value: table["child-process"].maxMs,
      unit: "ms",
      note: `wall ${table["child-process"].wallS.toFixed(2)} s (used by the server)`,
    },
    {
      name: "readout: peak RSS (whole process)",
      value: peakRssMiB,
      unit: "MiB",
      target: "< 1024 MiB",
      note: `${rssBefore.toFixed(0)} MiB after setup`,
    },
  ];
}

/**
 * How long one table readout job of a 1 000 000-row centroid CSV (a 1000 × 1000 square lattice,
 * spacing 10 µm, jittered) holds the event loop, in-process and in a child process.
 */
export async function tableStall() {
  const side = 1000;
  const lines = ["x_um,y_um"];
  let seed = 7;
  const jitter = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648 - 0.5) * 0.5;
  for (let i = 0; i < side; i++)
    for (let j = 0; j < side; j++) lines.push(`${(10 * i + jitter()).toFixed(3)},${(10 * j + jitter()).toFixed(3)}`);
  const csv = new TextEncoder().encode(lines.join("\n") + "\n");
  const settings = { kind: "table" as const, pixelSizeUm: null, pixelSizeSource: null };
  const out: Record<"in-process" | "child-process", { maxMs: number; wallS: number }> = {
    "in-process": { maxMs: 0, wallS: 0 },
    "child-process": { maxMs: 0, wallS: 0 },
  };
  let note = "";
  // Child first: the in-process run leaves a large heap whose collection would be counted against the child.
  for (const mode of ["child-process", "in-process"] as const) {
    readConfig().readoutInProcess = mode === "in-process";
    const h = monitorEventLoopDelay({ resolution: 10 });
    h.enable();
    // The histogram's timer must have ticked once, or a stall right after enable() goes unrecorded.
    await new Promise((resolve) => setTimeout(resolve, 30));
    const t0 = performance.now();
    const r = await readTable(csv, settings, new AbortController().signal);
    const wallS = (performance.now() - t0) / 1000;
    // The histogram records a stall when its timer finally runs: let it run before reading it.
    await new Promise((resolve) => setTimeout(resolve, 50));
    h.disable();
    out[mode] = { maxMs: h.max / 1e6, wallS };
    if (r.table.kind === "centroids-2d")
      note = `${(csv.length / 2 ** 20).toFixed(0)} MiB, NN mean ${r.table.nearestNeighbourUm.mean.toFixed(3)} µm (lattice 10 µm)`;
  }
  readConfig().readoutInProcess = false;
  return { ...out, note };
}
