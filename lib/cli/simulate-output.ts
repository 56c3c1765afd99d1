/** What the `simulate` command writes and prints: a summary, the final pattern read as a tissue image, the files. */
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { encodePng } from "../imaging";
import { readWavelength, ReadoutError } from "../readout";
import { type SimulationResult } from "../simulation";

export function summarise(result: SimulationResult) {
  return {
    stopReason: result.stopReason,
    message: result.message,
    timeS: result.timeS,
    steps: result.steps,
    dtS: result.timeStep.dtS,
    adaptive: result.adaptive,
    spectralRadiusPerS: result.timeStep.spectralRadiusPerS,
    scheme: result.scheme,
    stationary: result.stationary,
    lastChangeRatePerS: result.lastChangeRatePerS,
    stationarityTolerancePerS: result.stationarityTolerancePerS,
    seed: result.seed,
    blowUp: result.blowUp,
    grid: {
      cells: result.grid.dimensions === 2 ? [result.grid.nx, result.grid.ny] : [result.grid.nx],
      lengthUm: result.grid.dimensions === 2 ? [result.grid.lengthXUm, result.grid.lengthYUm] : [result.grid.lengthXUm],
    },
    fields: result.speciesNames.map((name, s) => ({ species: name, ...result.stats[s] })),
    snapshots: result.snapshots.map((s) => ({ requestedTimeS: s.requestedTimeS, timeS: s.timeS, step: s.step })),
  };
}

function toGrey(field: Float64Array, width: number, height: number) {
  let min = Infinity,
    max = -Infinity;
  for (const v of field) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const span = max > min ? max - min : 1;
  const data = new Float32Array(width * height);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) data[y * width + x] = (field[(height === 1 ? 0 : y) * width + x] - min) / span;
  return { width, height, data };
}

export function readPattern(result: SimulationResult) {
  const g = result.grid;
  if (g.dimensions !== 2) return { skipped: "1-D grid: the image readout needs a rectangle." };
  if (Math.abs(g.spacingXUm / g.spacingYUm - 1) > 1e-9)
    return { skipped: "Cells are not square; the readout needs one pixel size." };
  try {
    const r = readWavelength(toGrey(result.fields[0], g.nx, g.ny), { pixelSizeUm: g.spacingXUm });
    return {
      species: result.speciesNames[0],
      periodFound: r.periodFound,
      wavelengthUm: r.wavelengthUm,
      uncertaintyUm: r.uncertaintyUm,
      significance: r.significance,
      symmetry: r.symmetry,
      nearestNeighbourUm: r.nearestNeighbourUm,
      orientationDeg: r.orientationDeg,
      warnings: r.warnings,
    };
  } catch (e) {
    if (e instanceof ReadoutError) return { skipped: e.message };
    throw e;
  }
}

export async function writeOutputs(dir: string, result: SimulationResult, json: unknown): Promise<string[]> {
  mkdirSync(dir, { recursive: true });
  const g = result.grid,
    written: string[] = [];
  for (let s = 0; s < result.fields.length; s++) {
    const name = result.speciesNames[s].replace(/[^A-Za-z0-9_-]/g, "_");
    const f64 = path.join(dir, `final-${name}.f64`);
    writeFileSync(f64, Buffer.from(result.fields[s].buffer, result.fields[s].byteOffset, result.fields[s].byteLength));
    const png = path.join(dir, `final-${name}.png`);
    writeFileSync(png, await encodePng(toGrey(result.fields[s], g.nx, g.dimensions === 2 ? g.ny : 32)));
    written.push(f64, png);
    result.snapshots.forEach((snap, i) => {
      const file = path.join(dir, `snapshot-${i}-${name}.f64`);
      const f = snap.fields[s];
      writeFileSync(file, Buffer.from(f.buffer, f.byteOffset, f.byteLength));
      written.push(file);
    });
  }
  const meta = path.join(dir, "result.json");
  writeFileSync(meta, JSON.stringify(json, null, 2));
  return [...written, meta];
}
