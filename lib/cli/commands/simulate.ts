import { CliError, parseOptions, type CliCommand } from "../command";
import { toCliError } from "../core-errors";
import { resolveKinetics, resolveParameters } from "../../kinetics";
import {
  createReactionSystemFromKinetics,
  readKineticsDiffusion,
  readKineticsSteadyState,
  simulateReactionDiffusion,
  type SimulationOptions,
} from "../../simulation";
import { createWorkerExecutor } from "../../parallel";
import { readInitialFields, readSpec } from "../simulate-spec";
import { readPattern, summarise, writeOutputs } from "../simulate-output";

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
  adaptive           {"tolerance"?: 1e-3}: error-controlled steps (ETD2RK with embedded ETD1;
                     scheme etd2 only); without it the steps are fixed
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
  --progress     prints one line "progress {timeS, fraction, steps, dtS}" (JSON) to stderr at each
                 progress report of the solver (about every 1 % of the steps), for a caller
                 that runs this command as a child process
  --threads N    1 (default) or 2: run the spectral stage of the species on two threads
`;

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
        adaptive: spec.adaptive,
        stopWhenStationary: spec.stopWhenStationary,
        stationarity: spec.stationarity,
        snapshotTimesS: spec.snapshotTimesS,
        executor,
        onProgress:
          options.progress === true
            ? (q) =>
                process.stderr.write(
                  `progress ${JSON.stringify({ timeS: q.timeS, fraction: q.fraction, steps: q.steps, dtS: q.dtS })}\n`,
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
