"use client";
/** The kinetics editor's diffusion: one diffusivity per species, or a full matrix for cross-diffusion. */
import { Panel } from "@/components/ui/panel";
import type { KineticsDraft } from "./kinetics-draft";
import { mono } from "./kinetics-input-class";

export function KineticsDiffusionPanel({ d, set }: { d: KineticsDraft; set: (patch: Partial<KineticsDraft>) => void }) {
  const n = d.species.length;
  return (
    <Panel title="Diffusion">
      <div className="mb-3 flex gap-4 text-sm">
        <label className="flex items-center gap-1.5">
          <input
            type="radio"
            checked={d.diffusionMode === "diagonal"}
            onChange={() => set({ diffusionMode: "diagonal" })}
          />{" "}
          diagonal (one diffusivity per species)
        </label>
        <label className="flex items-center gap-1.5">
          <input
            type="radio"
            checked={d.diffusionMode === "full"}
            onChange={() => set({ diffusionMode: "full" })}
            data-testid="diffusion-full"
          />{" "}
          full matrix (cross-diffusion)
        </label>
      </div>
      <p className="mb-2 text-xs text-ink-soft">
        Numbers or expressions in the parameters (not the species); µm²/s for a dimensional kinetics.
      </p>
      {d.diffusionMode === "diagonal" ? (
        <div className="flex flex-wrap gap-3">
          {d.species.map((s, i) => (
            <label key={i} className="block w-36 space-y-1">
              <span className="num text-sm">
                D<sub>{s.name || i + 1}</sub>
              </span>
              <input
                className={mono}
                value={d.diagonal[i] ?? ""}
                onChange={(e) => set({ diagonal: d.diagonal.map((x, j) => (j === i ? e.target.value : x)) })}
                data-testid={`diffusion-${i}`}
              />
            </label>
          ))}
        </div>
      ) : (
        <div className="inline-grid gap-2" style={{ gridTemplateColumns: `repeat(${n}, 7rem)` }}>
          {d.full.map((row, i) =>
            row.map((v, j) => (
              <input
                key={`${i}-${j}`}
                className={mono}
                value={v}
                aria-label={`D ${i + 1},${j + 1}`}
                onChange={(e) =>
                  set({ full: d.full.map((r, a) => (a === i ? r.map((x, b) => (b === j ? e.target.value : x)) : r)) })
                }
                data-testid={`diffusion-${i}-${j}`}
              />
            )),
          )}
        </div>
      )}
    </Panel>
  );
}
