import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";
import { encodePng } from "../../imaging";
import { resolveKinetics, resolveParameters, type KineticsSource } from "../../kinetics";
import { readWavelength, ReadoutError } from "../../readout";
import {
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  readKineticsSteadyState,
  simulateReactionDiffusion,
  type SpatialParameterField,
  type SchemeName,
  type SimulationOptions,
  type SimulationResult,
} from "../../simulation";
import { createWorkerExecutor } from "../../parallel";

const help = `simulate --spec RUN.json [--out DIR] [--threads 1|2] [--progress] [--json]

Simulates a kinetics on a zero-flux interval or rectangle (semi-implicit spectral solver) and
summarises the final pattern; on a 2-D grid with square cells it also reads the wavelength of the
first species with the same readout as tissue images.

RUN.json fields:
  kinetics           {"catalogue": "schnakenberg"} or {"definition": {...}} (lab kinetics)
  parameters         {name: value}; defaults of the kinetics otherwise
  spatialParameters  {name: {"kind": "linear"|"exponential"|"table"|"field", ...}}
  grid               {"lengthUm": [L] or [Lx, Ly], "cells": [n] or [nx, ny], "boundary"?:
                     "zero-flux" (default) | "periodic"} (cells: powers of two; lengths in
                     model length units for non-dimensional kinetics)
  endTimeS           simulated time (s, or model time units)
  dtS, scheme        step cap, "etd2" (default) | "implicit-euler" | "integrating-factor"
  initial            {"steadyState"?: [...], "noiseAmplitude"?: a, "seed"?: s}; the steady state
                     defaults to the kinetics' closed-form one. Or a chosen initial field:
                     {"fieldFiles": ["u.f64", "v.f64"]} (one per species, raw little-endian
                     float64, row-major, as --out writes them; paths relative to RUN.json) or
                     {"fields": [[...], [...]]}, optionally with "noiseAmplitude" and "seed"
                     for seeded noise on top
  stopWhenStationary, stationarity {"tolerancePerS", "windowS", "minTimeS"}, snapshotTimesS
  scales             {"lengthScaleUm", "timeScaleS"} of a non-dimensional kinetics: adds a
                     "physical" block (wavelength in µm, time in s; SCIENCE.md §3)
Options:
  --out DIR      writes final-<species>.f64 (raw little-endian float64, row-major),
                 final-<species>.png (min–max scaled), snapshot-<i>-<species>.f64 for each
                 snapshot (i from 0, in the order of snapshotTimesS) and result.json
  --progress     prints one line "progress {timeS, fraction, steps}" (JSON) to stderr at each
                 progress report of the solver (about every 1 % of the steps), for a caller
                 that runs this command as a child process
  --threads N    1 (default) or 2: run the spectral stage of the species on two threads
`;

interface RunSpec {
  kinetics: KineticsSource;
  parameters?: Record<string, number>;
  spatialParameters?: Record<string, SpatialParameterField>;
  grid: SimulationOptions["grid"];
  endTimeS: number;
  dtS?: number;
  scheme?: SchemeName;
  initial?: {
    steadyState?: number[];
    noiseAmplitude?: number | number[];
    seed?: string | number;
    fields?: number[][];
    fieldFiles?: string[];
  };
  stopWhenStationary?: boolean;
  stationarity?: SimulationOptions["stationarity"];
  snapshotTimesS?: number[];
  scales?: { lengthScaleUm?: number; timeScaleS?: number };
}

function readSpec(file: string): RunSpec {
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, "utf8"));
  } catch (e) {
    throw new CliError(`Cannot read ${file} as JSON: ${(e as Error).message}`);
  }
  if (typeof raw !== "object" || raw === null) throw new CliError("The spec must be a JSON object.");
  const spec = raw as RunSpec;
  if (typeof spec.kinetics !== "object" || spec.kinetics === null)
    throw new CliError('The spec needs "kinetics": {"catalogue": id} or {"definition": {...}}.');
  if (typeof spec.grid !== "object" || spec.grid === null)
    throw new CliError('The spec needs "grid": {"lengthUm": [...], "cells": [...]}.');
  if (typeof spec.endTimeS !== "number") throw new CliError('The spec needs "endTimeS" (a number).');
  return spec;
}

