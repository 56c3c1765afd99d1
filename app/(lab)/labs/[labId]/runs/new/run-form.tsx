"use client";
/** The run form: kinetics and parameters (prefilled from a kinetics page), grid, time, seed, snapshots, an optional gradient. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { ApiError, sendJson } from "@/lib/client/api";
import type { KineticsInfoDto } from "@/lib/server/kinetics/kinetics";
import type { RunDetailDto } from "@/lib/server/runs/types";
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

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";
const CELLS = [16, 32, 64, 128, 256, 512, 1024, 2048];
const num = (s: string) => (s.trim() === "" ? undefined : Number(s));

function Label({ text, children }: { text: React.ReactNode; children: React.ReactNode }) {
  return (
    <label className="block text-xs text-ink-soft">
      {text}
      {children}
    </label>
  );
}

export function RunForm({
  labId,
  kinetics,
  prefill,
  limits,
  earlierRuns,
}: {
  labId: string;
  kinetics: KineticsInfoDto[];
  prefill: RunPrefill;
  limits: string[];
  earlierRuns: RunStartOption[];
}) {
  const router = useRouter();
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
    [stationary, setStationary] = useState(false);
  const [seed, setSeed] = useState(""),
    [noise, setNoise] = useState(""),
    [snapshots, setSnapshots] = useState("9");
  const [lengthScale, setLengthScale] = useState(prefill.lengthScaleUm ?? ""),
    [timeScale, setTimeScale] = useState(prefill.timeScaleS ?? "");
  const [gradParam, setGradParam] = useState(""),
    [gradFrom, setGradFrom] = useState(""),
    [gradTo, setGradTo] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
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

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!info) return;
    setBusy(true);
    setError(null);
    const body = {
      kinetics: info.id,
      ...(info.version ? { version: info.version } : {}),
      parameters: Object.fromEntries(Object.entries(values).map(([k, v]) => [k, Number(v)])),
      grid: {
        lengthUm: dims === "2" ? [Number(lx), Number(ly)] : [Number(lx)],
        cells: dims === "2" ? [Number(cells), Number(cells)] : [Number(cells)],
        boundary,
      },
      endTimeS: Number(endTime),
      dtS: num(dt),
      stopWhenStationary: stationary,
      seed: num(seed),
      noiseAmplitude: num(noise),
      snapshots: num(snapshots),
      ...(startFrom ? { startFrom: { runId: startFrom } } : {}),
      ...(gradParam
        ? {
            gradient: { parameter: gradParam, profile: { kind: "linear", from: Number(gradFrom), to: Number(gradTo) } },
          }
        : {}),
      ...(!dimensional ? { lengthScaleUm: num(lengthScale), timeScaleS: num(timeScale) } : {}),
      ...(prefill.fit
        ? { fit: { fitId: prefill.fit.fitId, condition: prefill.fit.condition, model: prefill.fit.model } }
        : {}),
    };
    try {
      const run = await sendJson<RunDetailDto>("POST", `/api/v1/labs/${labId}/runs`, body);
      router.push(`/labs/${labId}/runs/${run.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : String(err));
      setBusy(false);
    }
  }

  if (kinetics.length === 0) return <Notice>No kinetics to simulate. Open Kinetics and add one.</Notice>;
  return (
    <form onSubmit={submit} className="space-y-5" data-testid="run-form">
      <div className="grid gap-5 lg:grid-cols-3">
        <Panel title="Kinetics and parameters">
          {prefill.fit && (
            <p className="mb-2 text-xs text-ink-soft" data-testid="run-from-fit">
              From the fit {prefill.fit.label}. Kinetics, parameters and scales are the fit&apos;s.
            </p>
          )}
          <select
            className={field}
            value={id}
            disabled={!!prefill.fit}
            onChange={(e) => choose(e.target.value)}
            data-testid="run-kinetics"
          >
            {kinetics.map((k) => (
              <option key={k.id} value={k.id}>
                {k.name}
                {k.version ? ` (lab, v${k.version})` : ""}
              </option>
            ))}
          </select>
          <div className="mt-3 space-y-2">
            {info?.parameters.map((p) => (
              <Label
                key={p.name}
                text={
                  <>
                    <span className="num font-medium text-ink">{p.name}</span>{" "}
                    <span className="num">
                      [{p.min ?? "−∞"}, {p.max ?? "∞"}]{p.unit && p.unit !== "1" ? ` ${p.unit}` : ""}
                    </span>
                  </>
                }
              >
                <input
                  className={field}
                  value={values[p.name] ?? ""}
                  disabled={!!prefill.fit}
                  onChange={(e) => setValues((v) => ({ ...v, [p.name]: e.target.value }))}
                  data-testid={`run-param-${p.name}`}
                />
              </Label>
            ))}
          </div>
          {!dimensional && (
            <div className="mt-3 grid grid-cols-2 gap-2 border-t border-rule pt-3">
              <p className="col-span-2 text-xs text-ink-soft">
                Non-dimensional kinetics: sizes and times below are model units; ℓ and τ turn results into µm and s.
              </p>
              <Label text="length scale ℓ (µm)">
                <input
                  className={field}
                  value={lengthScale}
                  placeholder="none"
                  disabled={!!prefill.fit}
                  onChange={(e) => setLengthScale(e.target.value)}
                  data-testid="run-length-scale"
                />
              </Label>
              <Label text="time scale τ (s)">
                <input
                  className={field}
                  value={timeScale}
                  placeholder="none"
                  disabled={!!prefill.fit}
                  onChange={(e) => setTimeScale(e.target.value)}
                  data-testid="run-time-scale"
                />
              </Label>
            </div>
          )}
        </Panel>
        <Panel title="Domain and time">
          <div className="grid grid-cols-2 gap-2">
            <Label text="domain">
              <select
                className={field}
                value={dims}
                onChange={(e) => setDims(e.target.value as "1" | "2")}
                data-testid="run-dims"
              >
                <option value="2">rectangle (2-D)</option>
                <option value="1">interval (1-D)</option>
              </select>
            </Label>
            <Label text="boundary">
              <select
                className={field}
                value={boundary}
                onChange={(e) => setBoundary(e.target.value as "zero-flux" | "periodic")}
              >
                <option value="zero-flux">zero-flux</option>
                <option value="periodic">periodic</option>
              </select>
            </Label>
            <Label text={`${dims === "2" ? "Lx" : "L"} (${lengthUnit})`}>
              <input className={field} value={lx} onChange={(e) => setLx(e.target.value)} data-testid="run-lx" />
            </Label>
            {dims === "2" ? (
              <Label text={`Ly (${lengthUnit})`}>
                <input className={field} value={ly} onChange={(e) => setLy(e.target.value)} data-testid="run-ly" />
              </Label>
            ) : (
              <span />
            )}
            <Label text={`cells per axis${dims === "2" ? " (n × n)" : ""}`}>
              <select
                className={field}
                value={cells}
                onChange={(e) => setCells(e.target.value)}
                data-testid="run-cells"
              >
                {CELLS.map((n) => (
                  <option key={n} value={n}>
                    {n}
                  </option>
                ))}
              </select>
            </Label>
            <Label text={`end time (${timeUnit})`}>
              <input
                className={field}
                value={endTime}
                onChange={(e) => setEndTime(e.target.value)}
                data-testid="run-end-time"
              />
            </Label>
            <Label text={`step cap (${timeUnit}, optional)`}>
              <input className={field} value={dt} placeholder="0.1/ρ" onChange={(e) => setDt(e.target.value)} />
            </Label>
            <label className="flex items-end gap-2 pb-1 text-xs text-ink-soft">
              <input type="checkbox" checked={stationary} onChange={(e) => setStationary(e.target.checked)} /> stop when
              stationary
            </label>
          </div>
        </Panel>
        <Panel title="Initial state and output">
          <Label text="start from">
            <select
              className={field}
              value={startFrom}
              onChange={(e) => chooseStart(e.target.value)}
              data-testid="run-start-from"
            >
              <option value="">steady state c* + seeded noise</option>
              {earlierRuns.map((r) => (
                <option key={r.id} value={r.id}>
                  final pattern of “{r.name}” ({r.cells.join("×")}, {r.species.join(", ")})
                </option>
              ))}
            </select>
          </Label>
          {source && (
            <p className="mt-1 text-xs text-ink-soft" data-testid="run-start-note">
              Starts from the final fields of “{source.name}” ({source.kineticsName}, t = {source.timeS}); the grid
              below is set to its {source.cells.join(" × ")} cells. Noise is added only if you give an amplitude.
            </p>
          )}
          {source && info?.species.length !== source.species.length && (
            <Notice tone="warning">This kinetics has a different number of species than that run.</Notice>
          )}
          <div className="mt-3 grid grid-cols-2 gap-2">
            <Label text="seed (blank: random, recorded)">
              <input
                className={field}
                value={seed}
                placeholder="random"
                onChange={(e) => setSeed(e.target.value)}
                data-testid="run-seed"
              />
            </Label>
            <Label text="noise amplitude">
              <input
                className={field}
                value={noise}
                placeholder={startFrom ? "0 (none)" : "1 % of c*"}
                onChange={(e) => setNoise(e.target.value)}
                data-testid="run-noise"
              />
            </Label>
            <Label text="snapshots (2 … 24)">
              <input
                className={field}
                value={snapshots}
                onChange={(e) => setSnapshots(e.target.value)}
                data-testid="run-snapshots"
              />
            </Label>
          </div>
          <div className="mt-3 grid grid-cols-3 gap-2 border-t border-rule pt-3">
            <p className="col-span-3 text-xs text-ink-soft">
              Optional: one parameter varying linearly along x (from x = 0 to x = L).
            </p>
            <Label text="parameter">
              <select
                className={field}
                value={gradParam}
                onChange={(e) => setGradParam(e.target.value)}
                data-testid="run-gradient-parameter"
              >
                <option value="">none</option>
                {info?.parameters.map((p) => (
                  <option key={p.name} value={p.name}>
                    {p.name}
                  </option>
                ))}
              </select>
            </Label>
            <Label text="at x = 0">
              <input
                className={field}
                value={gradFrom}
                disabled={!gradParam}
                onChange={(e) => setGradFrom(e.target.value)}
              />
            </Label>
            <Label text="at x = L">
              <input
                className={field}
                value={gradTo}
                disabled={!gradParam}
                onChange={(e) => setGradTo(e.target.value)}
              />
            </Label>
          </div>
        </Panel>
      </div>
      {error && (
        <Notice tone="error" testId="run-error">
          {error}
        </Notice>
      )}
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={busy} data-testid="start-run">
          {busy ? "Checking…" : "Start run"}
        </Button>
        <ul className="text-xs text-ink-soft">
          {limits.map((l) => (
            <li key={l}>Limit: {l}.</li>
          ))}
        </ul>
      </div>
    </form>
  );
}
