/**
 * Morphokin beside the numpy script a modeller would write (`../shared/bench/numpy_reference.py`),
 * on the same inputs in one run: medians of 3 after a warm-up on each side (two on Morphokin's), the ratio
 * Morphokin ÷ numpy beside its goal, and the number each side computed (so a fast wrong answer
 * shows). Needs Debian's python3-numpy and python3-tifffile; as root it installs them when
 * missing, otherwise it says so and prints Morphokin's figures alone.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { setSpectrumExecutor } from "@/lib/fft";
import { decodeImage } from "@/lib/imaging";
import { getCatalogueKinetics } from "@/lib/kinetics";
import { computeTuringMapParallel, createMapWorkerPool } from "@/lib/parallel";
import { createSpectrumThreads } from "@/lib/parallel/spectrum-threads";
import { readWavelength, type WavelengthReadout } from "@/lib/readout";
import { computeTuringMap, type TuringMapOptions } from "@/lib/stability";
import { CORE_READOUT } from "./core-readout";
import type { BenchRow } from "./run";
import { SIM_NUMPY_ARGS, simRows, type NumpySimFigure } from "./side-by-side-sim";

const SHARED_BENCH = path.resolve(import.meta.dirname, "../../../shared/bench");
const PYTHON = "/usr/bin/python3";
const WORK = path.join(tmpdir(), "morphokin-side-by-side");
const REPS = 3;
/**
 * The 4096² readout's medians are of 7 runs a side: a run is about half a second on either side,
 * and on this shared machine single runs of either side vary by up to a quarter (numpy's median of
 * 3 ranged from 465 to 583 ms in one day), so a median of 3 moved the ratio by more than the
 * distance to its goal.
 */
const READOUT_REPS = 7;

interface NumpyFigure {
  median: number;
  min: number;
  max: number;
  [k: string]: unknown;
}

