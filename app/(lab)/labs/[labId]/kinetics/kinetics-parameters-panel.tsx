"use client";
/** The kinetics editor's named parameters: default, optional range and meaning, with add and remove. */
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { KineticsDraft, ParameterDraft } from "./kinetics-draft";
import { input, mono } from "./kinetics-input-class";

export function KineticsParametersPanel({
  d,
  set,
}: {
  d: KineticsDraft;
  set: (patch: Partial<KineticsDraft>) => void;
}) {
  function setParam(i: number, patch: Partial<ParameterDraft>) {
    set({ parameters: d.parameters.map((p, j) => (j === i ? { ...p, ...patch } : p)) });
  }
  return (
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
  );
}
