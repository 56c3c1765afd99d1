"use client";
/**
 * Writing a lab kinetics: 2–6 species with a reaction term each, named parameters (default,
 * range, meaning) and diffusion (diagonal or a full matrix for cross-diffusion). The server
 * validates and compiles; its message names the field. Each save is a new version.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { ApiError, sendJson } from "@/lib/client/api";
import type { LabKineticsDto } from "@/lib/server/kinetics/kinetics";
import {
  definitionFromDraft,
  MAX_SPECIES,
  MIN_SPECIES,
  resizeDiffusion,
  type KineticsDraft,
  type ParameterDraft,
} from "./kinetics-draft";

const input =
  "w-full rounded-md border border-rule bg-card px-2 py-1.5 text-sm text-ink focus:border-moss focus:outline-none";
const mono = `${input} num`;

export function KineticsEditor({
  labId,
  initial,
  kineticsId,
  nextVersion,
}: {
  labId: string;
  initial: KineticsDraft;
  kineticsId?: string;
  nextVersion: number;
}) {
  const router = useRouter();
  const [d, setD] = useState<KineticsDraft>(initial);
  const [error, setError] = useState<{ message: string; field?: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (patch: Partial<KineticsDraft>) => setD((x) => ({ ...x, ...patch }));
  const n = d.species.length;

  function setSpecies(i: number, patch: Partial<KineticsDraft["species"][number]>) {
    set({ species: d.species.map((s, j) => (j === i ? { ...s, ...patch } : s)) });
  }
  function setParam(i: number, patch: Partial<ParameterDraft>) {
    set({ parameters: d.parameters.map((p, j) => (j === i ? { ...p, ...patch } : p)) });
  }
  function resizeSpecies(species: KineticsDraft["species"]) {
    set({ species, ...resizeDiffusion(d, species.length) });
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      const body = { description: d.description.trim() || null, definition: definitionFromDraft(d) };
      const saved = kineticsId
        ? await sendJson<LabKineticsDto>("PATCH", `/api/v1/labs/${labId}/kinetics/${kineticsId}`, body)
        : await sendJson<LabKineticsDto>("POST", `/api/v1/labs/${labId}/kinetics`, body);
      router.push(`/labs/${labId}/kinetics/${saved.id}`);
      router.refresh();
    } catch (err) {
      setError(
        err instanceof ApiError
          ? { message: err.message, field: (err.details as { field?: string } | undefined)?.field }
          : { message: "Could not save the kinetics." },
      );
      setBusy(false);
    }
  }

  return (
    <form onSubmit={save} className="space-y-5" noValidate data-testid="kinetics-form">
      <Panel title="Name and units">
        <div className="grid gap-4 md:grid-cols-3">
          <label className="block space-y-1 md:col-span-2">
            <span className="text-sm font-medium">Name</span>
            <input
              className={input}
              value={d.name}
              onChange={(e) => set({ name: e.target.value })}
              placeholder="e.g. Activator–inhibitor with saturation"
              data-testid="kinetics-name"
            />
          </label>
          <label className="block space-y-1">
            <span className="text-sm font-medium">Units</span>
            <select
              className={input}
              value={d.units}
              onChange={(e) => set({ units: e.target.value as KineticsDraft["units"] })}
              data-testid="kinetics-units"
            >
              <option value="non-dimensional">non-dimensional (give ℓ µm and τ s when analysing)</option>
              <option value="dimensional">dimensional (D in µm²/s, rates in 1/s)</option>
            </select>
          </label>
          <label className="block space-y-1 md:col-span-2">
            <span className="text-sm font-medium">Description (optional)</span>
            <input
              className={input}
              value={d.description}
              onChange={(e) => set({ description: e.target.value })}
              placeholder="where the equations come from, what was changed"
            />
          </label>
          <label className="flex items-center gap-2 pt-6 text-sm">
            <input type="checkbox" checked={d.nonNegative} onChange={(e) => set({ nonNegative: e.target.checked })} />{" "}
            species are concentrations (only steady states ≥ 0 count)
          </label>
        </div>
      </Panel>

      <Panel
        title={`Species and reactions (${n} of ${MIN_SPECIES}–${MAX_SPECIES})`}
        actions={
          <Button
            size="sm"
            variant="secondary"
            disabled={n >= MAX_SPECIES}
            onClick={() => resizeSpecies([...d.species, { name: "", reaction: "" }])}
            data-testid="add-species"
          >
            Add species
          </Button>
        }
      >
        <p className="mb-3 text-xs text-ink-soft">
          Write ∂c/∂t without diffusion, e.g. <span className="num">a - u + u^2 * v</span>. Allowed: numbers, species,
          parameters, + − * / ^ and functions such as exp, sqrt, min, max.
        </p>
        <div className="space-y-2">
          {d.species.map((s, i) => (
            <div key={i} className="grid grid-cols-[8rem_1fr_auto] items-center gap-2">
              <input
                className={mono}
                value={s.name}
                onChange={(e) => setSpecies(i, { name: e.target.value })}
                aria-label={`Species ${i + 1} name`}
                data-testid={`species-name-${i}`}
              />
              <input
                className={mono}
                value={s.reaction}
                onChange={(e) => setSpecies(i, { reaction: e.target.value })}
                aria-label={`Reaction of species ${i + 1}`}
                placeholder={`∂${s.name || "c"}/∂t =`}
                data-testid={`reaction-${i}`}
              />
              <Button
                size="sm"
                variant="ghost"
                disabled={n <= MIN_SPECIES}
                onClick={() => resizeSpecies(d.species.filter((_, j) => j !== i))}
                aria-label={`Remove species ${i + 1}`}
              >
                Remove
              </Button>
            </div>
          ))}
        </div>
      </Panel>

      <Panel
        title="Parameters"
        actions={
          <Button
            size="sm"
            variant="secondary"
            onClick={() =>
              set({ parameters: [...d.parameters, { name: "", default: "", min: "", max: "", meaning: "" }] })
            }
            data-testid="add-parameter"
          >
            Add parameter
          </Button>
        }
      >
        <div className="grid grid-cols-[7rem_7rem_7rem_7rem_1fr_auto] gap-2 text-xs font-medium uppercase tracking-wide text-ink-soft">
          <span>Name</span>
          <span>Default</span>
          <span>Min</span>
          <span>Max</span>
          <span>Meaning</span>
          <span />
        </div>
        <div className="mt-1 space-y-2">
          {d.parameters.map((p, i) => (
            <div key={i} className="grid grid-cols-[7rem_7rem_7rem_7rem_1fr_auto] items-center gap-2">
              <input
                className={mono}
                value={p.name}
                onChange={(e) => setParam(i, { name: e.target.value })}
                aria-label={`Parameter ${i + 1} name`}
                data-testid={`param-name-${i}`}
              />
              <input
                className={mono}
                value={p.default}
                inputMode="decimal"
                onChange={(e) => setParam(i, { default: e.target.value })}
                aria-label={`Parameter ${i + 1} default`}
                data-testid={`param-default-${i}`}
              />
              <input
                className={mono}
                value={p.min}
                inputMode="decimal"
                onChange={(e) => setParam(i, { min: e.target.value })}
                aria-label={`Parameter ${i + 1} min`}
                placeholder="none"
                data-testid={`param-min-${i}`}
              />
              <input
                className={mono}
                value={p.max}
                inputMode="decimal"
                onChange={(e) => setParam(i, { max: e.target.value })}
                aria-label={`Parameter ${i + 1} max`}
                placeholder="none"
                data-testid={`param-max-${i}`}
              />
              <input
                className={input}
                value={p.meaning}
                onChange={(e) => setParam(i, { meaning: e.target.value })}
                aria-label={`Parameter ${i + 1} meaning`}
                placeholder="what it means"
              />
              <Button
                size="sm"
                variant="ghost"
                onClick={() => set({ parameters: d.parameters.filter((_, j) => j !== i) })}
                aria-label={`Remove parameter ${i + 1}`}
              >
                Remove
              </Button>
            </div>
          ))}
        </div>
      </Panel>

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

      {error && (
        <Notice tone="error" testId="kinetics-error">
          {error.message}
        </Notice>
      )}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={busy} data-testid="save-kinetics">
          {busy ? "Checking and saving…" : `Save as version ${nextVersion}`}
        </Button>
        <span className="text-xs text-ink-soft">
          The server parses the expressions, derives the Jacobian and looks for a steady state at the defaults before
          saving.
        </span>
      </div>
    </form>
  );
}
