/**
 * Interactive Turing-space maps: in-process, at most MAX_INTERACTIVE_MAP_CELLS cells ×
 * MAX_INTERACTIVE_MAP_WAVENUMBERS wavenumbers and INTERACTIVE_MAP_TIME_LIMIT_MS of compute, so one
 * request never holds the server for more than about a second. Larger maps answer 413 naming the limit.
 */
import "server-only";
import { computeTuringMap } from "@/lib/stability";
import {
  INTERACTIVE_MAP_TIME_LIMIT_MS,
  MAX_INTERACTIVE_MAP_CELLS,
  MAX_INTERACTIVE_MAP_WAVENUMBERS,
  type TuringMapRequest,
} from "@/lib/contracts/kinetics";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { resolveAnalysisKinetics } from "./analyses";
import type { KineticsInfoDto } from "./catalogue";
import { withKineticsErrors } from "./engine";

export interface TuringMapDto {
  info: KineticsInfoDto;
  x: { name: string; scale: "linear" | "log"; values: number[] };
  y: { name: string; scale: "linear" | "log"; values: number[] };
  nx: number;
  ny: number;
  /** Class flags per cell, row-major (index iy·nx + ix); see `legend`. */
  classes: number[];
  /** Predicted wavelength 2π/k* per cell, model units; null where no k > 0 mode grows. */
  wavelength: (number | null)[];
  lengthScaleUm: number | null;
  turingFraction: number;
  counts: Record<string, number>;
  target: null | {
    wavelength: number;
    tolerance: number;
    match: number[];
    matchCount: number;
    contour: [number, number, number, number][];
  };
  legend: Record<string, number>;
  elapsedMs: number;
}

export async function analyseTuringMap(ctx: LabContext, req: TuringMapRequest): Promise<TuringMapDto> {
  const cells = req.x.n * req.y.n;
  if (cells > MAX_INTERACTIVE_MAP_CELLS) {
    throw new AppError(
      "too_large",
      `The map has ${req.x.n} × ${req.y.n} = ${cells} cells; an interactive map has at most ${MAX_INTERACTIVE_MAP_CELLS} (e.g. 200 × 200).`,
      { field: "x.n" },
    );
  }
  const wavenumbers = req.wavenumbers ?? 120;
  if (wavenumbers > MAX_INTERACTIVE_MAP_WAVENUMBERS) {
    throw new AppError(
      "too_large",
      `wavenumbers: ${wavenumbers} asked; an interactive map has at most ${MAX_INTERACTIVE_MAP_WAVENUMBERS} per cell.`,
      { field: "wavenumbers" },
    );
  }
  const { compiled, info } = await resolveAnalysisKinetics(ctx, req.kinetics, req.version);
  const r = withKineticsErrors(() =>
    computeTuringMap(compiled, {
      x: req.x,
      y: req.y,
      parameters: req.parameters,
      wavenumbers,
      target: req.target,
      lengthScaleUm: req.lengthScaleUm,
      timeScaleS: req.timeScaleS,
      timeLimitMs: INTERACTIVE_MAP_TIME_LIMIT_MS,
    }),
  );
  return {
    info,
    x: r.x,
    y: r.y,
    nx: r.nx,
    ny: r.ny,
    classes: Array.from(r.classes),
    wavelength: Array.from(r.wavelength, (v) => (Number.isFinite(v) ? v : null)),
    lengthScaleUm: r.lengthScaleUm,
    turingFraction: r.turingFraction,
    counts: r.counts,
    target: r.target
      ? {
          wavelength: r.target.wavelength,
          tolerance: r.target.tolerance,
          match: Array.from(r.target.match),
          matchCount: r.target.matchCount,
          contour: r.target.contour,
        }
      : null,
    legend: r.legend,
    elapsedMs: r.elapsedMs,
  };
}
