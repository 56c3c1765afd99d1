"use client";
/** The run form's state: every field as typed, plus the choices that reset or prefill others. */
import { useState } from "react";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { RunChangePrefill } from "@/lib/server/runs/prefill";
import type { RunStartOption } from "@/lib/server/runs/start";

export interface RunPrefill {
  kinetics?: string;
  version?: string;
  parameters: Record<string, string>;
  lengthScaleUm?: string;
  timeScaleS?: string;
  /** Id of an earlier finished run whose final fields start this one. */
  startFrom?: string;
  /** Start from a finished fit: kinetics, parameters and scales come from it. */
  fit?: { fitId: string; condition: string; model: string; label: string };
  /**
   * From a fit: a side that holds about 8 of the condition's measured wavelengths (in model lengths
   * when the kinetics has a length scale), so the box neither cuts the pattern to one or two periods
   * nor needs a grid far beyond the cells offered (8 cells per period at 64 cells per axis).
   */
  sideLength?: string;
  /** "Change and run again": the earlier run's grid, time and initial state, and the run it links back to. */
  change?: Omit<
    RunChangePrefill,
    "kinetics" | "version" | "parameters" | "lengthScaleUm" | "timeScaleS" | "fit" | "startFrom"
  >;
}

export type RunDraft = ReturnType<typeof useRunDraft>;

/**
 * The form's first values: the defaults, a kinetics page's or fit's prefill, an earlier run to
 * continue (its grid), or a run being changed (its own grid, time and initial state). Pure, so
 * the filled-in form can be checked without a browser.
 */
export function startingRunFields(kinetics: KineticsInfoDto[], prefill: RunPrefill, earlierRuns: RunStartOption[]) {
  const id = kinetics.some((k) => k.id === prefill.kinetics) ? prefill.kinetics! : (kinetics[0]?.id ?? "");
  const info = kinetics.find((k) => k.id === id);
  const source0 = earlierRuns.find((r) => r.id === prefill.startFrom);
  // A changed run keeps its own grid; a run continuing another takes that run's grid.
  const g = prefill.change?.grid;
  const c = prefill.change;
  return {
    id,
    values: Object.fromEntries(
      (info?.parameters ?? []).map((p) => [p.name, prefill.parameters[p.name] ?? String(p.default)]),
    ) as Record<string, string>,
    startFrom: source0?.id ?? "",
    dims: (g?.dims ?? (source0 ? (source0.cells.length === 2 ? "2" : "1") : "2")) as "1" | "2",
    lx: g?.lx ?? (source0 ? String(source0.lengthUm[0]) : (prefill.sideLength ?? "100")),
    ly: g?.ly ?? (source0?.lengthUm[1] !== undefined ? String(source0.lengthUm[1]) : (prefill.sideLength ?? "100")),
    cells: g?.cells ?? (source0 ? String(source0.cells[0]) : "64"),
    boundary: (g?.boundary ?? source0?.boundary ?? "zero-flux") as "zero-flux" | "periodic",
    endTime: c?.endTime ?? "300",
    dt: c?.dt ?? "",
    // Runs stop when stationary unless asked not to (the solver's default).
    stationary: c?.stationary ?? true,
    seed: c?.seed ?? "",
    noise: c?.noise ?? "",
    snapshots: c?.snapshots ?? "9",
    lengthScale: prefill.lengthScaleUm ?? "",
    timeScale: prefill.timeScaleS ?? "",
    gradParam: c?.gradient?.parameter ?? "",
    gradFrom: c?.gradient?.from ?? "",
    gradTo: c?.gradient?.to ?? "",
  };
}

export function useRunDraft(kinetics: KineticsInfoDto[], prefill: RunPrefill, earlierRuns: RunStartOption[]) {
  const [s0] = useState(() => startingRunFields(kinetics, prefill, earlierRuns));
  const [id, setId] = useState(s0.id);
  const info = kinetics.find((k) => k.id === id);
  const [values, setValues] = useState<Record<string, string>>(s0.values);
  const [startFrom, setStartFrom] = useState(s0.startFrom);
  const source = earlierRuns.find((r) => r.id === startFrom);
  const [dims, setDims] = useState<"1" | "2">(s0.dims);
  const [lx, setLx] = useState(s0.lx),
    [ly, setLy] = useState(s0.ly);
  const [cells, setCells] = useState(s0.cells);
  const [boundary, setBoundary] = useState<"zero-flux" | "periodic">(s0.boundary);
  const [endTime, setEndTime] = useState(s0.endTime),
    [dt, setDt] = useState(s0.dt),
    [stationary, setStationary] = useState(s0.stationary);
  const [seed, setSeed] = useState(s0.seed),
    [noise, setNoise] = useState(s0.noise),
    [snapshots, setSnapshots] = useState(s0.snapshots);
  const [lengthScale, setLengthScale] = useState(s0.lengthScale),
    [timeScale, setTimeScale] = useState(s0.timeScale);
  const [gradParam, setGradParam] = useState(s0.gradParam),
    [gradFrom, setGradFrom] = useState(s0.gradFrom),
    [gradTo, setGradTo] = useState(s0.gradTo);
  const dimensional = info?.units === "dimensional";
  const lengthUnit = dimensional ? "µm" : "model length";
  const timeUnit = dimensional ? "s" : "model time";

  // A chosen initial field needs the earlier run's cells: take its grid (lengths stay editable).
  const chooseStart = (next: string) => {
    setStartFrom(next);
    const r = earlierRuns.find((x) => x.id === next);
    if (!r) return;
    setDims(r.cells.length === 2 ? "2" : "1");
    setCells(String(r.cells[0]));
    setLx(String(r.lengthUm[0]));
    if (r.lengthUm[1] !== undefined) setLy(String(r.lengthUm[1]));
    setBoundary(r.boundary);
  };

  const choose = (next: string) => {
    setId(next);
    const k = kinetics.find((x) => x.id === next);
    setValues(Object.fromEntries((k?.parameters ?? []).map((p) => [p.name, String(p.default)])));
    setGradParam("");
  };

  return {
    id,
    info,
    values,
    setValues,
    startFrom,
    source,
    dims,
    setDims,
    lx,
    setLx,
    ly,
    setLy,
    cells,
    setCells,
    boundary,
    setBoundary,
    endTime,
    setEndTime,
    dt,
    setDt,
    stationary,
    setStationary,
    seed,
    setSeed,
    noise,
    setNoise,
    snapshots,
    setSnapshots,
    lengthScale,
    setLengthScale,
    timeScale,
    setTimeScale,
    gradParam,
    setGradParam,
    gradFrom,
    setGradFrom,
    gradTo,
    setGradTo,
    dimensional,
    lengthUnit,
    timeUnit,
    chooseStart,
    choose,
  };
}
