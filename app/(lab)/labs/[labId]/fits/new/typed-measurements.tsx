"use client";
/** Measurements typed by hand (condition, kind, value and uncertainty in µm), with add and remove. */
import { Button } from "@/components/ui/button";
import { field, type Typed } from "./fit-data-drafts";

export function TypedMeasurements({ typed, setTyped }: { typed: Typed[]; setTyped: (next: Typed[]) => void }) {
  return (
    <div className="mt-2 space-y-2">
      {typed.map((t, i) => {
        const set = (patch: Partial<Typed>) => setTyped(typed.map((x, j) => (j === i ? { ...x, ...patch } : x)));
        return (
          <div key={i} className="grid grid-cols-[1fr_12rem_8rem_8rem_auto] items-end gap-2" data-testid={`typed-${i}`}>
            <label className="text-xs">
              condition
              <input className={field} value={t.condition} onChange={(e) => set({ condition: e.target.value })} />
            </label>
            <label className="text-xs">
              kind
              <select className={field} value={t.kind} onChange={(e) => set({ kind: e.target.value as Typed["kind"] })}>
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
        onClick={() => setTyped([...typed, { condition: "", kind: "fourier", wavelengthUm: "", uncertaintyUm: "" }])}
        data-testid="add-typed"
      >
        Type a measurement
      </Button>
    </div>
  );
}
