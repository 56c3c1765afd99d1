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
import type { KineticsInfoDto } from "@/lib/server/kinetics/kinetics";
import { keyOf, ModelEditor, modelBody, newModel, num, type ModelDraft } from "./fit-model-editor";

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none";
const f3 = (x: number | null) => (x === null ? "—" : String(Number(x.toPrecision(4))));

interface Pick {
  on: boolean;
  condition: string;
  kind: "fourier" | "nearest-neighbour";
}
interface Typed {
  condition: string;
  kind: "fourier" | "nearest-neighbour";
  wavelengthUm: string;
  uncertaintyUm: string;
}
interface Tissue {
  kind: "none" | "interval" | "rectangle";
  a: string;
  b: string;
}

export function FitBuilder({
  labId,
  candidates,
  kinetics,
  initialKinetics,
}: {
  labId: string;
  candidates: FitCandidateDto[];
  kinetics: KineticsInfoDto[];
  initialKinetics: string | null;
}) {
  const router = useRouter();
  const first =
    kinetics.find((k) => k.id === initialKinetics) ?? kinetics.find((k) => k.id === "schnakenberg") ?? kinetics[0];
  const [name, setName] = useState("");
  const [picks, setPicks] = useState<Record<string, Pick>>(() =>
    Object.fromEntries(
      candidates.map((c) => [c.readoutId, { on: false, condition: c.condition, kind: c.defaultKind }]),
    ),
  );
  const [typed, setTyped] = useState<Typed[]>([]);
  const [tissues, setTissues] = useState<Record<string, Tissue>>({});
  const [models, setModels] = useState<ModelDraft[]>(() => [newModel(first, "m0")]);
  const [profiles, setProfiles] = useState(true);
  const [uncertainty, setUncertainty] = useState<"per-readout" | "with-specimen-spread">("per-readout");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const conditions = useMemo(
    () => [
      ...new Set(
        [
          ...Object.values(picks)
            .filter((p) => p.on)
            .map((p) => p.condition.trim()),
          ...typed.map((t) => t.condition.trim()),
        ].filter(Boolean),
      ),
    ],
    [picks, typed],
  );
  const studies = [...new Set(candidates.map((c) => c.studyName))];
  const domainOf = (condition: string) => {
    const t = tissues[condition];
    if (!t || t.kind === "none") return {};
    return {
      domain:
        t.kind === "interval"
          ? { kind: "interval", length: num(t.a) }
          : { kind: "rectangle", lx: num(t.a), ly: num(t.b) },
    };
  };

  async function submit() {
    setError(null);
    setBusy(true);
    const data = [
      ...candidates
        .filter((c) => picks[c.readoutId].on)
        .map((c) => {
          const p = picks[c.readoutId];
          return {
            readoutId: c.readoutId,
            kind: p.kind,
            ...(p.condition.trim() !== c.condition ? { condition: p.condition.trim() } : {}),
            ...domainOf(p.condition.trim()),
          };
        }),
      ...typed.map((t) => ({
        condition: t.condition.trim(),
        kind: t.kind,
        wavelengthUm: num(t.wavelengthUm),
        uncertaintyUm: num(t.uncertaintyUm),
        ...domainOf(t.condition.trim()),
      })),
    ];
    const body = {
      name:
        name.trim() ||
        `${models.map((m) => kinetics.find((k) => keyOf(k) === m.kinetics)?.name).join(" vs ")} — ${conditions.join(" vs ")}`,
      data,
      models: models.map((m) => modelBody(m, kinetics)),
      options: { profiles },
      uncertainty,
    };
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
      <Panel title="1 · Data">
        {candidates.length === 0 && typed.length === 0 && (
          <EmptyState title="No finished readouts with a period yet.">
            Upload images or spacing tables to specimens (Studies → a study → a specimen), or type measured wavelengths
            below.
          </EmptyState>
        )}
        {studies.map((s) => (
          <div key={s} className="mb-4">
            <h3 className="mb-1 text-sm font-semibold">{s}</h3>
            <table className="w-full text-sm" data-testid="fit-candidates">
              <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th className="w-8" />
                  <th>Specimen</th>
                  <th>File</th>
                  <th>Condition (group)</th>
                  <th>Measured</th>
                  <th>Use as</th>
                </tr>
              </thead>
              <tbody>
                {candidates
                  .filter((c) => c.studyName === s)
                  .map((c) => {
                    const p = picks[c.readoutId];
                    const set = (patch: Partial<Pick>) => setPicks({ ...picks, [c.readoutId]: { ...p, ...patch } });
                    return (
                      <tr
                        key={c.readoutId}
                        className="border-t border-rule/60"
                        data-testid={`candidate-${c.specimenLabel}`}
                      >
                        <td className="py-1">
                          <input
                            type="checkbox"
                            checked={p.on}
                            onChange={(e) => set({ on: e.target.checked })}
                            aria-label={`use ${c.filename}`}
                            data-testid={`pick-${c.specimenLabel}`}
                          />
                        </td>
                        <td>{c.specimenLabel}</td>
                        <td className="text-ink-soft">{c.filename}</td>
                        <td className="pr-2">
                          <input
                            className={field}
                            value={p.condition}
                            onChange={(e) => set({ condition: e.target.value })}
                          />
                        </td>
                        <td className="num text-moss">
                          {p.kind === "nearest-neighbour" && c.nearestNeighbourUm !== null
                            ? `a = ${f3(c.nearestNeighbourUm)} µm`
                            : `λ = ${f3(c.wavelengthUm)} ± ${f3(c.uncertaintyUm)} µm`}
                        </td>
                        <td>
                          <select
                            className={field}
                            value={p.kind}
                            onChange={(e) => set({ kind: e.target.value as Pick["kind"] })}
                          >
                            <option value="fourier">Fourier wavelength</option>
                            {c.nearestNeighbourUm !== null && (
                              <option value="nearest-neighbour">nearest-neighbour spacing</option>
                            )}
                          </select>
                        </td>
                      </tr>
                    );
                  })}
              </tbody>
            </table>
          </div>
        ))}
        <div className="mt-2 space-y-2">
          {typed.map((t, i) => {
            const set = (patch: Partial<Typed>) => setTyped(typed.map((x, j) => (j === i ? { ...x, ...patch } : x)));
            return (
              <div
                key={i}
                className="grid grid-cols-[1fr_12rem_8rem_8rem_auto] items-end gap-2"
                data-testid={`typed-${i}`}
              >
                <label className="text-xs">
                  condition
                  <input className={field} value={t.condition} onChange={(e) => set({ condition: e.target.value })} />
                </label>
                <label className="text-xs">
                  kind
                  <select
                    className={field}
                    value={t.kind}
                    onChange={(e) => set({ kind: e.target.value as Typed["kind"] })}
                  >
                    <option value="fourier">Fourier wavelength</option>
                    <option value="nearest-neighbour">nearest-neighbour spacing</option>
                  </select>
                </label>
                <label className="text-xs">
                  value (µm)
                  <input
                    className={`${field} num`}
                    value={t.wavelengthUm}
                    onChange={(e) => set({ wavelengthUm: e.target.value })}
                  />
                </label>
                <label className="text-xs">
                  ± uncertainty (µm)
                  <input
                    className={`${field} num`}
                    value={t.uncertaintyUm}
                    onChange={(e) => set({ uncertaintyUm: e.target.value })}
                  />
                </label>
                <button
                  type="button"
                  className="pb-1 text-sm text-brick hover:underline"
                  onClick={() => setTyped(typed.filter((_, j) => j !== i))}
                >
                  Remove
                </button>
              </div>
            );
          })}
          <Button
            variant="secondary"
            size="sm"
            onClick={() =>
              setTyped([...typed, { condition: "", kind: "fourier", wavelengthUm: "", uncertaintyUm: "" }])
            }
            data-testid="add-typed"
          >
            Type a measurement
          </Button>
        </div>
        <p className="mt-3 text-xs text-ink-soft">
          Nearest-neighbour spacings a of hexagonal spots are converted to Fourier wavelengths λ = (√3/2)·a before
          fitting, so the model&apos;s 2π/k* is compared with like; one kind per condition.
        </p>
        {conditions.length > 0 && (
          <div className="mt-4 border-t border-rule pt-3" data-testid="tissues">
            <h3 className="mb-1 text-sm font-semibold">Tissue size per condition (optional)</h3>
            <p className="mb-2 text-xs text-ink-soft">
              With a size, only the tissue&apos;s admissible modes count (zero-flux boundaries): k = nπ/L, or k² =
              (mπ/Lx)² + (nπ/Ly)².
            </p>
            {conditions.map((c) => {
              const t = tissues[c] ?? { kind: "none", a: "", b: "" };
              const set = (patch: Partial<Tissue>) => setTissues({ ...tissues, [c]: { ...t, ...patch } });
              return (
                <div key={c} className="mb-1 grid grid-cols-[10rem_14rem_8rem_8rem] items-center gap-2 text-sm">
                  <span className="font-medium">{c}</span>
                  <select
                    className={field}
                    value={t.kind}
                    onChange={(e) => set({ kind: e.target.value as Tissue["kind"] })}
                  >
                    <option value="none">unbounded (continuous k)</option>
                    <option value="interval">strip of length L</option>
                    <option value="rectangle">rectangle Lx × Ly</option>
                  </select>
                  {t.kind !== "none" && (
                    <input
                      className={`${field} num`}
                      placeholder={t.kind === "interval" ? "L (µm)" : "Lx (µm)"}
                      value={t.a}
                      onChange={(e) => set({ a: e.target.value })}
                    />
                  )}
                  {t.kind === "rectangle" && (
                    <input
                      className={`${field} num`}
                      placeholder="Ly (µm)"
                      value={t.b}
                      onChange={(e) => set({ b: e.target.value })}
                    />
                  )}
                </div>
              );
            })}
          </div>
        )}
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
            <option value="per-readout">
              the readout&apos;s own uncertainty (how well one image pins its wavelength)
            </option>
            <option value="with-specimen-spread">
              plus the spread between specimens of the same condition (SD, added in quadrature)
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
