"use client";
/** Elasticities of the predicted wavelength and "what if this parameter were scaled". */
import { useState } from "react";
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { SensitivityBars } from "@/components/charts/sensitivity-bars";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import type { SensitivityDto } from "@/lib/server/kinetics/analyses";
import type { AnalysisBase } from "./analysis-base";
import { ComputingBadge } from "./computing-badge";
import { numberOrText, useAnalysis } from "./use-analysis";

const field =
  "rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";

export function SensitivityPanel({ labId, info, base }: { labId: string; info: KineticsInfoDto; base: AnalysisBase }) {
  const [name, setName] = useState(info.parameters[0]?.name ?? "");
  const [factor, setFactor] = useState("2");
  const s = useAnalysis<SensitivityDto>(
    `/api/v1/labs/${labId}/analyses/sensitivities`,
    { ...base, ...(name ? { scale: { name, factor: numberOrText(factor) } } : {}) },
    400,
  );
  const d = s.data;
  const items =
    d?.elasticities?.elasticities.filter((e): e is typeof e & { elasticity: number } => e.elasticity !== null) ?? [];
  const skipped = d?.elasticities?.elasticities.filter((e) => e.elasticity === null) ?? [];
  const um = (v: number | null | undefined) => (v == null ? "" : ` (${f(v)} µm)`);
  return (
    <Panel
      title="Sensitivities of the predicted wavelength"
      actions={<ComputingBadge on={s.computing} stale={s.stale} testId="sensitivity-computing" />}
    >
      {s.error && (
        <div className="mb-3">
          <Notice tone="error" testId="sensitivity-error">
            {s.error.message}
          </Notice>
        </div>
      )}
      {d?.reason && <Notice tone="warning">{d.reason}</Notice>}
      {items.length > 0 && <SensitivityBars items={items} />}
      {skipped.length > 0 && (
        <p className="text-xs text-ink-soft">Not shown: {skipped.map((e) => `${e.name} (${e.reason})`).join("; ")}.</p>
      )}
      <p className="mt-1 text-xs text-ink-soft">
        ∂ln λ*/∂ln p: +1 means λ* grows in proportion to p; −0.5 means λ* ∝ p^−½.
      </p>
      <div className="mt-4 border-t border-rule pt-3 text-sm">
        <div className="flex flex-wrap items-center gap-2">
          <span>Predicted wavelength if</span>
          <select
            className={field}
            value={name}
            onChange={(e) => setName(e.target.value)}
            data-testid="scale-parameter"
            aria-label="Parameter to scale"
          >
            {info.parameters.map((p) => (
              <option key={p.name} value={p.name}>
                {p.name}
              </option>
            ))}
          </select>
          <span>is scaled by</span>
          <input
            className={`${field} w-20`}
            value={factor}
            onChange={(e) => setFactor(e.target.value)}
            data-testid="scale-factor"
            aria-label="Scale factor"
          />
        </div>
        {d?.scaled && (
          <p className="num mt-2" data-testid="scaled-wavelength">
            {d.scaled.name}: {f(d.scaled.before.value)} → {f(d.scaled.after.value)}; λ* {f(d.scaled.before.wavelength)}
            {um(d.scaled.before.wavelengthUm)} →{" "}
            <span className="text-iris">
              {f(d.scaled.after.wavelength)}
              {um(d.scaled.after.wavelengthUm)}
            </span>{" "}
            model length
            {d.scaled.ratio !== null
              ? ` (× ${f(d.scaled.ratio)})`
              : ` (${d.scaled.after.classes.join(" + ")} after scaling)`}
          </p>
        )}
      </div>
    </Panel>
  );
}
