"use client";
/**
 * One kinetics of a fit: which kinetics (catalogue or lab, at its version), physical scales, and
 * per parameter fixed, free within bounds with a start, or free per condition.
 */
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import { typedNumberOrText } from "@/lib/format/typed-number";

export type Mode = "fixed" | "free" | "per-condition";
export interface ParamDraft {
  mode: Mode;
  value: string;
  start: string;
  lower: string;
  upper: string;
  log: boolean;
}
export interface ModelDraft {
  key: string;
  kinetics: string;
  lengthScaleUm: string;
  timeScaleS: string;
  /** Carried from a fit being changed (the builder has no field for it); dropped when the kinetics changes. */
  gridSize?: number;
  params: Record<string, ParamDraft>;
}

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";
const sig = (x: number) => String(Number(x.toPrecision(3)));

/** Default bounds: default/10 … default×10 within the allowed range (log when that spans decades). */
export function defaultParam(p: KineticsInfoDto["parameters"][number]): ParamDraft {
  const lo = p.min ?? -Infinity,
    hi = p.max ?? Infinity;
  const [a, b] =
    p.default > 0
      ? [Math.max(lo, p.default / 10), Math.min(hi, p.default * 10)]
      : [Number.isFinite(lo) ? lo : 0, Number.isFinite(hi) ? hi : 1];
  return {
    mode: "fixed",
    value: String(p.default),
    start: String(p.default),
    lower: sig(a),
    upper: sig(b),
    log: a > 0,
  };
}

export function newModel(info: KineticsInfoDto, key: string): ModelDraft {
  return {
    key,
    kinetics: keyOf(info),
    lengthScaleUm: "",
    timeScaleS: "",
    params: Object.fromEntries(info.parameters.map((p) => [p.name, defaultParam(p)])),
  };
}

export const keyOf = (k: KineticsInfoDto) => (k.kind === "lab" ? `${k.id}@${k.version}` : k.id);

