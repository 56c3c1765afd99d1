/**
 * Runs an image or table readout off the event loop in a child Node process
 * (lib/workers/readout-child.ts, started by lib/workers/start-child.ts), killed when the job is cancelled or runs past
 * READOUT_TIME_LIMIT_MS. A 4096² image is ~2 s of pure computation, and parsing a 1 000 000-row
 * CSV with its statistics ~5 s; in-process every other request would wait for it. Readout errors
 * come back as the same AppError (code, message, details) the in-process path throws.
 *
 * READOUT_IN_PROCESS=1 runs the same functions in this process instead (measurements, debugging).
 */
import "server-only";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { readFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { readConfig } from "../config";
import { AppError, type ErrorCode } from "../errors";
import { parseProtocolLine, startChild } from "@/lib/workers/start-child";
import { withImageInput } from "@/lib/workers/image-file";
import { JobCancelledError } from "../jobs/types";
import { runImageReadout, type ImageReadoutOutput } from "./image";
import type { ImageReadoutResult, TableReadoutResult } from "./result";
import type { StoredImageSettings, StoredTableSettings } from "./settings";
import { runTableReadout } from "./table";

/** Longest one image readout may run, ms (design choice: 20× the 4096² bench figure, and start-up). */
export const READOUT_TIME_LIMIT_MS = 3 * 60_000;

export const readoutRunner = (): "child-process" | "in-process" =>
  readConfig().readoutInProcess ? "in-process" : "child-process";

const DERIVED = ["spectrum.json", "preview.png", "fft.png"] as const;

/**
 * An image readout of the stored file: its path (the child reads it by ranges, never whole when
 * large) or its bytes (written to the child's folder first).
 */
export async function readImage(
  input: string | Uint8Array,
  settings: StoredImageSettings,
  signal: AbortSignal,
  step: (fraction: number, note: string) => Promise<void>,
): Promise<ImageReadoutOutput> {
  if (signal.aborted) throw new JobCancelledError();
  if (readoutRunner() === "in-process")
    return typeof input === "string"
      ? withImageInput(input, (image) => runImageReadout(image, settings, step))
      : runImageReadout(input, settings, step);
  return inChild(input, settings, signal, step, (stdout, dir) => {
    const result = JSON.parse(stdout) as ImageReadoutResult;
    const derived = Object.fromEntries(
      DERIVED.map((name) => [name, readFileSync(path.join(dir, name))]),
    ) as ImageReadoutOutput["derived"];
    return { result, derived };
  });
}

/** A CSV/TSV or XLSX table readout (parsing, column guess, spacing statistics); no derived objects. */
export async function readTable(
  input: string | Uint8Array,
  settings: StoredTableSettings,
  signal: AbortSignal,
): Promise<TableReadoutResult> {
  if (signal.aborted) throw new JobCancelledError();
  if (readoutRunner() === "in-process")
    return runTableReadout(typeof input === "string" ? await readFile(input) : input, settings);
  return inChild(
    input,
    settings,
    signal,
    async () => undefined,
    (stdout) => JSON.parse(stdout) as TableReadoutResult,
  );
}

/** Runs readout-child.ts on the file (or bytes) and settings; `read` turns its stdout (and out folder) into the result. */
async function inChild<T>(
  file: string | Uint8Array,
  settings: StoredImageSettings | StoredTableSettings,
  signal: AbortSignal,
  step: (fraction: number, note: string) => Promise<void>,
  read: (stdout: string, dir: string) => T,
): Promise<T> {
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-readout-"));
  try {
    const input = typeof file === "string" ? file : path.join(dir, "input"),
      settingsFile = path.join(dir, "settings.json");
    if (typeof file !== "string") writeFileSync(input, file);
    writeFileSync(settingsFile, JSON.stringify(settings));
    type Failure = { code: ErrorCode; message: string; details: unknown };
    let failure: Failure | null = null;
    let progress = Promise.resolve();
    const r = await startChild(
      "readout",
      ["--input", input, "--settings", settingsFile, "--out", dir, "--threads", String(readConfig().readoutThreads)],
      {
        signal,
        timeLimitMs: READOUT_TIME_LIMIT_MS,
        onLine(line) {
          const q = parseProtocolLine<{ fraction: number; note: string }>(line, "progress");
          if (q) progress = progress.then(() => step(q.fraction, q.note)).catch(() => undefined);
          failure = parseProtocolLine<Failure>(line, "error") ?? failure;
          return line.startsWith("progress ") || line.startsWith("error ");
        },
      },
    );
    await progress;
    if (r.timedOut)
      throw new AppError(
        "unprocessable",
        `the readout took longer than ${READOUT_TIME_LIMIT_MS / 60_000} minutes and was stopped; ${settings.kind === "table" ? "split the table" : "draw a smaller region of interest"} or try again when the server is less busy`,
      );
    const f = failure as Failure | null; // assigned in the callback, which TypeScript cannot follow
    if (f) throw new AppError(f.code, f.message, f.details ?? undefined);
    if (r.code !== 0) throw new Error(`the readout process exited with code ${r.code}: ${r.stderr.trim().slice(-500)}`);
    return read(r.stdout, dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
