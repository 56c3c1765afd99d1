"use client";
/**
 * One kinetics, analysed as its parameters change: parameter form with ranges, domain and physical
 * scales, then the dispersion relation, Turing-space map, sensitivities and a gradient — each panel
 * a debounced call to the analyses API that keeps the previous result on screen while it computes.
 */
import { useMemo, useState } from "react";
import { DispersionPlot } from "@/components/charts/dispersion-plot";
import { unitsFor } from "@/components/charts/dispersion-format";
import { LinkButton } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { DispersionDto } from "@/lib/server/kinetics/analyses";
import type { KineticsInfoDto } from "@/lib/server/kinetics/catalogue";
import { ComputingBadge } from "./computing-badge";
import { DispersionNumbers } from "./dispersion-numbers";
import type { AnalysisBase } from "./analysis-base";
import { GradientPanel } from "./gradient-panel";
import { SensitivityPanel } from "./sensitivity-panel";
import { TuringMapPanel } from "./turing-map-panel";
import { numberOrText, optionalNumber, useAnalysis } from "./use-analysis";

const field =
  "w-full rounded-md border border-rule bg-card px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none num";

type DomainKind = "unbounded" | "interval" | "rectangle" | "sphere";

export function AnalysisView({
  labId,
  info,
  canSimulate = false,
}: {
  labId: string;
  info: KineticsInfoDto;
  canSimulate?: boolean;
}) {
  const dimensional = info.units === "dimensional";
  const [values, setValues] = useState<Record<string, string>>(() =>
    Object.fromEntries(info.parameters.map((p) => [p.name, String(p.default)])),
  );
  const [lengthScale, setLengthScale] = useState("");
  const [timeScale, setTimeScale] = useState("");
  const [domain, setDomain] = useState<{ kind: DomainKind; a: string; b: string; units: "um" | "model" }>({
    kind: "unbounded",
    a: "100",
    b: "100",
    units: "model",
  });

  const base: AnalysisBase = useMemo(
    () => ({
      kinetics: info.id,
      ...(info.version ? { version: info.version } : {}),
      parameters: Object.fromEntries(Object.entries(values).map(([k, v]) => [k, numberOrText(v)])),
      ...(dimensional ? {} : { lengthScaleUm: optionalNumber(lengthScale), timeScaleS: optionalNumber(timeScale) }),
    }),
    [info.id, info.version, values, lengthScale, timeScale, dimensional],
  );
  const hasLength = dimensional || lengthScale.trim() !== "";
  const domainUnits = hasLength ? domain.units : "model";
  const domainBody =
    domain.kind === "unbounded"
      ? { kind: "unbounded" }
      : domain.kind === "interval"
        ? { kind: "interval", length: numberOrText(domain.a), units: domainUnits }
        : domain.kind === "rectangle"
          ? { kind: "rectangle", lx: numberOrText(domain.a), ly: numberOrText(domain.b), units: domainUnits }
          : { kind: "sphere", radius: numberOrText(domain.a), units: domainUnits };
  const dispersion = useAnalysis<DispersionDto>(`/api/v1/labs/${labId}/analyses/dispersion`, {
    ...base,
    domain: domainBody,
  });
  const r = dispersion.data;
  const units = unitsFor(r?.scales.lengthScaleUm ?? null, r?.scales.timeScaleS ?? null);
  const sizeUnit = domainUnits === "um" ? "µm" : "model length";

  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-[20rem_1fr]">
        <Panel title="Parameters">
          <div className="space-y-2" data-testid="parameter-form">
            {info.parameters.map((p) => (
              <label key={p.name} className="block" title={p.meaning}>
                <span className="flex items-baseline justify-between gap-2 text-sm">
                  <span className="num font-medium">{p.name}</span>
                  <span className="num text-xs text-ink-soft">
                    [{p.min ?? "−∞"}, {p.max ?? "∞"}]{p.unit && p.unit !== "1" ? ` ${p.unit}` : ""}
                  </span>
                </span>
                <input
                  className={field}
                  value={values[p.name]}
                  inputMode="decimal"
                  onChange={(e) => setValues((v) => ({ ...v, [p.name]: e.target.value }))}
                  data-testid={`param-${p.name}`}
                />
                {p.meaning && <span className="block text-xs text-ink-soft">{p.meaning}</span>}
              </label>
            ))}
          </div>
          <div className="mt-4 space-y-2 border-t border-rule pt-3">
            <h3 className="text-sm font-semibold">Domain</h3>
            <select
              className={field}
              value={domain.kind}
              onChange={(e) => setDomain({ ...domain, kind: e.target.value as DomainKind })}
              data-testid="domain-kind"
              aria-label="Domain"
            >
              <option value="unbounded">unbounded (continuous k)</option>
              <option value="interval">interval of length L, zero-flux ends</option>
              <option value="rectangle">rectangle Lx × Ly, zero-flux</option>
              <option value="sphere">sphere of radius R</option>
            </select>
            {domain.kind !== "unbounded" && (
              <div className="grid grid-cols-2 gap-2">
                <label className="block text-xs">
                  {domain.kind === "interval" ? "L" : domain.kind === "rectangle" ? "Lx" : "R"} ({sizeUnit})
                  <input
                    className={field}
                    value={domain.a}
                    onChange={(e) => setDomain({ ...domain, a: e.target.value })}
                    data-testid="domain-a"
                  />
                </label>
                {domain.kind === "rectangle" && (
                  <label className="block text-xs">
                    Ly ({sizeUnit})
                    <input
                      className={field}
                      value={domain.b}
                      onChange={(e) => setDomain({ ...domain, b: e.target.value })}
                      data-testid="domain-b"
                    />
                  </label>
                )}
                {hasLength && !dimensional && (
                  <label className="col-span-2 block text-xs">
                    sizes in
                    <select
                      className={field}
                      value={domain.units}
                      onChange={(e) => setDomain({ ...domain, units: e.target.value as "um" | "model" })}
                    >
                      <option value="um">µm</option>
                      <option value="model">model units</option>
                    </select>
                  </label>
                )}
              </div>
            )}
          </div>
          {!dimensional && (
            <div className="mt-4 space-y-2 border-t border-rule pt-3">
              <h3 className="text-sm font-semibold">Physical scales (optional)</h3>
              <p className="text-xs text-ink-soft">
                The model is non-dimensional: one model length is ℓ µm, one model time τ s.
              </p>
              <div className="grid grid-cols-2 gap-2">
                <label className="block text-xs">
                  length scale ℓ (µm)
                  <input
                    className={field}
                    value={lengthScale}
                    placeholder="none"
                    onChange={(e) => setLengthScale(e.target.value)}
                    data-testid="length-scale"
                  />
                </label>
                <label className="block text-xs">
                  time scale τ (s)
                  <input
                    className={field}
                    value={timeScale}
                    placeholder="none"
                    onChange={(e) => setTimeScale(e.target.value)}
                    data-testid="time-scale"
                  />
                </label>
              </div>
            </div>
          )}
          {canSimulate && (
            <div className="mt-4 border-t border-rule pt-3">
              <LinkButton
                variant="secondary"
                size="sm"
                data-testid="simulate-link"
                href={`/labs/${labId}/runs/new?${new URLSearchParams({ kinetics: info.id, ...(info.version ? { version: String(info.version) } : {}), ...Object.fromEntries(Object.entries(values).map(([k, v]) => [`p.${k}`, v])), ...(!dimensional && lengthScale ? { lengthScaleUm: lengthScale } : {}), ...(!dimensional && timeScale ? { timeScaleS: timeScale } : {}) })}`}
              >
                Simulate with these parameters
              </LinkButton>
            </div>
          )}
        </Panel>
        <Panel
          title="Dispersion relation"
          actions={<ComputingBadge on={dispersion.computing} stale={dispersion.stale} testId="dispersion-computing" />}
        >
          {dispersion.error && (
            <div className="mb-3">
              <Notice tone="error" testId="dispersion-error">
                {dispersion.error.message}
              </Notice>
            </div>
          )}
          {r ? (
            <div className={`grid gap-4 xl:grid-cols-[1fr_22rem] ${dispersion.error ? "opacity-50" : ""}`}>
              <DispersionPlot
                k={r.curve.k}
                sigma={r.curve.sigma}
                imSigma={r.curve.imSigma}
                bands={r.bands}
                kStar={r.fastest?.kStar ?? null}
                modes={r.admissibleModes}
                units={units}
              />
              <DispersionNumbers r={r} units={units} species={info.species} dimensional={dimensional} />
            </div>
          ) : (
            !dispersion.error && <p className="text-sm text-ink-soft">Computing the dispersion relation…</p>
          )}
        </Panel>
      </div>
      <TuringMapPanel labId={labId} info={info} base={base} />
      <div className="grid gap-6 lg:grid-cols-2">
        <SensitivityPanel labId={labId} info={info} base={base} />
        <GradientPanel labId={labId} info={info} base={base} />
      </div>
    </div>
  );
}
