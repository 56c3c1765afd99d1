/**
 * A methods paragraph for a finished fit: plain text with units, the kinetics' published source
 * and the methods' citations, ready to paste into a manuscript and edit.
 */
import "server-only";
import { formatFitNumber as f } from "./export-number";
import type { FitDetailDto } from "./fits";

const METHOD_REFERENCES = [
  "Levenberg K. (1944) Q. Appl. Math. 2:164–168; Marquardt D.W. (1963) J. Soc. Ind. Appl. Math. 11:431–441 (Levenberg–Marquardt least squares).",
  "Raue A. et al. (2009) Bioinformatics 25:1923–1929 (profile likelihood).",
  "Burnham K.P. & Anderson D.R. (2002) Model Selection and Multimodel Inference, 2nd ed., Springer (AICc, Akaike weights).",
  "Schwarz G. (1978) Ann. Stat. 6:461–464 (BIC).",
];

function describeSetting(name: string, s: FitDetailDto["spec"]["models"][number]["parameters"][string]): string {
  if (s.mode === "fixed")
    return typeof s.value === "number"
      ? `${name} = ${f(s.value)} (fixed)`
      : `${name} fixed per condition (${Object.entries(s.value)
          .map(([c, v]) => `${c}: ${f(v)}`)
          .join(", ")})`;
  const where = s.mode === "per-condition" ? "fitted separately for each condition" : "fitted";
  return `${name} ${where} within [${f(s.lower)}, ${f(s.upper)}]${s.log ? " on a log scale" : ""}`;
}

export function fitMethodsText(fit: FitDetailDto): string {
  const r = fit.result;
  const prov = fit.provenance;
  const conditions = [...new Set(fit.spec.data.map((d) => d.condition))];
  const readouts = prov.data.filter((d) => d.source === "readout").length;
  const nn = fit.spec.data.filter((d) => d.kind === "nearest-neighbour").length;
  const settings = prov.settings as {
    seededStarts?: number;
    turingSamples?: number;
    reachSigma?: number;
    absoluteUncertainties?: boolean;
  };
  const parts: string[] = [];
  parts.push(
    `Measured pattern wavelengths (${fit.spec.data.length} measurements in ${conditions.length} condition${conditions.length === 1 ? "" : "s"}: ${conditions.join(", ")}; ${readouts} read from images or spacing tables by Morphokin's spacing readout, ${fit.spec.data.length - readouts} entered as values) were compared with the wavelength 2π/k* of the fastest-growing Turing mode predicted by linear stability analysis of reaction–diffusion kinetics.`,
  );
  if (nn > 0)
    parts.push(
      `Nearest-neighbour spacings a of hexagonally arranged spots (${nn} measurements) were converted to Fourier wavelengths as λ = (√3/2)·a before fitting, and their uncertainties scaled by the same factor.`,
    );
  for (const [i, m] of fit.spec.models.entries()) {
    const k = prov.kinetics[i];
    const scale =
      m.lengthScaleUm !== undefined ? ` with a length scale of ${f(m.lengthScaleUm)} µm per model length unit` : "";
    parts.push(
      `${k.name}${k.version ? ` (lab kinetics, version ${k.version})` : ""} kinetics (${k.source || "source not recorded"})${scale}: ${Object.entries(
        m.parameters,
      )
        .map(([n, s]) => describeSetting(n, s))
        .join("; ")}.`,
    );
  }
  parts.push(
    `Parameters were estimated by weighted least squares, minimising χ² = Σ ((λ_pred − λ_meas)/s)² over the measurement uncertainties s (µm), with a bounded Levenberg–Marquardt algorithm started from the given values and ${settings.seededStarts ?? 4} further starts chosen from ${settings.turingSamples ?? 64} seeded points of the parameter box; only parameter values giving a Turing instability (stable without diffusion, a real growing mode at k > 0) counted as predictions. Standard errors come from (JᵀWJ)⁻¹${settings.absoluteUncertainties === false ? " scaled by χ²/(n − p)" : ""}, and 95 % confidence intervals from the profile likelihood (Δχ² = 3.84; Raue et al. 2009). Identifiability was judged from n against p, the singular values of the sensitivity matrix and the flatness of the profiles.`,
  );
  if (fit.spec.models.length > 1)
    parts.push(
      `The ${fit.spec.models.length} kinetics were ranked by the corrected Akaike information criterion AICc = χ² + 2p + 2p(p + 1)/(n − p − 1) with Akaike weights (Burnham & Anderson 2002); BIC = χ² + p ln n is reported alongside (Schwarz 1978).`,
    );
  if (r) {
    for (const m of r.models) {
      const values = m.fit.parameters.map((p) => {
        const ci = p.interval95
          ? `, 95 % CI ${p.interval95.lower.value === null ? "open" : f(p.interval95.lower.value)} to ${p.interval95.upper.value === null ? "open" : f(p.interval95.upper.value)}`
          : "";
        return `${p.name} = ${f(p.value)}${p.standardError !== null ? ` ± ${f(p.standardError)} (SE)` : ""}${ci}`;
      });
      parts.push(
        `${m.label}: ${values.join("; ")}; χ² = ${f(m.fit.chiSquare)} for n = ${m.fit.n} and p = ${m.fit.p}${m.fit.aicc !== null ? `, AICc = ${f(m.fit.aicc)}` : ""}. ${m.fit.identifiability.identifiable ? "" : "The parameters were not identifiable from these data: " + m.fit.identifiability.reasons.join(" ") + " "}${m.fit.verdictReason}`,
      );
    }
  }
  parts.push(
    `Computed with ${fit.softwareVersion} (fit ${fit.id}; input SHA-256 ${fit.inputSha256}). Model fits are hypotheses to be tested, not measurements.`,
  );
  const refs = [...new Set(prov.kinetics.map((k) => k.source).filter(Boolean)), ...METHOD_REFERENCES];
  return `${parts.join(" ")}\n\nReferences\n${refs.map((x) => `- ${x}`).join("\n")}\n`;
}