export function ModelEditor({
  index,
  draft,
  kinetics,
  onChange,
  onRemove,
}: {
  index: number;
  draft: ModelDraft;
  kinetics: KineticsInfoDto[];
  onChange: (d: ModelDraft) => void;
  onRemove: (() => void) | null;
}) {
  const info = kinetics.find((k) => keyOf(k) === draft.kinetics) ?? kinetics[0];
  const set = (name: string, patch: Partial<ParamDraft>) =>
    onChange({ ...draft, params: { ...draft.params, [name]: { ...draft.params[name], ...patch } } });
  return (
    <div className="space-y-3" data-testid={`model-${index}`}>
      <div className="grid gap-3 sm:grid-cols-[1fr_10rem_10rem_auto] sm:items-end">
        <label className="block text-sm">
          Kinetics
          <select
            className={field}
            value={draft.kinetics}
            data-testid={`model-${index}-kinetics`}
            onChange={(e) =>
              onChange(
                newModel(
                  kinetics.find((k) => keyOf(k) === e.target.value)!,
                  draft.key,
                ),
              )
            }
          >
            <optgroup label="Catalogue">
              {kinetics
                .filter((k) => k.kind === "catalogue")
                .map((k) => (
                  <option key={keyOf(k)} value={keyOf(k)}>
                    {k.name}
                  </option>
                ))}
            </optgroup>
            {kinetics.some((k) => k.kind === "lab") && (
              <optgroup label="This lab">
                {kinetics
                  .filter((k) => k.kind === "lab")
                  .map((k) => (
                    <option key={keyOf(k)} value={keyOf(k)}>
                      {k.name} (v{k.version})
                    </option>
                  ))}
              </optgroup>
            )}
          </select>
        </label>
        {info.units === "non-dimensional" ? (
          <>
            <label className="block text-sm">
              length scale ℓ (µm)
              <input
                className={field}
                value={draft.lengthScaleUm}
                placeholder="required"
                onChange={(e) => onChange({ ...draft, lengthScaleUm: e.target.value })}
                data-testid={`model-${index}-length-scale`}
              />
            </label>
            <label className="block text-sm">
              time scale τ (s)
              <input
                className={field}
                value={draft.timeScaleS}
                placeholder="optional"
                onChange={(e) => onChange({ ...draft, timeScaleS: e.target.value })}
              />
            </label>
          </>
        ) : (
          <p className="text-xs text-ink-soft sm:col-span-2">Dimensional: diffusivities in µm²/s, rates in 1/s.</p>
        )}
        {onRemove && (
          <button type="button" className="text-sm text-brick hover:underline" onClick={onRemove}>
            Remove
          </button>
        )}
      </div>
      <p className="text-xs text-ink-soft">{info.source}</p>
      <table className="w-full text-sm" data-testid={`model-${index}-parameters`}>
        <thead className="text-left text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th className="py-1 pr-2">Parameter</th>
            <th className="pr-2">Mode</th>
            <th className="pr-2">Value / start</th>
            <th className="pr-2">Lower</th>
            <th className="pr-2">Upper</th>
            <th>Log</th>
          </tr>
        </thead>
        <tbody>
          {info.parameters.map((p) => {
            const d = draft.params[p.name] ?? defaultParam(p);
            const unit = p.unit && p.unit !== "1" ? ` (${p.unit})` : "";
            return (
              <tr key={p.name} className="border-t border-rule/60" data-testid={`param-row-${p.name}`}>
                <td className="py-1 pr-2" title={p.meaning}>
                  <span className="num font-medium">{p.name}</span>
                  <span className="text-xs text-ink-soft">{unit}</span>
                  <div className="text-xs text-ink-soft">{p.meaning}</div>
                </td>
                <td className="pr-2">
                  <select
                    className={field}
                    value={d.mode}
                    onChange={(e) => set(p.name, { mode: e.target.value as Mode })}
                    data-testid={`mode-${p.name}`}
                    aria-label={`mode of ${p.name}`}
                  >
                    <option value="fixed">fixed</option>
                    <option value="free">free (shared)</option>
                    <option value="per-condition">free per condition</option>
                  </select>
                </td>
                <td className="pr-2">
                  {d.mode === "fixed" ? (
                    <input
                      className={field}
                      value={d.value}
                      onChange={(e) => set(p.name, { value: e.target.value })}
                      data-testid={`value-${p.name}`}
                      aria-label={`value of ${p.name}`}
                    />
                  ) : (
                    <input
                      className={field}
                      value={d.start}
                      onChange={(e) => set(p.name, { start: e.target.value })}
                      data-testid={`start-${p.name}`}
                      aria-label={`start of ${p.name}`}
                    />
                  )}
                </td>
                <td className="pr-2">
                  {d.mode !== "fixed" && (
                    <input
                      className={field}
                      value={d.lower}
                      onChange={(e) => set(p.name, { lower: e.target.value })}
                      data-testid={`lower-${p.name}`}
                      aria-label={`lower bound of ${p.name}`}
                    />
                  )}
                </td>
                <td className="pr-2">
                  {d.mode !== "fixed" && (
                    <input
                      className={field}
                      value={d.upper}
                      onChange={(e) => set(p.name, { upper: e.target.value })}
                      data-testid={`upper-${p.name}`}
                      aria-label={`upper bound of ${p.name}`}
                    />
                  )}
                </td>
                <td>
                  {d.mode !== "fixed" && (
                    <input
                      type="checkbox"
                      checked={d.log}
                      onChange={(e) => set(p.name, { log: e.target.checked })}
                      aria-label={`fit ln ${p.name}`}
                    />
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** A number when the text is one ("0,65" too), otherwise the text (so the server's message names the field). */
export const num = (s: string): number | string => typedNumberOrText(s);

/** The request body of one model. */
export function modelBody(d: ModelDraft, kinetics: KineticsInfoDto[]) {
  const info = kinetics.find((k) => keyOf(k) === d.kinetics)!;
  const parameters = Object.fromEntries(
    Object.entries(d.params).map(([name, p]) => [
      name,
      p.mode === "fixed"
        ? { mode: "fixed", value: num(p.value) }
        : { mode: p.mode, start: num(p.start), lower: num(p.lower), upper: num(p.upper), log: p.log },
    ]),
  );
  return {
    kinetics: info.id,
    ...(info.kind === "lab" ? { version: info.version } : {}),
    ...(d.lengthScaleUm.trim() ? { lengthScaleUm: num(d.lengthScaleUm) } : {}),
    ...(d.timeScaleS.trim() ? { timeScaleS: num(d.timeScaleS) } : {}),
    ...(d.gridSize !== undefined ? { gridSize: d.gridSize } : {}),
    parameters,
  };
}
