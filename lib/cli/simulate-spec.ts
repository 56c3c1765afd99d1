/** The `simulate` command's RUN.json: reading it, and the initial fields it may name. */
import { readFileSync } from "node:fs";
import path from "node:path";
import { CliError } from "./command";
import { type KineticsSource } from "../kinetics";
import { type SpatialParameterField, type SchemeName, type SimulationOptions } from "../simulation";

export interface RunSpec {
  kinetics: KineticsSource;
  parameters?: Record<string, number>;
  spatialParameters?: Record<string, SpatialParameterField>;
  grid: SimulationOptions["grid"];
  endTimeS: number;
  dtS?: number;
  scheme?: SchemeName;
  adaptive?: SimulationOptions["adaptive"];
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

export function readSpec(file: string): RunSpec {
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
export function readInitialFields(spec: RunSpec, specFile: string, species: number): Float64Array[] | null {
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
