/**
 * Job kind "simulation": runs the `simulate` command on the run's stored RUN.json in a child
 * process (lib/workers/simulate-child.ts) on SIMULATION_THREADS threads (a 256² run of 10 000 steps is about a
 * minute; in-process it would stop the server answering), reads its progress lines, kills it on
 * cancel, then colours the final fields and snapshots, reads the final pattern with the tissue
 * readout (readouts/process.ts) and stores everything.
 * Nothing half-written: objects are put first, the row becomes "succeeded" in one update, and a
 * failure removes the objects again.
 */
import "server-only";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { encodePng } from "@/lib/imaging";
import { ReadoutError } from "@/lib/readout";
import { imageReadoutSettingsSchema } from "@/lib/contracts/readout";
import { simulationRunKey } from "@/storage/keys";
import { AppError } from "../errors";
import { database, services } from "../services";
import { readImage } from "../readouts/process";
import { compareWithPrediction } from "./compare";
import { fieldRange, fieldToGrey, renderFieldPng } from "./images";
import { initialFieldFile, loadRunStartFields } from "./start";
import type { RunPlan, RunResult, RunSpec } from "./types";
import { parseProtocolLine, startChild } from "@/lib/workers/start-child";
import { JobCancelledError, type JobCleanup, type JobHandler } from "../jobs/types";

const GONE = "the run was removed before it finished";
/** Wall-clock limit of the simulation process: RUN_TIME_FACTOR × the CPU estimate + RUN_START_ALLOWANCE_S (design choice). */
const RUN_TIME_FACTOR = 10;
const RUN_START_ALLOWANCE_S = 120;

interface CliOutput {
  stopReason: RunResult["stopReason"];
  message: string;
  timeS: number;
  steps: number;
  dtS: number;
  adaptive: RunResult["adaptive"];
  stationary: boolean;
  lastChangeRatePerS: number | null;
  blowUp: RunResult["blowUp"];
  fields: RunResult["fields"];
  snapshots: { requestedTimeS: number; timeS: number; step: number }[];
}

/** Runs the CLI; resolves with its JSON, rejects with its error message. */
async function runCli(
  specFile: string,
  outDir: string,
  signal: AbortSignal,
  limitS: number,
  onProgress: (fraction: number, timeS: number, dtS: number | undefined) => void,
): Promise<CliOutput> {
  const r = await startChild(
    "simulate",
    ["--spec", specFile, "--out", outDir, "--threads", String(services().config.simulationThreads), "--progress"],
    {
      signal,
      timeLimitMs: limitS * 1000,
      onLine(line) {
        if (!line.startsWith("progress ")) return false;
        const q = parseProtocolLine<{ fraction: number; timeS: number; dtS?: number }>(line, "progress");
        if (q) onProgress(q.fraction, q.timeS, q.dtS);
        return true;
      },
    },
  );
  if (r.timedOut)
    throw new AppError(
      "unprocessable",
      `the simulation was stopped after ${Math.round(limitS)} s, far beyond its estimated ${Math.round((limitS - RUN_START_ALLOWANCE_S) / RUN_TIME_FACTOR)} s; the server may be overloaded — start it again later or make it smaller`,
    );
  if (r.code !== 0) {
    const last = r.stderr.trim().split("\n").pop() ?? "";
    let message = last || `the simulation process exited with code ${r.code}`;
    try {
      message = (JSON.parse(last) as { error: { message: string } }).error.message;
    } catch {
      // plain text
    }
    throw new AppError("unprocessable", `the simulation stopped with an error: ${message}`);
  }
  try {
    return JSON.parse(r.stdout) as CliOutput;
  } catch {
    throw new Error(`the simulation process printed no JSON result (${r.stdout.slice(0, 200)})`);
  }
}

const readField = (file: string) => {
  const b = readFileSync(file);
  return new Float64Array(b.buffer.slice(b.byteOffset, b.byteOffset + b.byteLength));
};

