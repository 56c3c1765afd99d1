/**
 * Runs one model of a stored fit off the event loop: a child Node process running
 * lib/workers/fit-child.ts (the command line's `fit` for catalogue kinetics, the stored definition
 * for lab kinetics), killed when the job is cancelled. One fit with
 * profiles takes seconds of pure computation; in-process it would stall every other request.
 *
 * FIT_IN_PROCESS=1 runs the same function in this process instead (measurements, debugging).
 */
import "server-only";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { WavelengthFitResult } from "@/lib/fitting";
import { readConfig } from "../config";
import { AppError } from "../errors";
import { startChild } from "@/lib/workers/start-child";
import { JobCancelledError } from "../jobs/types";
import { fitStoredModel, singleModelFile } from "./model-run";
import type { StoredFitModel, StoredFitSpec } from "./spec-types";

/** Longest one model may run, ms (a runaway fit is killed and the job fails saying so). */
export const FIT_MODEL_TIME_LIMIT_MS = 10 * 60_000;

export const fitRunner = (): "child-process" | "in-process" =>
  readConfig().fitInProcess ? "in-process" : "child-process";

/** Fits one model; the result is exactly what `cli fit --spec … --json` prints (without `kinetics`). */
export async function fitModel(
  spec: StoredFitSpec,
  model: StoredFitModel,
  signal: AbortSignal,
): Promise<WavelengthFitResult> {
  if (signal.aborted) throw new JobCancelledError();
  if (fitRunner() === "in-process") return fitStoredModel(spec, model);
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-fit-"));
  const file = path.join(dir, "fit.json");
  writeFileSync(file, JSON.stringify(singleModelFile(spec, model)));
  try {
    const r = await startChild("fit", ["--spec", file], { signal, timeLimitMs: FIT_MODEL_TIME_LIMIT_MS });
    if (r.timedOut)
      throw new AppError(
        "unprocessable",
        `fitting ${model.label} took longer than ${FIT_MODEL_TIME_LIMIT_MS / 60_000} minutes and was stopped; free fewer parameters or lower options.turingSamples`,
      );
    const stderr = r.stderr.trim();
    if (r.code !== 0)
      throw new AppError(
        "unprocessable",
        `fitting ${model.label} failed: ${stderr.split("\n").filter(Boolean).pop() ?? `exit code ${r.code}`}`,
      );
    try {
      const { kinetics: _k, ...result } = JSON.parse(r.stdout) as WavelengthFitResult & { kinetics: string };
      return result;
    } catch (e) {
      throw new Error(
        `the fit process printed no JSON result (${(e as Error).message}); stderr: ${stderr.slice(0, 500)}`,
      );
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