function havePython(): boolean {
  const probe = () => spawnSync(PYTHON, ["-c", "import numpy, tifffile"], { stdio: "ignore" }).status === 0;
  if (probe()) return true;
  if (process.getuid?.() !== 0) return false;
  process.stderr.write("side-by-side: installing Debian's python3-numpy and python3-tifffile …\n");
  spawnSync("apt-get", ["install", "-y", "-qq", "python3-numpy", "python3-tifffile"], {
    stdio: "ignore",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  return probe();
}

function numpy(...args: string[]): NumpyFigure {
  const r = spawnSync(PYTHON, [path.join(SHARED_BENCH, "numpy_reference.py"), WORK, ...args], {
    encoding: "utf8",
    maxBuffer: 1 << 20,
  });
  if (r.status !== 0) throw new Error(`numpy_reference.py ${args.join(" ")} failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split("\n").pop()!) as NumpyFigure;
}

/**
 * Two untimed calls before the timed ones: V8 is still compiling the readout's loops during the
 * first 4096² readouts of a process (measured: the first took about 1.5× the later ones, the
 * second up to 1.4×), and numpy's side needs no compiler. Numpy's script keeps its one warm-up.
 */
const WARM_UPS = 2;

/** Median of `reps` timed calls after WARM_UPS untimed ones (ms), and the last call's value. */
async function medianMs<T>(
  fn: () => T | Promise<T>,
  reps = REPS,
): Promise<{ ms: number; min: number; max: number; value: T }> {
  let value = await fn();
  for (let i = 1; i < WARM_UPS; i++) value = await fn();
  const t: number[] = [];
  for (let i = 0; i < reps; i++) {
    const s = performance.now();
    value = await fn();
    t.push(performance.now() - s);
  }
  t.sort((a, b) => a - b);
  return { ms: t[Math.floor(t.length / 2)], min: t[0], max: t[t.length - 1], value };
}

const ratioRow = (name: string, ms: number, np: NumpyFigure | null, goal: string, note: string): BenchRow =>
  np
    ? { name, value: ms / (np.median * 1000), unit: "× numpy", target: goal, note }
    : { name, value: ms, unit: "ms", target: goal, note: `${note}; no numpy here, Morphokin alone` };

/** The numpy script's map box: Schnakenberg d = 30, a ∈ [0.02, 0.4] × b ∈ [0.4, 2.0], 500 × 500 cells, 200 wavenumbers. */
const MAP: TuringMapOptions = {
  x: { name: "a", min: 0.02, max: 0.4, n: 500 },
  y: { name: "b", min: 0.4, max: 2.0, n: 500 },
  parameters: { gamma: 1, d: 30 },
  wavenumbers: 200,
};

async function mapRows(np: NumpyFigure | null): Promise<BenchRow[]> {
  const k = getCatalogueKinetics("schnakenberg");
  const one = await medianMs(() => computeTuringMap(k, MAP));
  const pool = await createMapWorkerPool(2);
  const two = await medianMs(() => computeTuringMapParallel({ catalogue: "schnakenberg" }, MAP, { pool }));
  await pool.close();
  const c = one.value.counts,
    cells = 500 * 500;
  // numpy's figure is the fraction with any growth (σ_max > 0 somewhere on k ∈ [0, 2]), k = 0 included.
  const anyGrowth = (cells - c.stable - c["no-steady-state"] - c.invalid) / cells;
  const npNote = np
    ? `numpy ${(np.median * 1000).toFixed(0)} ms (${(np.min * 1000).toFixed(0)}–${(np.max * 1000).toFixed(0)}), any growth ${Number(np.turingFraction).toFixed(6)}`
    : "";
  const ours = `Morphokin ${one.ms.toFixed(0)} ms (${one.min.toFixed(0)}–${one.max.toFixed(0)}), any growth ${anyGrowth.toFixed(6)}, Turing ${one.value.turingFraction.toFixed(6)}`;
  return [
    ratioRow("side by side: Turing map 500×500×200, 1 thread", one.ms, np, "≤ 0.6", `${ours}; ${npNote}`),
    ratioRow(
      "side by side: Turing map 500×500×200, 2 workers",
      two.ms,
      np,
      "≤ 0.33",
      `Morphokin ${two.ms.toFixed(0)} ms (${two.min.toFixed(0)}–${two.max.toFixed(0)})`,
    ),
  ];
}

type ChildMode = "core" | "core-2-threads" | "full";

/** Peak memory of one decode + readout in a fresh process (tests/bench/readout-child.ts). */
function childReadout(file: string, mode: ChildMode): { rssMiB: number; wavelengthPx: number | null } | null {
  const r = spawnSync(
    process.execPath,
    ["--import", "tsx", path.join(import.meta.dirname, "readout-child.ts"), file, mode],
    { encoding: "utf8", maxBuffer: 1 << 20 },
  );
  if (r.status !== 0) return null;
  return JSON.parse(r.stdout.trim().split("\n").pop()!) as { rssMiB: number; wavelengthPx: number | null };
}

async function readoutRows(np: NumpyFigure | null): Promise<BenchRow[]> {
  const file = path.join(WORK, "img4096.tif");
  if (!existsSync(file)) return [];
  const bytes = readFileSync(file);
  // The same work as numpy_reference.py's readout (core-readout.ts), then the full default readout.
  const core = await medianMs(
    async () => readWavelength((await decodeImage(bytes, {})).image, CORE_READOUT),
    READOUT_REPS,
  );
  const threads = createSpectrumThreads();
  setSpectrumExecutor(threads);
  const core2 = await medianMs(
    async () => readWavelength((await decodeImage(bytes, {})).image, CORE_READOUT),
    READOUT_REPS,
  );
  setSpectrumExecutor(null);
  threads.dispose();
  const full = await medianMs(async () => readWavelength((await decodeImage(bytes, {})).image, { pixelSizeUm: 1 }));
  const said = (r: WavelengthReadout) =>
    r.periodFound ? `λ = ${r.wavelengthPx!.toFixed(3)} px, ${r.symmetry}` : "no significant period";
  const npNote = np ? `numpy ${(np.median * 1000).toFixed(0)} ms, λ = ${Number(np.wavelengthPx).toFixed(3)} px` : "";
  const rows = [
    ratioRow(
      "side by side: decode + core readout 4096² (true λ 32 px)",
      core.ms,
      np,
      "≤ 0.75, 32 px ± 2 %",
      `Morphokin ${core.ms.toFixed(0)} ms (${core.min.toFixed(0)}–${core.max.toFixed(0)}), ${said(core.value)}; ${npNote}`,
    ),
    ratioRow(
      "side by side: decode + core readout 4096², on 2 threads",
      core2.ms,
      np,
      "≤ 0.75, 32 px ± 2 %",
      `Morphokin ${core2.ms.toFixed(0)} ms (${core2.min.toFixed(0)}–${core2.max.toFixed(0)}), ${said(core2.value)}`,
    ),
    {
      name: "decode + full readout 4096² (+ sub-regions, autocorrelation)",
      value: full.ms,
      unit: "ms",
      note: `${full.min.toFixed(0)}–${full.max.toFixed(0)}, ${said(full.value)}`,
    },
  ];
  for (const mode of ["core", "core-2-threads", "full"] as const) {
    const child = childReadout(file, mode);
    if (child)
      rows.push({
        name: `peak memory: decode + ${mode} readout 4096², own process`,
        value: child.rssMiB,
        unit: "MiB",
        target: mode === "full" ? undefined : "≤ 512",
        note: np && mode === "core" ? `numpy ${Number(np.rssMiB).toFixed(0)} MiB` : undefined,
      });
  }
  return rows;
}

/** `parts`: "map", "readout" and/or "sim" (`npm run bench -- side-by-side:readout`); none = every part. */
export default async function bench(parts: string[] = []): Promise<BenchRow[]> {
  const want = (part: string) => parts.length === 0 || parts.includes(part);
  mkdirSync(WORK, { recursive: true });
  const python = existsSync(SHARED_BENCH) && havePython();
  if (!python)
    process.stderr.write(
      "side-by-side: no python3 with numpy and tifffile (or no ../shared/bench): Morphokin's figures alone\n",
    );
  if (python && !existsSync(path.join(WORK, "img4096.tif")))
    spawnSync(PYTHON, [path.join(SHARED_BENCH, "make_frame.py"), WORK], { stdio: "ignore" });
  const rows: BenchRow[] = [];
  if (want("map")) rows.push(...(await mapRows(python ? numpy("map", String(REPS)) : null)));
  if (want("readout")) rows.push(...(await readoutRows(python ? numpy("readout", String(READOUT_REPS)) : null)));
  if (want("sim")) rows.push(...simRows(python ? (numpy(...SIM_NUMPY_ARGS) as NumpySimFigure) : null));
  return rows;
}
