/**
 * Runs an image readout off the event loop in a child Node process (readout-child.ts), killed
 * when the job is cancelled or runs past READOUT_TIME_LIMIT_MS. A 4096² image is ~2 s of pure
 * computation; in-process every other request would wait for it. Readout errors come back as the
 * same AppError (code, message, details) the in-process path throws.
 *
 * READOUT_IN_PROCESS=1 runs the same function in this process instead (measurements, debugging).
 */
import { spawn } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { AppError, type ErrorCode } from "../errors";
import { JobCancelledError } from "../jobs/types";
import { runImageReadout, type ImageReadoutOutput } from "./readout-image";
import type { ImageReadoutResult } from "./readout-result";
import type { StoredImageSettings } from "./readout-settings";

/** Longest one image readout may run, ms (design choice: 20× the 4096² bench figure, and start-up). */
export const READOUT_TIME_LIMIT_MS = 3 * 60_000;

export const readoutRunner = (): "child-process" | "in-process" => (process.env.READOUT_IN_PROCESS === "1" ? "in-process" : "child-process");

const DERIVED = ["spectrum.json", "preview.png", "fft.png"] as const;

export async function readImage(
  bytes: Uint8Array,
  settings: StoredImageSettings,
  signal: AbortSignal,
  step: (fraction: number, note: string) => Promise<void>,
): Promise<ImageReadoutOutput> {
  if (signal.aborted) throw new JobCancelledError();
  if (readoutRunner() === "in-process") return runImageReadout(bytes, settings, step);
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-readout-"));
  try {
    const input = path.join(dir, "input"), settingsFile = path.join(dir, "settings.json");
    writeFileSync(input, bytes);
    writeFileSync(settingsFile, JSON.stringify(settings));
    const stdout = await new Promise<string>((resolve, reject) => {
      const child = spawn(process.execPath, ["--import", "tsx", "lib/server/data/readout-child.ts", "--input", input, "--settings", settingsFile, "--out", dir], { cwd: process.cwd(), stdio: ["ignore", "pipe", "pipe"], env: { ...process.env, NODE_OPTIONS: "" } });
      const out: Buffer[] = [];
      let pending = "", stderr = "", failure: { code: ErrorCode; message: string; details: unknown } | null = null;
      let progress = Promise.resolve();
      child.stdout.on("data", (b: Buffer) => out.push(b));
      child.stderr.on("data", (b: Buffer) => {
        const lines = (pending + b.toString()).split("\n");
        pending = lines.pop() ?? "";
        for (const line of lines) {
          if (line.startsWith("progress ")) {
            try {
              const q = JSON.parse(line.slice(9)) as { fraction: number; note: string };
              progress = progress.then(() => step(q.fraction, q.note)).catch(() => undefined);
            } catch {
              // a torn line; the next one will do
            }
          } else if (line.startsWith("error ")) {
            failure = JSON.parse(line.slice(6)) as typeof failure;
          } else stderr += line + "\n";
        }
      });
      const kill = () => child.kill("SIGKILL");
      signal.addEventListener("abort", kill, { once: true });
      let timedOut = false;
      const timer = setTimeout(() => {
        timedOut = true;
        kill();
      }, READOUT_TIME_LIMIT_MS);
      child.on("error", (e) => reject(e));
      child.on("close", (code) => {
        clearTimeout(timer);
        signal.removeEventListener("abort", kill);
        void progress.then(() => {
          if (signal.aborted) return reject(new JobCancelledError());
          if (timedOut) return reject(new AppError("unprocessable", `the readout took longer than ${READOUT_TIME_LIMIT_MS / 60_000} minutes and was stopped; draw a smaller region of interest or try again when the server is less busy`));
          const f = failure as { code: ErrorCode; message: string; details: unknown } | null;
          if (f) return reject(new AppError(f.code, f.message, f.details ?? undefined));
          if (code !== 0) return reject(new Error(`the readout process exited with code ${code}: ${stderr.trim().slice(-500)}`));
          resolve(Buffer.concat(out).toString("utf8"));
        });
      });
    });
    const result = JSON.parse(stdout) as ImageReadoutResult;
    const derived = Object.fromEntries(DERIVED.map((name) => [name, readFileSync(path.join(dir, name))])) as ImageReadoutOutput["derived"];
    return { result, derived };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
