/**
 * Worker processes for the crash test and the bench: `npm run worker` (lib/cli/worker.ts) started
 * as child processes against a test stack's database, object storage and mail.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import { writeFileSync } from "node:fs";
import path from "node:path";
import type { LabContext } from "@/lib/server/access";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { startReadout } from "@/lib/server/readouts/readouts";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { storeUpload } from "@/lib/server/uploads/uploads";
import { stackChildEnv, type TestStack } from "../support/stack";

export interface WorkerProcess {
  child: ChildProcess;
  output: () => string;
  /** Resolves when the process has exited. */
  exited: Promise<unknown>;
}

/** Starts `lib/cli/worker.ts` on the stack's database and services. */
export function startWorker(stack: TestStack, concurrency: number): WorkerProcess {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "lib/cli/worker.ts"], {
    cwd: process.cwd(),
    stdio: ["ignore", "pipe", "pipe"],
    env: {
      ...stackChildEnv(stack),
      WORKER_CONCURRENCY: String(concurrency),
      SIMULATION_THREADS: "1",
      JOB_MAIL_AFTER_S: "3600",
    },
  });
  let out = "";
  child.stdout!.on("data", (b: Buffer) => (out += b.toString()));
  child.stderr!.on("data", (b: Buffer) => (out += b.toString()));
  const exited = new Promise((r) => child.once("exit", r));
  return { child, output: () => out, exited };
}

/** Stops a worker process and waits for it (SIGKILL: the test does not need a graceful stop). */
export async function killWorker(w: WorkerProcess): Promise<void> {
  if (w.child.exitCode !== null || w.child.signalCode !== null) return;
  w.child.kill("SIGKILL");
  await w.exited;
}

/** Polls `check` every 100 ms until it returns a value, or throws after `timeoutMs`. */
export async function pollFor<T>(what: string, timeoutMs: number, check: () => Promise<T | null>): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== null) return value;
    if (Date.now() > until) throw new Error(`${what}: not within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Uploads a 64² stripe image (period 16 px) and queues its readout; returns the readout's job id. */
export async function queueImageReadout(ctx: LabContext, dir: string, i: number): Promise<string> {
  const study = await createStudy(ctx, {
    name: `Workers ${i} ${Math.random().toString(36).slice(2, 7)}`,
    tissue: "skin",
    organism: "chick",
    description: null,
  });
  const specimen = await createSpecimen(ctx, study.id, {
    label: `W-${i}`,
    condition: "control",
    stage: null,
    genotype: null,
    notes: null,
  });
  const bytes = await encodePng(
    makeStripes({ width: 64, height: 64, wavelengthPx: 16, angleDeg: 0, noise: 0.05, seed: i }),
  );
  const file = path.join(dir, `stripes-${i}.png`);
  writeFileSync(file, bytes);
  const upload = await storeUpload(ctx, specimen.id, {
    path: file,
    filename: `stripes-${i}.png`,
    sizeBytes: bytes.length,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    kind: "image",
    contentType: "image/png",
    pixelSizeUm: 0.5,
    pixelSizeSource: "uploader",
  });
  return (await startReadout(ctx, upload.id, {})).jobId!;
}
