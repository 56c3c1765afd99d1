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
import { definitionFromDraft, MAX_SPECIES, MIN_SPECIES, resizeDiffusion, type KineticsDraft } from "./kinetics-draft";
import { KineticsDiffusionPanel } from "./kinetics-diffusion-panel";
import { input, mono } from "./kinetics-input-class";
import { KineticsParametersPanel } from "./kinetics-parameters-panel";

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

      <KineticsParametersPanel d={d} set={set} />

      <KineticsDiffusionPanel d={d} set={set} />

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
