"use client";
/** The run form's state: every field as typed, plus the choices that reset or prefill others. */
import { useState } from "react";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
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
}

export type RunDraft = ReturnType<typeof useRunDraft>;

export function useRunDraft(kinetics: KineticsInfoDto[], prefill: RunPrefill, earlierRuns: RunStartOption[]) {
  const [id, setId] = useState(
    kinetics.some((k) => k.id === prefill.kinetics) ? prefill.kinetics! : (kinetics[0]?.id ?? ""),
  );
  const info = kinetics.find((k) => k.id === id);
  const [values, setValues] = useState<Record<string, string>>(() =>
    Object.fromEntries((info?.parameters ?? []).map((p) => [p.name, prefill.parameters[p.name] ?? String(p.default)])),
  );
  const source0 = earlierRuns.find((r) => r.id === prefill.startFrom);
  const [startFrom, setStartFrom] = useState(source0?.id ?? "");
  const source = earlierRuns.find((r) => r.id === startFrom);
  const [dims, setDims] = useState<"1" | "2">(source0 ? (source0.cells.length === 2 ? "2" : "1") : "2");
  const [lx, setLx] = useState(source0 ? String(source0.lengthUm[0]) : "100"),
    [ly, setLy] = useState(source0?.lengthUm[1] !== undefined ? String(source0.lengthUm[1]) : "100");
  const [cells, setCells] = useState(source0 ? String(source0.cells[0]) : "64");
  const [boundary, setBoundary] = useState<"zero-flux" | "periodic">(source0?.boundary ?? "zero-flux");
  const [endTime, setEndTime] = useState("300"),
    [dt, setDt] = useState(""),
    [stationary, setStationary] = useState(true);
  const [seed, setSeed] = useState(""),
    [noise, setNoise] = useState(""),
    [snapshots, setSnapshots] = useState("9");
  const [lengthScale, setLengthScale] = useState(prefill.lengthScaleUm ?? ""),
    [timeScale, setTimeScale] = useState(prefill.timeScaleS ?? "");
  const [gradParam, setGradParam] = useState(""),
    [gradFrom, setGradFrom] = useState(""),
    [gradTo, setGradTo] = useState("");
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
