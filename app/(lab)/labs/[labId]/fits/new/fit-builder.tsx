"use client";
/**
 * The fit builder: data (readouts ticked from the lab's studies, grouped by condition, or typed
 * measurements), optional tissue size per condition, one kinetics or several to compare, options.
 * The server checks everything and answers with the field at fault before any job starts.
 */
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { EmptyState, Panel } from "@/components/ui/panel";
import { ApiError, sendJson } from "@/lib/client/api";
import type { FitCandidateDto } from "@/lib/server/fits/candidates";
import type { FitDetailDto } from "@/lib/server/fits/fits";
import type { FitPrefill } from "@/lib/server/fits/prefill";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import { FitCandidateTables } from "./fit-candidate-tables";
import { field, listConditions, type Pick, type Tissue, type Typed } from "./fit-data-drafts";
import { ModelEditor, newModel, type ModelDraft } from "./fit-model-editor";
import { startingDrafts } from "./fit-prefill-drafts";
import { buildFitBody } from "./fit-request-body";
import { TissueSizes } from "./tissue-sizes";
import { TypedMeasurements } from "./typed-measurements";

export function FitBuilder({
  labId,
  candidates,
  kinetics,
  initialKinetics,
  prefill = null,
  initialReadout = null,
}: {
  labId: string;
  candidates: FitCandidateDto[];
  kinetics: KineticsInfoDto[];
  initialKinetics: string | null;
  /** A fit being changed: every field starts as it was ("Change and re-run"). */
  prefill?: FitPrefill | null;
  /** A readout to start with picked ("Fit kinetics to this readout" on a readout's page). */
  initialReadout?: string | null;
}) {
  const router = useRouter();
  const first =
    kinetics.find((k) => k.id === initialKinetics) ?? kinetics.find((k) => k.id === "schnakenberg") ?? kinetics[0];
  const [start] = useState(() => startingDrafts(candidates, first, prefill, initialReadout));
  const [name, setName] = useState(start.name);
  const [picks, setPicks] = useState<Record<string, Pick>>(start.picks);
  const [typed, setTyped] = useState<Typed[]>(start.typed);
  const [tissues, setTissues] = useState<Record<string, Tissue>>(start.tissues);
  const [models, setModels] = useState<ModelDraft[]>(start.models);
  const [profiles, setProfiles] = useState(start.profiles);
  const [uncertainty, setUncertainty] = useState(start.uncertainty);
  const [replicates, setReplicates] = useState(start.replicates);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const conditions = useMemo(() => listConditions(picks, typed), [picks, typed]);

  async function submit() {
    setError(null);
    setBusy(true);
    const body = buildFitBody({
      name,
      candidates,
      picks,
      typed,
      tissues,
      conditions,
      models,
      kinetics,
      profiles,
      uncertainty,
      replicates,
      otherOptions: prefill?.otherOptions,
      changedFrom: prefill?.fromFit.id,
    });
    try {
      const fit = await sendJson<FitDetailDto>("POST", `/api/v1/labs/${labId}/fits`, body);
      router.push(`/labs/${labId}/fits/${fit.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : String(err));
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      {prefill && (
        <Notice testId="fit-changed-from">
          Filled in from the fit “{prefill.fromFit.name}”: change what you want and start a new fit. The original stays
          as it is; the new fit links back to it.
          {prefill.notes.map((n) => (
            <span key={n} className="mt-1 block text-xs">
              {n}
            </span>
          ))}
        </Notice>
      )}
      <Panel title="1 · Data">
        {candidates.length === 0 && typed.length === 0 && (
          <EmptyState title="No finished readouts with a period yet.">
            Upload images or spacing tables to specimens (Studies → a study → a specimen), or type measured wavelengths
            below.
          </EmptyState>
        )}
        <FitCandidateTables candidates={candidates} picks={picks} setPicks={setPicks} />
        <TypedMeasurements typed={typed} setTyped={setTyped} />
        <p className="mt-3 text-xs text-ink-soft">
          Nearest-neighbour spacings a of hexagonal spots are converted to Fourier wavelengths λ = (√3/2)·a before
          fitting, so the model&apos;s 2π/k* is compared with like; one kind per condition.
        </p>
        {conditions.length > 0 && <TissueSizes conditions={conditions} tissues={tissues} setTissues={setTissues} />}
      </Panel>

      <Panel title={models.length > 1 ? `2 · Kinetics to compare (${models.length})` : "2 · Model"}>
        <div className="space-y-6">
          {models.map((m, i) => (
            <div key={m.key} className={i > 0 ? "border-t border-rule pt-4" : ""}>
              <ModelEditor
                index={i}
                draft={m}
                kinetics={kinetics}
                onChange={(d) => setModels(models.map((x, j) => (j === i ? d : x)))}
                onRemove={models.length > 1 ? () => setModels(models.filter((_, j) => j !== i)) : null}
              />
            </div>
          ))}
          {models.length < 6 && (
            <Button
              variant="secondary"
              size="sm"
              onClick={() => setModels([...models, newModel(first, `m${Date.now()}`)])}
              data-testid="add-model"
            >
              Add a kinetics to compare
            </Button>
          )}
        </div>
      </Panel>

      <Panel title="3 · Fit">
        <div className="grid gap-3 sm:grid-cols-[1fr_auto] sm:items-end">
          <label className="block text-sm">
            Name
            <input
              className={field}
              value={name}
              onChange={(e) => setName(e.target.value)}
              placeholder="e.g. Placode spacing, control vs inhibitor"
              data-testid="fit-name"
            />
          </label>
          <label className="flex items-center gap-2 pb-1 text-sm">
            <input type="checkbox" checked={profiles} onChange={(e) => setProfiles(e.target.checked)} /> 95 %
            profile-likelihood intervals (slower)
          </label>
        </div>
        <label className="mt-3 block text-sm">
          Uncertainty of each datum
          <select
            className={field}
            value={uncertainty}
            onChange={(e) => setUncertainty(e.target.value as typeof uncertainty)}
            data-testid="fit-uncertainty"
          >
            <option value="with-specimen-spread">
              the specimen&apos;s own uncertainty plus the spread between specimens of the same condition (SD, added in
              quadrature)
            </option>
            <option value="per-readout">
              only the specimen&apos;s own uncertainty (how well its images pin its wavelength)
            </option>
          </select>
        </label>
        <label className="mt-3 block text-sm">
          Replicates
          <select
            className={field}
            value={replicates}
            onChange={(e) => setReplicates(e.target.value as typeof replicates)}
            data-testid="fit-replicates"
          >
            <option value="specimens">
              specimens: several images of one specimen are averaged first; the same file twice counts once
            </option>
            <option value="images">
              every image is its own datum (pseudo-replication when a specimen has several)
            </option>
          </select>
        </label>
        <p className="mt-2 text-xs text-ink-soft">
          Weighted least squares of predicted against measured wavelength (Levenberg–Marquardt, several starts); only
          Turing-unstable states count as predictions. Runs as a background job; you can leave the page.
        </p>
        {error && (
          <div className="mt-3">
            <Notice tone="error" testId="fit-error">
              {error}
            </Notice>
          </div>
        )}
        <div className="mt-3">
          <Button onClick={submit} disabled={busy} data-testid="start-fit">
            {busy ? "Checking…" : models.length > 1 ? "Start comparison" : "Start fit"}
          </Button>
        </div>
      </Panel>
    </div>
  );
}
