"use client";
/** The numbers beside the dispersion plot: class, steady state, k*, σ(k*), bands, λ*, domain mode, Turing conditions. */
import { formatNumber as f, type unitsFor } from "@/components/charts/dispersion-format";
import { Badge } from "@/components/ui/panel";
import type { DispersionDto } from "@/lib/server/kinetics/analyses";

type Units = ReturnType<typeof unitsFor>;

function Row({ label, children, testId }: { label: string; children: React.ReactNode; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-rule/60 py-1 last:border-0">
      <dt className="text-ink-soft">{label}</dt>
      <dd className="num text-right" data-testid={testId}>
        {children}
      </dd>
    </div>
  );
}

const REPEAT_LABEL: Record<string, string> = {
  wavelengthsAcross: "wavelengths across L",
  maxima: "maxima",
  wavelengthsAcrossX: "wavelengths across Lx",
  wavelengthsAcrossY: "wavelengths across Ly",
  degree: "degree l",
  multiplicity: "multiplicity 2l + 1",
  wavelengthsAroundGreatCircle: "wavelengths around a great circle",
};

export function DispersionNumbers({
  r,
  units,
  species,
  dimensional,
}: {
  r: DispersionDto;
  units: Units;
  species: string[];
  dimensional: boolean;
}) {
  const turing = r.classification.classes.includes("turing");
  const tone = turing ? "iris" : r.classification.classes.includes("stable") ? "plain" : "ochre";
  const fs = r.fastest;
  const tc = r.turingConditions;
  const physical = r.scales.lengthScaleUm !== null;
  const lenUm = (model: number | null | undefined) =>
    model == null ? "—" : physical ? `${f(model * (r.scales.lengthScaleUm as number))} µm` : "— µm (give ℓ)";
  return (
    <div className="space-y-3 text-sm">
      <dl>
        <Row label="Classification" testId="classification">
          <Badge tone={tone}>{r.classification.label}</Badge>
          {r.classification.marginal && <span className="ml-1 text-xs text-ochre">marginal</span>}
        </Row>
        <Row label="Steady state">
          {species.map((s) => `${s}* = ${f(r.steadyState.values[s])}`).join(", ")}
          {r.steadyStates.length > 1 && (
            <span className="text-xs text-ink-soft">
              {" "}
              (#{r.steadyState.index + 1} of {r.steadyStates.length})
            </span>
          )}
        </Row>
        <Row label="k* (fastest growing)" testId="k-star">
          {fs ? `${f(fs.kStar * units.kFactor)} ${units.k}` : "none grows"}
        </Row>
        <Row label="σ(k*)">
          {fs ? `${f(fs.sigmaStar * units.sigmaFactor)} ${units.sigma}` : "—"}
          {fs && fs.imSigmaStar !== 0 && <span className="text-xs"> (Im {f(fs.imSigmaStar * units.sigmaFactor)})</span>}
        </Row>
        <Row label="Unstable band">
          {r.bands.length
            ? r.bands.map((b) => `${f(b.kLow * units.kFactor)}–${f(b.kHigh * units.kFactor)}`).join(", ") +
              ` ${units.k}`
            : "none"}
        </Row>
        <Row label="Predicted wavelength 2π/k*" testId="predicted-wavelength">
          {fs ? (
            <span className="text-iris">
              {dimensional ? (
                `${f(fs.wavelength)} µm`
              ) : (
                <>
                  {f(fs.wavelength)} model length · {lenUm(fs.wavelength)}
                </>
              )}
            </span>
          ) : (
            "—"
          )}
        </Row>
      </dl>
      {r.domain && (
        <dl className="rounded-md border border-rule p-2" data-testid="domain-mode">
          <Row label="Fastest admissible mode">{`(${r.domain.fastestMode.indices.join(", ")}) · k = ${f(r.domain.fastestMode.k * units.kFactor)} ${units.k}`}</Row>
          <Row label="its σ">{`${f(r.domain.fastestMode.sigma * units.sigmaFactor)} ${units.sigma}`}</Row>
          <Row label="its wavelength">{`${f(r.domain.fastestMode.wavelength * units.lengthFactor)} ${units.length}`}</Row>
          {Object.entries(r.domain.fastestMode.repeats).map(([k, v]) => (
            <Row key={k} label={REPEAT_LABEL[k] ?? k}>
              {f(v)}
            </Row>
          ))}
          <Row label="Patterning expected">
            {r.domain.patterningExpected ? (
              <span className="text-ochre">yes · {r.domain.unstableModeCount} growing mode(s)</span>
            ) : (
              "no admissible mode grows"
            )}
          </Row>
        </dl>
      )}
      {tc && (
        <div data-testid="turing-conditions">
          <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-soft">
            Turing conditions (2 species)
          </h3>
          <table className="w-full text-xs">
            <tbody>
              {tc.conditions.map((c) => (
                <tr key={c.name} className="border-b border-rule/60 last:border-0">
                  <td className="num py-0.5 pr-2">{c.name}</td>
                  <td className="num py-0.5 text-right">{f(c.value)}</td>
                  <td className={`py-0.5 pl-2 ${c.satisfied ? "text-moss" : "text-brick"}`}>
                    {c.satisfied ? "✓" : "✗"}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <dl className="mt-2 text-xs">
            <Row label="D_v/D_u now">{f(tc.diffusionRatio)}</Row>
            <Row label="critical ratio d_c" testId="critical-ratio">
              {tc.criticalRatio !== null
                ? `${f(tc.criticalRatio)} (Turing when ${tc.unstableWhenRatio})`
                : "undefined (J not stable)"}
            </Row>
            <Row label="k_c at threshold">
              {tc.criticalWavenumber !== null ? `${f(tc.criticalWavenumber * units.kFactor)} ${units.k}` : "—"}
            </Row>
          </dl>
        </div>
      )}
      <p className="text-xs text-ink-soft">
        Model predictions are hypotheses to test against measured wavelengths, not measurements.
      </p>
    </div>
  );
}
