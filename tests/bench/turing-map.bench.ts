/** 500 × 500 Turing map of a catalogue model over 200 wavenumbers: in-process, workers cold and warm. */
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeTuringMapParallel, createMapWorkerPool } from "@/lib/parallel";
import { computeTuringMap, type TuringMapOptions } from "@/lib/stability";
import type { BenchRow } from "./run";

const OPTIONS: TuringMapOptions = {
  x: { name: "a", min: 0.01, max: 0.5, n: 500 },
  y: { name: "d", min: 1, max: 100, n: 500, scale: "log" },
  wavenumbers: 200,
  target: { wavelength: 10, tolerance: 0.5 },
};
const CELLS = 500 * 500;

export default async function bench(): Promise<BenchRow[]> {
  const k = getCatalogueKinetics("schnakenberg");
  computeTuringMap(k, { ...OPTIONS, x: { ...OPTIONS.x, n: 50 }, y: { ...OPTIONS.y, n: 50 } }); // JIT warm-up
  let t = performance.now();
  computeTuringMap(k, OPTIONS);
  const local = performance.now() - t;
  t = performance.now();
  const cold = await computeTuringMapParallel({ catalogue: "schnakenberg" }, OPTIONS, { workers: 2 });
  const coldMs = performance.now() - t;
  const pool = await createMapWorkerPool(2);
  await computeTuringMapParallel({ catalogue: "schnakenberg" }, OPTIONS, { pool });
  t = performance.now();
  const warm = await computeTuringMapParallel({ catalogue: "schnakenberg" }, OPTIONS, { pool });
  const warmMs = performance.now() - t;
  await pool.close();
  return [
    {
      name: "turing map 500×500×200 k, Schnakenberg, 1 thread",
      value: local,
      unit: "ms",
      note: `${(CELLS / local).toFixed(0)}k cells/s`,
    },
    {
      name: "turing map 500×500×200 k, 2 workers incl. start",
      value: coldMs,
      unit: "ms",
      note: `${cold.workers} workers`,
    },
    { name: "turing map cells/s, 2 workers (pool warm)", value: (CELLS / warmMs) * 1e3, unit: "cells/s" },
    {
      name: "turing map 500×500×200 k, 2 workers (pool warm)",
      value: warmMs,
      unit: "ms",
      target: "< 1000 ms",
      note: `${(CELLS / warmMs).toFixed(0)}k cells/s, ${warm.workers} workers`,
    },
  ];
}
