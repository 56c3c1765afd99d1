/**
 * Validated, serialisable plan of a Turing-space map: two swept parameters (linear or log
 * spacing), the fixed parameters, the k grid, limits and the wavelength target. Plans cross
 * worker boundaries, so they hold only plain data.
 */
import { KineticsInputError, KineticsLimitError } from "../kinetics/errors";
import { parameterIndex, resolveParameters } from "../kinetics/parameters";
import type { CompiledKinetics, PhysicalScales } from "../kinetics/types";
import { resolveScales, type ResolvedScales } from "./scales";

/** Most cells of one map (e.g. 1000 × 1000). */
export const MAX_MAP_CELLS = 1_000_000;
/** Most wavenumbers per cell. */
export const MAX_MAP_WAVENUMBERS = 2000;
/** Most cell × wavenumber evaluations of one map (bounds its run time). */
export const MAX_MAP_WORK = 500_000_000;
/** Default wall-clock limit of one map, ms. */
export const DEFAULT_MAP_TIME_LIMIT_MS = 60_000;

export interface MapAxis {
  /** Parameter swept along this axis. */
  name: string;
  min: number;
  max: number;
  /** Number of cells (≥ 2). */
  n: number;
  /** @default "linear" */
  scale?: "linear" | "log";
}

export interface TuringMapOptions extends PhysicalScales {
  x: MapAxis;
  y: MapAxis;
  /** Values of the parameters that are not swept (defaults otherwise). */
  parameters?: Record<string, number>;
  /** Wavenumbers per cell (equal steps from 0 to k_max) of the general path; two-species cells with diagonal D are exact and use none. @default 200 */
  wavenumbers?: number;
  /** Cells whose predicted wavelength is within target ± tolerance (µm with a length scale, else model units). */
  target?: { wavelength: number; tolerance: number };
  /** Wall-clock limit, ms. @default 60000 */
  timeLimitMs?: number;
}

export interface MapPlan {
  x: Required<MapAxis> & { index: number; values: number[] };
  y: Required<MapAxis> & { index: number; values: number[] };
  /** Full parameter vector with the fixed values (swept entries overwritten per cell). */
  base: number[];
  wavenumbers: number;
  scales: ResolvedScales;
  /** Target in model units, or null. */
  target: { wavelength: number; tolerance: number } | null;
  timeLimitMs: number;
}

export function planTuringMap(kinetics: CompiledKinetics, options: TuringMapOptions): MapPlan {
  const x = planAxis(kinetics, options.x, "x");
  const y = planAxis(kinetics, options.y, "y");
  if (x.index === y.index)
    throw new KineticsInputError(
      "y.name",
      `The two axes sweep the same parameter "${x.name}"; choose two different parameters.`,
    );
  const cells = x.n * y.n;
  if (cells > MAX_MAP_CELLS)
    throw new KineticsLimitError("x.n", `The map has ${cells} cells; the limit is ${MAX_MAP_CELLS}.`);
  const wavenumbers = options.wavenumbers ?? 200;
  if (!Number.isInteger(wavenumbers) || wavenumbers < 16 || wavenumbers > MAX_MAP_WAVENUMBERS) {
    throw new KineticsInputError(
      "wavenumbers",
      `wavenumbers must be an integer from 16 to ${MAX_MAP_WAVENUMBERS} (got ${wavenumbers}).`,
    );
  }
  if (cells * wavenumbers > MAX_MAP_WORK) {
    throw new KineticsLimitError(
      "wavenumbers",
      `The map needs ${cells * wavenumbers} dispersion evaluations (cells × wavenumbers); the limit is ${MAX_MAP_WORK}.`,
    );
  }
  const timeLimitMs = options.timeLimitMs ?? DEFAULT_MAP_TIME_LIMIT_MS;
  if (!(timeLimitMs > 0 && Number.isFinite(timeLimitMs)))
    throw new KineticsInputError("timeLimitMs", `timeLimitMs must be a positive number (got ${timeLimitMs}).`);
  const scales = resolveScales(kinetics, options);
  const fixed = { ...(options.parameters ?? {}) };
  delete fixed[x.name];
  delete fixed[y.name];
  const base = Array.from(resolveParameters(kinetics, fixed));
  let target: MapPlan["target"] = null;
  if (options.target) {
    const { wavelength, tolerance } = options.target;
    if (!(wavelength > 0 && Number.isFinite(wavelength)))
      throw new KineticsInputError(
        "target.wavelength",
        `target.wavelength must be a positive finite number (got ${wavelength}).`,
      );
    if (!(tolerance >= 0 && Number.isFinite(tolerance)))
      throw new KineticsInputError(
        "target.tolerance",
        `target.tolerance must be a non-negative finite number (got ${tolerance}).`,
      );
    const f = scales.lengthScaleUm ?? 1;
    target = { wavelength: wavelength / f, tolerance: tolerance / f };
  }
  return { x, y, base, wavenumbers, scales, target, timeLimitMs };
}

function planAxis(kinetics: CompiledKinetics, axis: MapAxis, field: "x" | "y"): MapPlan["x"] {
  if (!axis || typeof axis.name !== "string")
    throw new KineticsInputError(`${field}.name`, `${field} needs a parameter name.`);
  const index = parameterIndex(kinetics, axis.name, `${field}.name`);
  const spec = kinetics.parameters[index];
  const scale = axis.scale ?? "linear";
  if (scale !== "linear" && scale !== "log")
    throw new KineticsInputError(`${field}.scale`, `${field}.scale must be "linear" or "log".`);
  for (const end of ["min", "max"] as const) {
    const v = axis[end];
    if (typeof v !== "number" || !Number.isFinite(v))
      throw new KineticsInputError(`${field}.${end}`, `${field}.${end} must be a finite number (got ${String(v)}).`);
    if (v < spec.min || v > spec.max) {
      throw new KineticsInputError(
        `${field}.${end}`,
        `${field}.${end} = ${v} is outside the range of ${spec.name} [${spec.min}, ${spec.max}].`,
      );
    }
  }
  if (!(axis.max > axis.min))
    throw new KineticsInputError(`${field}.max`, `${field}.max must be larger than ${field}.min.`);
  if (scale === "log" && !(axis.min > 0))
    throw new KineticsInputError(`${field}.min`, `${field}.min must be positive on a log axis (got ${axis.min}).`);
  if (!Number.isInteger(axis.n) || axis.n < 2 || axis.n > MAX_MAP_CELLS) {
    throw new KineticsInputError(
      `${field}.n`,
      `${field}.n must be an integer from 2 to ${MAX_MAP_CELLS} (got ${axis.n}).`,
    );
  }
  const values = Array.from({ length: axis.n }, (_, i) => {
    const t = i / (axis.n - 1);
    return scale === "log" ? axis.min * Math.pow(axis.max / axis.min, t) : axis.min + t * (axis.max - axis.min);
  });
  values[axis.n - 1] = axis.max; // exact end point despite rounding
  return { name: axis.name, min: axis.min, max: axis.max, n: axis.n, scale, index, values };
}