/** The chosen initial field of the spec, read and checked against the grid; null when none is given. */
function readInitialFields(spec: RunSpec, specFile: string, species: number): Float64Array[] | null {
  const init = spec.initial ?? {};
  if (init.fields !== undefined && init.fieldFiles !== undefined)
    throw new CliError("initial: give fields or fieldFiles, not both.");
  const cells = (spec.grid.cells ?? []).reduce((a, b) => a * b, 1);
  if (init.fieldFiles !== undefined) {
    if (!Array.isArray(init.fieldFiles) || init.fieldFiles.length !== species) {
      throw new CliError(
        `initial.fieldFiles must list ${species} files (one per species), got ${Array.isArray(init.fieldFiles) ? init.fieldFiles.length : typeof init.fieldFiles}.`,
      );
    }
    return init.fieldFiles.map((name, s) => {
      const file = path.resolve(path.dirname(specFile), String(name));
      let bytes: Buffer;
      try {
        bytes = readFileSync(file);
      } catch (e) {
        throw new CliError(
          `initial.fieldFiles[${s}]: cannot read ${name} (${(e as NodeJS.ErrnoException).code ?? (e as Error).message}).`,
        );
      }
      if (bytes.length !== 8 * cells) {
        throw new CliError(
          `initial.fieldFiles[${s}] (${name}) has ${bytes.length} bytes; the grid ${spec.grid.cells.join(" × ")} needs ${8 * cells} (8 bytes of float64 per cell).`,
        );
      }
      return new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
    });
  }
  if (init.fields !== undefined) {
    if (!Array.isArray(init.fields) || init.fields.length !== species) {
      throw new CliError(
        `initial.fields must have ${species} arrays (one per species), got ${Array.isArray(init.fields) ? init.fields.length : typeof init.fields}.`,
      );
    }
    return init.fields.map((f, s) => {
      if (!Array.isArray(f) || !f.every((v) => typeof v === "number"))
        throw new CliError(`initial.fields[${s}] must be an array of numbers.`);
      return Float64Array.from(f);
    });
  }
  return null;
}

function summarise(result: SimulationResult) {
  return {
    stopReason: result.stopReason,
    message: result.message,
    timeS: result.timeS,
    steps: result.steps,
    dtS: result.timeStep.dtS,
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

function readPattern(result: SimulationResult) {
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

async function writeOutputs(dir: string, result: SimulationResult, json: unknown): Promise<string[]> {
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

const command: CliCommand = {
  name: "simulate",
  summary: "Simulate a kinetics on an interval or rectangle and read the final pattern",
  help,
  async run(args) {
    const { options } = parseOptions(args, ["progress"]);
    if (typeof options.spec !== "string") throw new CliError("Give --spec RUN.json.");
    const threads = options.threads === undefined ? 1 : Number(options.threads);
    if (threads !== 1 && threads !== 2)
      throw new CliError(`--threads must be 1 or 2 (got ${String(options.threads)}).`);
    const spec = readSpec(options.spec);
    const executor = threads === 2 ? createWorkerExecutor({ workers: 1 }) : undefined;
    try {
      const kinetics = resolveKinetics(spec.kinetics);
      const p = resolveParameters(kinetics, spec.parameters ?? {}, "parameters");
      const params: Record<string, number> = {};
      kinetics.parameters.forEach((s, i) => (params[s.name] = p[i]));
      const given = readInitialFields(spec, options.spec, kinetics.species.length);
      const steadyState = given ? null : (spec.initial?.steadyState ?? readKineticsSteadyState(kinetics, p));
      if (!given && !steadyState)
        throw new CliError("This kinetics has no closed-form steady state; give initial.steadyState.");
      const initial: SimulationOptions["initial"] = given
        ? { kind: "fields", fields: given, noiseAmplitude: spec.initial?.noiseAmplitude, seed: spec.initial?.seed }
        : {
            kind: "steady-state-noise",
            steadyState: steadyState!,
            noiseAmplitude: spec.initial?.noiseAmplitude,
            seed: spec.initial?.seed ?? 1,
          };
      const result = simulateReactionDiffusion(createReactionSystemFromKinetics(kinetics), {
        grid: spec.grid,
        diffusionUm2PerS: readKineticsDiffusion(kinetics, p),
        params,
        spatialParams: spec.spatialParameters,
        initial,
        endTimeS: spec.endTimeS,
        dtS: spec.dtS,
        scheme: spec.scheme,
        stopWhenStationary: spec.stopWhenStationary,
        stationarity: spec.stationarity,
        snapshotTimesS: spec.snapshotTimesS,
        executor,
        onProgress:
          options.progress === true
            ? (q) =>
                process.stderr.write(
                  `progress ${JSON.stringify({ timeS: q.timeS, fraction: q.fraction, steps: q.steps })}\n`,
                )
            : undefined,
      });
      const json: Record<string, unknown> = {
        kinetics: kinetics.id,
        units: kinetics.units,
        lengthUnit: kinetics.units === "dimensional" ? "µm" : "model",
        ...summarise(result),
        readout: readPattern(result),
      };
      const sc = spec.scales;
      if (kinetics.units === "non-dimensional" && sc) {
        const ro = json.readout as { wavelengthUm?: number | null; nearestNeighbourUm?: number | null };
        const l = sc.lengthScaleUm,
          t = sc.timeScaleS;
        json.physical = {
          wavelengthUm: l && ro.wavelengthUm ? ro.wavelengthUm * l : null,
          nearestNeighbourUm: l && ro.nearestNeighbourUm ? ro.nearestNeighbourUm * l : null,
          timeS: t ? result.timeS * t : null,
          lengthScaleUm: l ?? null,
          timeScaleS: t ?? null,
        };
      }
      if (typeof options.out === "string") json.files = await writeOutputs(options.out, result, json);
      const text = `${result.message}\n${result.speciesNames.map((n, s) => `${n}: min ${result.stats[s].min.toPrecision(4)}, max ${result.stats[s].max.toPrecision(4)}, mean ${result.stats[s].mean.toPrecision(4)}`).join("\n")}`;
      return { json, text };
    } catch (e) {
      throw toCliError(e);
    } finally {
      executor?.dispose();
    }
  },
};

export default command;
