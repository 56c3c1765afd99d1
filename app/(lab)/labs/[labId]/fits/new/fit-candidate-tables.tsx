"use client";
/** The lab's finished readouts, one table per study: tick one to use it, regroup it, choose how it is read. */
import { formatPlusMinus } from "@/lib/format/measurement";
import type { FitCandidateDto } from "@/lib/server/fits/candidates";
import { field, type Pick } from "./fit-data-drafts";

const f3 = (x: number | null) => (x === null ? "—" : String(Number(x.toPrecision(4))));

export function FitCandidateTables({
  candidates,
  picks,
  setPicks,
}: {
  candidates: FitCandidateDto[];
  picks: Record<string, Pick>;
  setPicks: (next: Record<string, Pick>) => void;
}) {
  const studies = [...new Set(candidates.map((c) => c.studyName))];
  return (
    <>
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
                          aria-label={`condition (group) of ${c.filename}`}
                        />
                      </td>
                      <td className="num text-moss">
                        {p.kind === "nearest-neighbour" && c.nearestNeighbourUm !== null
                          ? `a = ${f3(c.nearestNeighbourUm)} µm`
                          : `λ = ${formatPlusMinus(c.wavelengthUm, c.uncertaintyUm, "µm")}`}
                      </td>
                      <td>
                        <select
                          className={field}
                          value={p.kind}
                          onChange={(e) => set({ kind: e.target.value as Pick["kind"] })}
                          aria-label={`use ${c.filename} as`}
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
    </>
  );
}
