"use client";
/** The run form's initial state (steady state or an earlier run's final fields), seed, noise, snapshots and gradient. */
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { RunStartOption } from "@/lib/server/runs/start";
import { field, Label } from "./run-form-label";
import type { RunDraft } from "./use-run-draft";

export function RunInitialPanel({ d, earlierRuns }: { d: RunDraft; earlierRuns: RunStartOption[] }) {
  const { info, source, startFrom, gradParam } = d;
  return (
    <Panel title="Initial state and output">
      <Label text="start from">
        <select
          className={field}
          value={startFrom}
          onChange={(e) => d.chooseStart(e.target.value)}
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
          Starts from the final fields of “{source.name}” ({source.kineticsName}, t = {source.timeS}); the grid below is
          set to its {source.cells.join(" × ")} cells. Noise is added only if you give an amplitude.
        </p>
      )}
      {source && info?.species.length !== source.species.length && (
        <Notice tone="warning">This kinetics has a different number of species than that run.</Notice>
      )}
      <div className="mt-3 grid grid-cols-2 gap-2">
        <Label text="seed (blank: random, recorded)">
          <input
            className={field}
            value={d.seed}
            placeholder="random"
            onChange={(e) => d.setSeed(e.target.value)}
            data-testid="run-seed"
          />
        </Label>
        <Label text="noise amplitude">
          <input
            className={field}
            value={d.noise}
            placeholder={startFrom ? "0 (none)" : "1 % of c*"}
            onChange={(e) => d.setNoise(e.target.value)}
            data-testid="run-noise"
          />
        </Label>
        <Label text="snapshots (2 … 24)">
          <input
            className={field}
            value={d.snapshots}
            onChange={(e) => d.setSnapshots(e.target.value)}
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
            onChange={(e) => d.setGradParam(e.target.value)}
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
            value={d.gradFrom}
            disabled={!gradParam}
            onChange={(e) => d.setGradFrom(e.target.value)}
          />
        </Label>
        <Label text="at x = L">
          <input
            className={field}
            value={d.gradTo}
            disabled={!gradParam}
            onChange={(e) => d.setGradTo(e.target.value)}
          />
        </Label>
      </div>
    </Panel>
  );
}
