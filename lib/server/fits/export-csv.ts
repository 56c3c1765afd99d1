/**
 * A finished fit as CSV: one section per table, `#` lines naming it, lengths in µm. Parameters
 * (value, SE, 95 % profile interval) per kinetics, then measured against predicted per datum,
 * then the ranking when several kinetics were compared.
 */
import { readoutIdsOfDatum } from "./specimen-pool";
import "server-only";
import type { FitDetailDto } from "./fits";
import { csvComment, csvRow } from "../web/csv";

/** Parameters table: one row per fitted coordinate of every kinetics. */
export function fitParametersCsv(fit: FitDetailDto): string {
  const lines = [
    csvRow([
      "kinetics",
      "parameter",
      "condition",
      "value",
      "standard_error",
      "ci95_lower",
      "ci95_upper",
      "ci95_lower_open",
      "ci95_upper_open",
      "log_scaled",
      "at_bound",
    ]),
  ];
  for (const m of fit.result?.models ?? []) {
    for (const p of m.fit.parameters) {
      lines.push(
        csvRow([
          m.label,
          p.parameter,
          p.condition,
          p.value,
          p.standardError,
          p.interval95?.lower.value,
          p.interval95?.upper.value,
          p.interval95?.lower.open,
          p.interval95?.upper.open,
          p.log,
          p.atBound,
        ]),
      );
    }
  }
  return lines.join("\n") + "\n";
}

/** Predictions table: one row per datum of every kinetics. */
export function fitPredictionsCsv(fit: FitDetailDto): string {
  const lines = [
    csvRow([
      "kinetics",
      "datum",
      "condition",
      "kind",
      "measured_um",
      "measured_fourier_um",
      "uncertainty_fourier_um",
      "predicted_fourier_um",
      "residual_sd",
      "turing",
      "readout_id",
    ]),
  ];
  for (const m of fit.result?.models ?? []) {
    for (const r of m.fit.residuals) {
      lines.push(
        csvRow([
          m.label,
          r.index,
          r.condition,
          r.kind,
          r.measuredUm,
          r.measuredFourierUm,
          r.uncertaintyFourierUm,
          r.predictedUm,
          r.residual,
          r.turing,
          readoutIdsOfDatum(fit.provenance.data, r.index),
        ]),
      );
    }
  }
  return lines.join("\n") + "\n";
}

export function fitToCsv(fit: FitDetailDto): string {
  const out = [
    csvComment(
      `Fit ${fit.name} (${fit.id}); lengths in um; software ${fit.softwareVersion}; spec sha256 ${fit.inputSha256}`,
    ),
    "# Model fits are hypotheses, not measurements.",
    "",
    "# parameters",
    fitParametersCsv(fit),
    "# predictions",
    fitPredictionsCsv(fit),
  ];
  const models = fit.result?.models ?? [];
  out.push(
    "# goodness of fit",
    csvRow(["kinetics", "n", "p", "chi_square", "reduced_chi_square", "aicc", "bic", "identifiable", "verdict"]),
  );
  for (const m of models)
    out.push(
      csvRow([
        m.label,
        m.fit.n,
        m.fit.p,
        m.fit.chiSquare,
        m.fit.reducedChiSquare,
        m.fit.aicc,
        m.fit.bic,
        m.fit.identifiability.identifiable,
        m.fit.verdict,
      ]),
    );
  if (fit.result?.comparison) {
    out.push(
      "",
      "# ranking by AICc",
      csvRow(["rank", "kinetics", "aicc", "delta_aicc", "akaike_weight", "bic", "chi_square", "p", "verdict"]),
    );
    for (const r of fit.result.comparison.ranking)
      out.push(csvRow([r.rank, r.label, r.aicc, r.deltaAicc, r.akaikeWeight, r.bic, r.chiSquare, r.p, r.verdict]));
  }
  return out.join("\n") + "\n";
}
