/**
 * Job kinds "fit" (one kinetics) and "fit-comparison" (several on the same data, ranked by AICc).
 * Each kinetics is fitted in a child process (lib/server/fits/process.ts), one after the
 * other, so progress moves per kinetics and the server's event loop stays free; the predictions
 * at the best fit and the ranking are computed here afterwards (cheap).
 *
 * Nothing half-written: the fit row becomes "succeeded" with its whole result in one conditional
 * update; any failure leaves it "failed" (or "cancelled") with the reason and no result.
 */
import "server-only";
import { compareFits } from "@/lib/fitting";
import { AppError } from "../errors";
import { database } from "../services";
import { fitModel, fitRunner } from "./process";
import { predictAtFit } from "./predictions";
import { fitSummaryOf } from "./summary";
import type { FittedModelResult, StoredFitResult } from "./result";
import type { FitProvenance, StoredFitSpec } from "./spec-types";
import { JobCancelledError, type JobHandler } from "../jobs/types";

const GONE = "the fit was removed before it finished";
/** Typical seconds per kinetics with profiles (bench: ~1–5 s), for the progress estimate between steps. */
const TYPICAL_MODEL_S = 4;

export const runFitJob: JobHandler = async (job, ctx) => {
  const m = await database();
  const row = await m.Fit.findOne({ where: { id: String(job.payload.fitId ?? ""), labId: job.labId } });
  if (!row) throw new AppError("not_found", GONE);
  // A job restarted after a server stop finds its fit "succeeded" if the process died after the row was written, before the job was.
  if (row.status === "succeeded") return { fitId: row.id, restored: true };
  if (row.status !== "queued" && row.status !== "running")
    throw new AppError("conflict", `this fit has already ${row.status}; re-run it instead`);
  const spec = row.spec as unknown as StoredFitSpec;
  const prov = row.provenance as unknown as FitProvenance;
  const t0 = Date.now();
  let ticker: ReturnType<typeof setInterval> | undefined;
  try {
    await row.update({ status: "running" });
    const n = spec.models.length;
    const models: FittedModelResult[] = [];
    for (const [i, model] of spec.models.entries()) {
      if (ctx.signal.aborted) throw new JobCancelledError();
      const started = Date.now();
      const note = `fitting ${model.label}${n > 1 ? ` (${i + 1} of ${n})` : ""}`;
      await ctx.progress(i / n + 0.02, note);
      // The child reports nothing until it is done; move the bar on an estimate meanwhile.
      ticker = setInterval(() => {
        const s = (Date.now() - started) / 1000;
        void ctx
          .progress((i + 0.9 * (1 - Math.exp(-s / TYPICAL_MODEL_S))) / n, `${note}, ${Math.round(s)} s`)
          .catch(() => undefined);
      }, 1000);
      const fit = await fitModel(spec, model, ctx.signal);
      clearInterval(ticker);
      ticker = undefined;
      const predictions = predictAtFit(spec, model, fit);
      models.push({
        label: model.label,
        kinetics: prov.kinetics[i],
        fit,
        predictions,
        elapsedMs: Date.now() - started,
      });
    }
    await ctx.progress(0.98, "saving");
    const comparison = n > 1 ? compareFits(models.map((x) => ({ label: x.label, result: x.fit }))) : null;
    const result: StoredFitResult = { models, comparison, runner: fitRunner(), elapsedMs: Date.now() - t0 };
    // JSON round trip first, so what is stored is exactly what is returned (∞ → null as in JSON).
    const stored = JSON.parse(JSON.stringify(result)) as Record<string, unknown>;
    // The list's summary, also the job's own answer: one place picks the best kinetics and its verdict.
    const summary = fitSummaryOf(spec, prov, stored as unknown as StoredFitResult);
    const [updated] = await m.Fit.update(
      { status: "succeeded", result: stored, summary: summary as unknown as Record<string, unknown>, error: null },
      { where: { id: row.id, status: "running" } },
    );
    if (updated === 0) throw new AppError("not_found", GONE);
    return { fitId: row.id, best: summary.best, verdict: summary.verdict, elapsedMs: result.elapsedMs };
  } catch (err) {
    if (ticker) clearInterval(ticker);
    const cancelled = err instanceof JobCancelledError || ctx.signal.aborted;
    const message = cancelled
      ? "the fit was cancelled"
      : err instanceof AppError
        ? err.message
        : "the fit failed on the server; the error was logged";
    await m.Fit.update(
      { status: cancelled ? "cancelled" : "failed", error: message, result: null },
      { where: { id: row.id } },
    ).catch(() => undefined);
    if (cancelled) throw new JobCancelledError();
    throw err;
  }
};
