/**
 * Turing-space map: sweep two parameters, classify each cell, predicted wavelength per cell,
 * fraction of the box that is Turing unstable, and the cells/contour where the wavelength
 * equals a target ± tolerance. In-process; `lib/parallel` runs the same rows on worker threads.
 */
import type { CompiledKinetics } from "../kinetics/types";
import { CLASS_LEGEND, classOf, isTuring, MAP_CLASSES } from "./classes";
import { contourSegments } from "./map-contour";
import { planTuringMap, type MapPlan, type TuringMapOptions } from "./map-plan";
import { computeMapRows, type MapRows } from "./map-rows";

export interface TuringMapResult {
  kinetics: { id: string; name: string };
  x: { name: string; scale: "linear" | "log"; values: number[] };
  y: { name: string; scale: "linear" | "log"; values: number[] };
  nx: number;
  ny: number;
  /** Class flags per cell, row-major: index iy·nx + ix (see CLASS_LEGEND; bits combine). */
  classes: Uint8Array;
  /** Predicted wavelength 2π/k* per cell, model units (NaN where no k > 0 maximum grows). */
  wavelength: Float64Array;
  /** Growth rate at k* per cell, model units (NaN where none). */
  sigmaStar: Float64Array;
  /** ℓ: multiply `wavelength` by this for µm (null without a length scale). */
  lengthScaleUm: number | null;
  timeScaleS: number | null;
  /** Fraction of the cells that are Turing (stable at k = 0, unstable at some k > 0; see isTuring). */
  turingFraction: number;
  /** Cells per exclusive class (see classOf and MAP_CLASSES); they add up to nx·ny. */
  counts: Record<string, number>;
  target: null | {
    /** Target and tolerance in model units (µm = × lengthScaleUm). */
    wavelength: number;
    tolerance: number;
    /** 1 where the cell is Turing and its wavelength is within target ± tolerance. */
    match: Uint8Array;
    matchCount: number;
    /** Segments [x1, y1, x2, y2] in parameter values where the wavelength equals the target. */
    contour: [number, number, number, number][];
  };
  legend: Record<string, number>;
  elapsedMs: number;
  workers: number;
}

/** Computes a map in this thread. */
export function computeTuringMap(kinetics: CompiledKinetics, options: TuringMapOptions): TuringMapResult {
  const t0 = Date.now();
  const plan = planTuringMap(kinetics, options);
  const rows = computeMapRows(kinetics, plan, 0, plan.y.n, t0);
  return summariseTuringMap(kinetics, plan, [rows], Date.now() - t0, 0);
}

/** Assembles row blocks (from this thread or workers) into the map result. */
export function summariseTuringMap(
  kinetics: Pick<CompiledKinetics, "id" | "name">,
  plan: MapPlan,
  blocks: MapRows[],
  elapsedMs: number,
  workers: number,
): TuringMapResult {
  const nx = plan.x.n,
    ny = plan.y.n,
    size = nx * ny;
  const classes = new Uint8Array(size),
    wavelength = new Float64Array(size),
    sigmaStar = new Float64Array(size);
  for (const b of blocks) {
    classes.set(b.classes, b.y0 * nx);
    wavelength.set(b.wavelength, b.y0 * nx);
    sigmaStar.set(b.sigmaStar, b.y0 * nx);
  }
  const counts: Record<string, number> = Object.fromEntries(MAP_CLASSES.map((c) => [c.name, 0]));
  for (let i = 0; i < size; i++) counts[classOf(classes[i])]++;
  let target: TuringMapResult["target"] = null;
  if (plan.target) {
    const { wavelength: lt, tolerance } = plan.target;
    const match = new Uint8Array(size);
    const field = new Float64Array(size);
    let matchCount = 0;
    for (let i = 0; i < size; i++) {
      const turing = isTuring(classes[i]);
      field[i] = turing ? wavelength[i] - lt : NaN;
      if (turing && Math.abs(wavelength[i] - lt) <= tolerance) {
        match[i] = 1;
        matchCount++;
      }
    }
    const toX = axisMapper(plan.x),
      toY = axisMapper(plan.y);
    const contour = contourSegments(field, nx, ny).map(([a, b, c, d]): [number, number, number, number] => [
      toX(a),
      toY(b),
      toX(c),
      toY(d),
    ]);
    target = { wavelength: lt, tolerance, match, matchCount, contour };
  }
  return {
    kinetics: { id: kinetics.id, name: kinetics.name },
    x: { name: plan.x.name, scale: plan.x.scale, values: plan.x.values },
    y: { name: plan.y.name, scale: plan.y.scale, values: plan.y.values },
    nx,
    ny,
    classes,
    wavelength,
    sigmaStar,
    lengthScaleUm: plan.scales.lengthScaleUm,
    timeScaleS: plan.scales.timeScaleS,
    turingFraction: counts.turing / size,
    counts,
    target,
    legend: CLASS_LEGEND,
    elapsedMs,
    workers,
  };
}

/** Fractional cell index → parameter value (geometric between cells on a log axis). */
function axisMapper(axis: MapPlan["x"]): (t: number) => number {
  return (t) => {
    const i = Math.min(Math.floor(t), axis.n - 2),
      f = t - i;
    const a = axis.values[i],
      b = axis.values[i + 1];
    return axis.scale === "log" ? a * Math.pow(b / a, f) : a + f * (b - a);
  };
}
