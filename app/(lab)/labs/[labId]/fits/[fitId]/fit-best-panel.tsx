"use client";
/** The best fit of one kinetics: verdict, notes, parameters with SE and 95 % profile intervals, goodness of fit. */
import { formatNumber as f } from "@/components/charts/dispersion-format";
import { Notice } from "@/components/ui/notice";
import { Badge, Panel } from "@/components/ui/panel";
import type { FittedModelResult } from "@/lib/server/fits/result";
import { VERDICT_TONE } from "../fit-format";

const side = (s: { value: number | null; open: string | null; turingEdge: boolean }) =>
  s.value === null
    ? `open (${s.open === "bound" ? "reaches the bound" : "beyond the range searched"})`
    : `${f(s.value)}${s.turingEdge ? "†" : ""}`;

export function FitBestPanel({ model }: { model: FittedModelResult }) {
  const r = model.fit;
  const identifiable = r.identifiability.identifiable;
  return (
    <Panel
      title={<>Best fit — {model.label}</>}
      actions={<Badge tone={VERDICT_TONE[r.verdict] ?? "plain"}>{r.verdict}</Badge>}
    >
      <p className="text-sm" data-testid="fit-verdict">
        {r.verdictReason}
      </p>
      {r.notes.map((n) => (
        <p key={n} className="mt-1 text-xs text-ink-soft">
          Note: {n}
        </p>
      ))}
      {r.warnings.map((w) => (
        <div key={w} className="mt-2">
          <Notice tone="warning">{w}</Notice>
        </div>
      ))}
      {!identifiable && (
        <div className="mt-3">
          <Notice tone="warning" testId="not-identifiable">
            Not identifiable: these data cannot pin the parameters down. {r.identifiability.reasons.join(" ")} The
            values below are one of many equally good solutions; the curve further down shows them all.
          </Notice>
        </div>
      )}
      <table className="mt-3 w-full text-sm" data-testid="parameters-table">
        <thead className="text-left text-xs font-medium text-ink-soft">
          <tr>
            <th className="py-1">Parameter</th>
            <th>Condition</th>
            <th className="text-right">Value</th>
            <th className="text-right">SE</th>
            <th className="pl-4">95 % profile interval</th>
            <th />
          </tr>
        </thead>
        <tbody>
          {r.parameters.map((p) => (
            <tr key={p.name} className="border-t border-rule/60" data-testid={`fitted-${p.name}`}>
              <td className="num py-1 font-medium">{p.parameter}</td>
              <td>{p.condition ?? <span className="text-ink-soft">all</span>}</td>
              <td className={`num text-right ${identifiable ? "text-iris" : "text-ink-soft"}`}>{f(p.value)}</td>
              <td className="num text-right">{p.standardError === null ? "—" : f(p.standardError)}</td>
              <td className="num pl-4" data-testid={`interval-${p.name}`}>
                {p.interval95 ? `${side(p.interval95.lower)} … ${side(p.interval95.upper)}` : "not computed"}
              </td>
              <td className="text-xs text-ink-soft">
                {p.atBound && <Badge tone="ochre">at a bound</Badge>} {p.log && "fitted as ln"}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-soft">
        Fixed:{" "}
        <span className="num">
          {Object.entries(r.fixed)
            .map(
              ([k, v]) =>
                `${k} = ${
                  typeof v === "number"
                    ? f(v)
                    : Object.entries(v)
                        .map(([c, x]) => `${f(x)} (${c})`)
                        .join(", ")
                }`,
            )
            .join("; ") || "none"}
        </span>
        . Parameters are in the kinetics&apos; own units (non-dimensional unless marked). † the limit is the edge of the
        Turing region. Intervals: where χ² rises by <span className="num">{f(r.profileDelta, 3)}</span> with the other
        parameters re-optimised (Raue et al. 2009).
      </p>
      <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4" data-testid="goodness">
        <div>
          <dt className="text-xs text-ink-soft">χ²</dt>
          <dd className="num">{f(r.chiSquare)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">reduced χ² (n − p = {r.n - r.p})</dt>
          <dd className="num">{f(r.reducedChiSquare)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">AICc</dt>
          <dd className="num">{f(r.aicc)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">BIC</dt>
          <dd className="num">{f(r.bic)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">measurements n / parameters p</dt>
          <dd className="num">
            {r.n} / {r.p}
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">solver</dt>
          <dd className="text-xs">
            {r.convergence.converged ? "converged" : "not converged"} ({r.convergence.reason}),{" "}
            {r.convergence.starts.length} starts, {r.convergence.evaluations} evaluations
          </dd>
        </div>
        <div>
          <dt className="text-xs text-ink-soft">fit time</dt>
          <dd className="num">{f(model.elapsedMs / 1000, 3)} s</dd>
        </div>
      </dl>
    </Panel>
  );
}
