/**
 * A parameter varying along the tissue (linear, exponential decay from a source at x = 0, or
 * a table of position → value, linearly interpolated): the local dispersion relation at each
 * position, local predicted wavelength, and the regions where patterning is expected
 * (Turing class locally). A local (WKB-type) reading: valid when the parameter changes little
 * over one wavelength. Positions are µm when a length scale is known, else model units.
 */
import { KineticsInputError } from "../kinetics/errors";
import { parameterIndex } from "../kinetics/parameters";
import type { CompiledKinetics } from "../kinetics/types";
import { computeDispersion, type DispersionOptions } from "./compute-dispersion";
import { resolveScales } from "./scales";

export type GradientShape =
  | { kind: "linear"; from: number; to: number }
  | { kind: "exponential"; source: number; decayLength: number; floor?: number }
  | { kind: "table"; positions: number[]; values: number[] };

export interface GradientOptions extends Omit<DispersionOptions, "domain"> {
  parameter: string;
  profile: GradientShape;
  /** Tissue length (same unit as the positions). */
  length: number;
  /** Sample positions along the tissue. @default 101 */
  samples?: number;
}

export interface GradientPoint {
  x: number;
  value: number;
  classes: string[];
  wavelength: number | null;
  wavelengthUm: number | null;
  growthRate: number | null;
}

export interface GradientResult {
  parameter: string;
  points: GradientPoint[];
  /** Maximal runs of Turing positions [from, to] (position units). */
  patterningRegions: { from: number; to: number }[];
  positionUnits: "um" | "model";
}

/** Local dispersion along a parameter gradient. */
export function computeGradientDispersion(
  kinetics: CompiledKinetics,
  parameters: Record<string, number>,
  options: GradientOptions,
): GradientResult {
  const i = parameterIndex(kinetics, options.parameter, "parameter");
  const spec = kinetics.parameters[i];
  if (!(options.length > 0 && Number.isFinite(options.length)))
    throw new KineticsInputError("length", `length must be a positive finite number (got ${options.length}).`);
  const samples = options.samples ?? 101;
  if (!Number.isInteger(samples) || samples < 2 || samples > 10_000)
    throw new KineticsInputError("samples", `samples must be an integer from 2 to 10000 (got ${samples}).`);
  const valueAt = profileFunction(options.profile, options.length);
  const scales = resolveScales(kinetics, options);
  const points: GradientPoint[] = [];
  for (let s = 0; s < samples; s++) {
    const x = (options.length * s) / (samples - 1);
    const value = valueAt(x);
    if (!(value >= spec.min && value <= spec.max)) {
      points.push({ x, value, classes: ["invalid"], wavelength: null, wavelengthUm: null, growthRate: null });
      continue;
    }
    try {
      const r = computeDispersion(kinetics, { ...parameters, [spec.name]: value }, options);
      points.push({
        x,
        value,
        classes: r.classification.classes,
        wavelength: r.fastest?.wavelength ?? null,
        wavelengthUm: r.fastest?.wavelengthUm ?? null,
        growthRate: r.fastest?.sigmaStar ?? null,
      });
    } catch {
      points.push({ x, value, classes: ["no-steady-state"], wavelength: null, wavelengthUm: null, growthRate: null });
    }
  }
  const patterningRegions: GradientResult["patterningRegions"] = [];
  let start = -1;
  points.forEach((pt, j) => {
    const on = pt.classes.includes("turing");
    if (on && start < 0) start = j;
    if ((!on || j === points.length - 1) && start >= 0) {
      patterningRegions.push({ from: points[start].x, to: points[on ? j : j - 1].x });
      start = -1;
    }
  });
  return {
    parameter: spec.name,
    points,
    patterningRegions,
    positionUnits: scales.lengthScaleUm === null ? "model" : "um",
  };
}

function profileFunction(profile: GradientShape, length: number): (x: number) => number {
  const finite = (field: string, v: unknown) => {
    if (typeof v !== "number" || !Number.isFinite(v))
      throw new KineticsInputError(`profile.${field}`, `profile.${field} must be a finite number (got ${String(v)}).`);
    return v;
  };
  switch (profile?.kind) {
    case "linear": {
      const a = finite("from", profile.from),
        b = finite("to", profile.to);
      return (x) => a + ((b - a) * x) / length;
    }
    case "exponential": {
      const s = finite("source", profile.source),
        L = finite("decayLength", profile.decayLength),
        f = finite("floor", profile.floor ?? 0);
      if (!(L > 0))
        throw new KineticsInputError("profile.decayLength", `profile.decayLength must be positive (got ${L}).`);
      return (x) => f + s * Math.exp(-x / L);
    }
    case "table": {
      const xs = profile.positions,
        vs = profile.values;
      if (!Array.isArray(xs) || !Array.isArray(vs) || xs.length !== vs.length || xs.length < 2) {
        throw new KineticsInputError(
          "profile.positions",
          "profile.positions and profile.values must be lists of the same length (at least 2).",
        );
      }
      xs.forEach((x, j) => finite(`positions[${j}]`, x));
      vs.forEach((v, j) => finite(`values[${j}]`, v));
      for (let j = 1; j < xs.length; j++)
        if (!(xs[j] > xs[j - 1]))
          throw new KineticsInputError(`profile.positions[${j}]`, "profile.positions must increase strictly.");
      return (x) => {
        if (x <= xs[0]) return vs[0];
        if (x >= xs[xs.length - 1]) return vs[vs.length - 1];
        let j = 1;
        while (xs[j] < x) j++;
        const t = (x - xs[j - 1]) / (xs[j] - xs[j - 1]);
        return vs[j - 1] + t * (vs[j] - vs[j - 1]);
      };
    }
    default:
      throw new KineticsInputError("profile.kind", 'profile.kind must be "linear", "exponential" or "table".');
  }
}
