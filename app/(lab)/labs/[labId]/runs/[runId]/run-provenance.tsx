"use client";
import Link from "next/link";
import { Panel } from "@/components/ui/panel";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { formatSig } from "../../readouts/readout-format";
import { RunAdaptiveSteps } from "./run-adaptive-steps";

/** What was run, exactly: kinetics version, parameters, grid, step, seed, software; and the stored files. */
export function RunProvenance({ r, labId }: { r: RunDetailDto; labId: string }) {
  const s = r.spec,
    p = r.plan,
    tf = p.timeFactor ?? 1;
  const gridUnit = p.units === "dimensional" ? "µm" : "model length";
  return (
    <Panel title="Provenance">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-sm" data-testid="run-provenance">
        <dt className="text-ink-soft">Kinetics</dt>
        <dd>
          {r.kinetics.name}{" "}
          <span className="num text-ink-soft">
            {r.kinetics.kind === "lab"
              ? `lab kinetics, version ${r.kinetics.version}`
              : `catalogue “${r.kinetics.ref}”`}
          </span>{" "}
          · {p.classification} at these parameters
        </dd>
        <dt className="text-ink-soft">Parameters</dt>
        <dd className="num">
          {Object.entries(s.parameters)
            .map(([k, v]) => `${k} = ${v}`)
            .join(", ")}
          {s.spatialParameters ? ` · varying: ${Object.keys(s.spatialParameters).join(", ")}` : ""}
        </dd>
        <dt className="text-ink-soft">Grid</dt>
        <dd className="num">
          {r.gridLabel}
          {p.lengthFactor && p.units !== "dimensional" ? ` (ℓ = ${p.lengthFactor} µm)` : ""}
        </dd>
        <dt className="text-ink-soft">Time</dt>
        <dd className="num" data-testid="run-time-steps">
          end {formatSig(s.endTimeS * tf, 4)} {p.timeUnit}
          {s.stopWhenStationary ? ", or earlier when stationary" : ""}; {s.scheme};{" "}
          {s.adaptive ? (
            <RunAdaptiveSteps r={r} />
          ) : (
            <>
              step {formatSig(p.dtS * tf, 4)} {p.timeUnit} × {p.steps} (ρ = {formatSig(p.spectralRadiusPerS, 4)} per
              time unit, limit 0.1/ρ)
            </>
          )}
        </dd>
        {p.stationarity && (
          <>
            <dt className="text-ink-soft">Stationarity</dt>
            <dd className="text-sm">{p.stationarity}</dd>
          </>
        )}
        <dt className="text-ink-soft">Initial state</dt>
        <dd className="num" data-testid="run-initial-state">
          {p.startFrom ? (
            <>
              the final fields of the run{" "}
              <Link className="text-moss hover:underline" href={`/labs/${labId}/runs/${p.startFrom.runId}`}>
                {p.startFrom.name}
              </Link>{" "}
              (t = {formatSig(p.startFrom.timeS, 4)}, {p.startFrom.grid})
              {s.initial.noiseAmplitude
                ? ` + noise ± ${s.initial.noiseAmplitude}, seed ${s.initial.seed}`
                : ", no added noise"}
            </>
          ) : (
            <>
              steady state {p.species.map((n, i) => `${n}* = ${formatSig(p.steadyState[i], 5)}`).join(", ")} + noise
              {s.initial.noiseAmplitude !== undefined ? ` ± ${s.initial.noiseAmplitude}` : " ± 1 % of c*"}, seed{" "}
              {s.initial.seed}
            </>
          )}
        </dd>
        <dt className="text-ink-soft">Diffusion</dt>
        <dd className="num">
          {Array.isArray(p.diffusion[0])
            ? `cross-diffusion D = [${(p.diffusion as number[][]).map((row) => row.map((d) => formatSig(d, 4)).join(", ")).join("; ")}], simulated in the eigen-coordinates of D`
            : p.species.map((n, i) => `D_${n} = ${formatSig((p.diffusion as number[])[i], 4)}`).join(", ")}
        </dd>
        {r.result && (
          <>
            <dt className="text-ink-soft">Stopped</dt>
            <dd>
              {r.result.message}{" "}
              <span className="num text-ink-soft">
                (wall time {formatSig(r.result.wallS, 3)} s in a separate process)
              </span>
            </dd>
          </>
        )}
        {r.result && (
          <>
            <dt className="text-ink-soft">Final fields SHA-256</dt>
            <dd className="num break-all text-xs">
              {r.result.finalSha256.map((h, i) => `${p.species[i]}: ${h}`).join(" · ")}
            </dd>
          </>
        )}
        <dt className="text-ink-soft">Software</dt>
        <dd className="num">
          {r.softwareVersion}; grid lengths {gridUnit}
        </dd>
        <dt className="text-ink-soft">Files</dt>
        <dd className="text-sm">
          {r.files["run.json"] ? (
            <a className="text-moss hover:underline" href={r.files["run.json"]} download="RUN.json">
              RUN.json
            </a>
          ) : (
            "—"
          )}
          <span className="text-xs text-ink-soft">
            {" "}
            (run it again: <span className="num">npm run -s cli -- simulate --spec RUN.json --json</span>)
          </span>
          {p.species.map(
            (n, i) =>
              r.files[`initial-${i}.f64`] && (
                <span key={`i-${n}`}>
                  {" "}
                  ·{" "}
                  <a
                    className="text-moss hover:underline"
                    href={r.files[`initial-${i}.f64`]}
                    download={`initial-${i}.f64`}
                  >
                    initial {n} (initial-{i}.f64, next to RUN.json)
                  </a>
                </span>
              ),
          )}
          {p.species.map(
            (n, i) =>
              r.files[`final-${i}.f64`] && (
                <span key={n}>
                  {" "}
                  ·{" "}
                  <a className="text-moss hover:underline" href={r.files[`final-${i}.f64`]} download={`final-${n}.f64`}>
                    final {n} (float64, row-major)
                  </a>
                </span>
              ),
          )}
        </dd>
        <dt className="text-ink-soft">Run id</dt>
        <dd className="num text-xs">{r.id}</dd>
      </dl>
    </Panel>
  );
}