export const runSimulationJob: JobHandler = async (job, ctx) => {
  const m = await database();
  const { store } = services();
  const row = await m.SimulationRun.findOne({ where: { id: String(job.payload.runId ?? ""), labId: job.labId } });
  if (!row) throw new AppError("not_found", GONE);
  // A job restarted after a server stop finds its run "succeeded" if the process died after the row was written, before the job was.
  if (row.status === "succeeded") return { runId: row.id, stopReason: row.stopReason, wavelength: row.wavelengthUm };
  if (row.status !== "queued" && row.status !== "running")
    throw new AppError("conflict", `this run has already ${row.status}; start a new one instead`);
  const spec = row.spec as unknown as RunSpec,
    plan = row.plan as unknown as RunPlan;
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-run-"));
  const written: string[] = [];
  const put = async (name: string, body: Buffer, contentType: string) => {
    const key = simulationRunKey(row.labId, row.id, name);
    written.push(key);
    await store.put(key, body, { contentType, contentLength: body.length });
    return key;
  };
  try {
    await row.update({ status: "running" });
    const specFile = path.join(dir, "RUN.json");
    writeFileSync(specFile, JSON.stringify(spec, null, 2));
    const initialFields =
      "fieldFiles" in spec.initial
        ? await loadRunStartFields(row.labId, spec.initial.fromRun, plan.species.length, (key) => store.getBuffer(key))
        : [];
    initialFields.forEach((bytes, s) => writeFileSync(path.join(dir, initialFieldFile(s)), bytes));
    const t0 = Date.now();
    const unit = plan.timeUnit === "s" ? "s" : "model time";
    const tf = plan.timeFactor ?? 1;
    const out = await runCli(
      specFile,
      path.join(dir, "out"),
      ctx.signal,
      RUN_TIME_FACTOR * plan.estimatedCpuS + RUN_START_ALLOWANCE_S,
      (f, t, dt) =>
        void ctx.progress(
          0.9 * f,
          // The job's own figure (0.9 f) is the one progress shown; a second percentage here read as "74 % … (82 %)".
          `simulated t = ${Number((t * tf).toPrecision(4))} of ${Number((spec.endTimeS * tf).toPrecision(4))} ${unit}${dt ? `, step ${Number((dt * tf).toPrecision(3))} ${unit}` : ""}`,
        ),
    );
    const wallS = (Date.now() - t0) / 1000;
    await ctx.progress(0.9, "storing fields and images");
    const [nx, ny] = [spec.grid.cells[0], spec.grid.cells[1] ?? 1];
    const fileKeys: Record<string, string> = {};
    const finals = plan.species.map((_, s) =>
      readField(path.join(dir, "out", `final-${plan.species[s].replace(/[^A-Za-z0-9_-]/g, "_")}.f64`)),
    );
    for (let s = 0; s < finals.length; s++) {
      const bytes = Buffer.from(finals[s].buffer);
      fileKeys[`final-${s}.f64`] = await put(`final-${s}.f64`, bytes, "application/octet-stream");
      fileKeys[`final-${s}.png`] = await put(`final-${s}.png`, await renderFieldPng(finals[s], nx, ny), "image/png");
    }
    for (let s = 0; s < initialFields.length; s++)
      fileKeys[initialFieldFile(s)] = await put(initialFieldFile(s), initialFields[s], "application/octet-stream");
    const snapshots: RunResult["snapshots"] = [];
    for (let i = 0; i < out.snapshots.length; i++) {
      const range: { min: number; max: number }[] = [];
      for (let s = 0; s < plan.species.length; s++) {
        const f = readField(
          path.join(dir, "out", `snapshot-${i}-${plan.species[s].replace(/[^A-Za-z0-9_-]/g, "_")}.f64`),
        );
        range.push(fieldRange(f));
        fileKeys[`snapshot-${i}-${s}.png`] = await put(
          `snapshot-${i}-${s}.png`,
          await renderFieldPng(f, nx, ny),
          "image/png",
        );
      }
      snapshots.push({ ...out.snapshots[i], range });
    }
    if (ctx.signal.aborted) throw new JobCancelledError();
    await ctx.progress(0.95, "reading the final pattern");
    let readout: RunResult["readout"] = null,
      readoutSkipped: string | null = null;
    const cellX = spec.grid.lengthUm[0] / nx,
      cellY = ny > 1 ? spec.grid.lengthUm[1] / ny : cellX;
    if (Math.abs(cellX / cellY - 1) > 1e-9)
      readoutSkipped = "The cells are not square, so the image readout (one pixel size) cannot read this grid.";
    else {
      try {
        const png = await encodePng(fieldToGrey(finals[0], nx, ny), { bitDepth: 16 });
        const settings = {
          ...imageReadoutSettingsSchema.parse({}),
          pixelSizeUm: cellX,
          pixelSizeSource: "simulation cell size",
        };
        const r = await readImage(png, { ...settings, kind: "image" }, ctx.signal, async () => undefined);
        readout = r.result;
        for (const [name, body] of Object.entries(r.derived))
          fileKeys[name] = await put(name, body, name.endsWith(".json") ? "application/json" : "image/png");
      } catch (err) {
        // A pattern the readout cannot read (ReadoutError in-process, its AppError from the child process) is said, not fatal.
        if (!(err instanceof ReadoutError) && !(err instanceof AppError && err.code !== "unavailable")) throw err;
        readoutSkipped = err.message;
      }
    }
    const lf = plan.lengthFactor ?? 1;
    const w = readout?.wavelength;
    const comparison =
      readout && plan.prediction
        ? compareWithPrediction(
            w?.wavelengthUm != null ? w.wavelengthUm * lf : null,
            w?.uncertaintyUm != null ? w.uncertaintyUm * lf : null,
            plan.prediction.wavelength * lf,
            plan.lengthUnit,
          )
        : null;
    const ff = plan.fromFit;
    const measurementComparison =
      ff && comparison?.simulatedWavelength != null && plan.lengthUnit === "µm"
        ? compareWithPrediction(comparison.simulatedWavelength, comparison.uncertainty, ff.measuredMeanUm, "µm", {
            what: `the measured mean of “${ff.condition}” (n = ${ff.n})`,
            referenceUncertainty: ff.measuredSeUm,
          })
        : null;
    const result: RunResult = {
      stopReason: out.stopReason,
      message: out.message,
      timeS: out.timeS,
      steps: out.steps,
      dtS: out.dtS,
      adaptive: out.adaptive ?? null,
      stationary: out.stationary,
      lastChangeRatePerS: out.lastChangeRatePerS,
      blowUp: out.blowUp,
      fields: out.fields,
      snapshots,
      readout,
      readoutSkipped,
      comparison,
      measurementComparison,
      finalSha256: finals.map((f) => createHash("sha256").update(Buffer.from(f.buffer)).digest("hex")),
      wallS,
    };
    fileKeys["result.json"] = await put("result.json", Buffer.from(JSON.stringify(result)), "application/json");
    fileKeys["run.json"] = await put("run.json", Buffer.from(JSON.stringify(spec, null, 2)), "application/json");
    const [updated] = await m.SimulationRun.update(
      {
        status: "succeeded",
        result: result as unknown as Record<string, unknown>,
        stopReason: out.stopReason,
        error: out.stopReason === "blow-up" ? out.message : null,
        wavelengthUm: comparison?.simulatedWavelength ?? null,
        uncertaintyUm: comparison?.uncertainty ?? null,
        agrees: comparison?.withinUncertainty ?? null,
        fileKeys,
        finishedAt: new Date(),
      },
      { where: { id: row.id, status: "running" } },
    );
    if (updated === 0) throw new AppError("not_found", GONE);
    written.length = 0;
    return { runId: row.id, stopReason: out.stopReason, wavelength: comparison?.simulatedWavelength ?? null, wallS };
  } catch (err) {
    for (const key of written)
      await store.delete(key).catch((e) => console.error(`could not remove run object ${key}`, e));
    const cancelled = err instanceof JobCancelledError || ctx.signal.aborted;
    const message = cancelled
      ? "the run was cancelled"
      : err instanceof AppError
        ? err.message
        : "the run failed on the server; the error was logged";
    await m.SimulationRun.update(
      {
        status: cancelled ? "cancelled" : "failed",
        error: message,
        result: null,
        fileKeys: null,
        finishedAt: new Date(),
      },
      { where: { id: row.id } },
    ).catch(() => undefined);
    if (cancelled) throw new JobCancelledError();
    throw err;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
};

/** Every object name a run may store (its keys are fixed by the run's id; a re-run overwrites them). */
function runObjectNames(spec: RunSpec, plan: RunPlan): string[] {
  const names = ["result.json", "run.json", "spectrum.json", "preview.png", "fft.png"];
  plan.species.forEach((_, s) => {
    names.push(`final-${s}.f64`, `final-${s}.png`, initialFieldFile(s));
    spec.snapshotTimesS.forEach((_t, i) => names.push(`snapshot-${i}-${s}.png`));
  });
  return names;
}

/** A killed attempt may have put objects; removes them all when the run ends without success. */
export const cleanUpSimulationJob: JobCleanup = async (job) => {
  const m = await database();
  const row = await m.SimulationRun.findOne({ where: { id: String(job.payload.runId ?? ""), labId: job.labId } });
  if (!row || row.status === "succeeded") return;
  for (const name of runObjectNames(row.spec as unknown as RunSpec, row.plan as unknown as RunPlan))
    await services().store.delete(simulationRunKey(row.labId, row.id, name));
};
