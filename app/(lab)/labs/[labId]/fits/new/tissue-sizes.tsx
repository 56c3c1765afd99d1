"use client";
/** The optional tissue size of each condition, which limits the model to the tissue's admissible modes. */
import { field, type Tissue } from "./fit-data-drafts";

export function TissueSizes({
  conditions,
  tissues,
  setTissues,
}: {
  conditions: string[];
  tissues: Record<string, Tissue>;
  setTissues: (next: Record<string, Tissue>) => void;
}) {
  return (
    <div className="mt-4 border-t border-rule pt-3" data-testid="tissues">
      <h3 className="mb-1 text-sm font-semibold">Tissue size per condition (optional)</h3>
      <p className="mb-2 text-xs text-ink-soft">
        With a size, only the tissue&apos;s admissible modes count (zero-flux boundaries): k = nπ/L, or k² = (mπ/Lx)² +
        (nπ/Ly)².
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
              aria-label={`tissue shape for ${c}`}
            >
              <option value="none">unbounded (continuous k)</option>
              <option value="interval">strip of length L</option>
              <option value="rectangle">rectangle Lx × Ly</option>
            </select>
            {t.kind !== "none" && (
              <input
                className={`${field} num`}
                placeholder={t.kind === "interval" ? "L (µm)" : "Lx (µm)"}
                aria-label={`${t.kind === "interval" ? "length L (µm)" : "length Lx (µm)"} for ${c}`}
                value={t.a}
                onChange={(e) => set({ a: e.target.value })}
              />
            )}
            {t.kind === "rectangle" && (
              <input
                className={`${field} num`}
                placeholder="Ly (µm)"
                aria-label={`length Ly (µm) for ${c}`}
                value={t.b}
                onChange={(e) => set({ b: e.target.value })}
              />
            )}
          </div>
        );
      })}
    </div>
  );
}
