/**
 * Jobs survive a server stop: at start-up (lib/server/startup.ts, called by instrumentation.ts)
 * a job a dead process left "running" is re-queued once and completes, a second interruption
 * fails it with the reason, its readout ends in the job's state, objects a killed attempt wrote
 * are overwritten or removed, and queued jobs start without any new job being queued. One test
 * kills a real second process mid-job (SIGKILL) and recovers its job here; the last one checks
 * that killed jobs' temporary folders are removed at start-up.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import type { LabContext } from "@/lib/server/access";
import { startReadout } from "@/lib/server/readouts/readouts";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { storeUpload } from "@/lib/server/uploads/uploads";
import { waitForJob } from "@/lib/server/jobs/queue";
import { INTERRUPTED_TWICE, RESTARTED_NOTE } from "@/lib/server/jobs/recovery";
import { forgetRunnerStateForTest, stopJobs } from "@/lib/server/jobs/worker";
import { removeStaleJobFolders, STALE_AFTER_MS } from "@/lib/server/jobs/temp-folders";
import { runStartupTasks } from "@/lib/server/startup";
import { database, services } from "@/lib/server/services";
import { readoutDerivedKey } from "@/storage/keys";
import { stackChildEnv, startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

let stack: TestStack;
let w: World;
let ctx: LabContext;
let tmp: string;

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  ctx = { actor: w.people.scientist.actor, labId: w.labId, labName: "Test Lab", role: "scientist" };
  tmp = mkdtempSync(path.join(tmpdir(), "morphokin-recovery-test-"));
});
afterAll(async () => {
  await stack?.close();
  rmSync(tmp, { recursive: true, force: true });
});

/** What a new server process does: a runner that has recovered nothing yet, then the start-up hook. */
async function restartServer() {
  await stopJobs();
  forgetRunnerStateForTest();
  await runStartupTasks();
}

/** A job row as a killed process leaves it: "running", started, with some progress. */
async function leftRunning(restarts: number) {
  const m = await database();
  return m.Job.create({
    labId: w.labId,
    kind: "echo",
    status: "running",
    startedAt: new Date(),
    progress: 0.4,
    progressNote: "step 4 of 10",
    payload: { ms: 50, value: "recovered" },
    requestedBy: null,
    restarts,
  });
}

/** An image readout whose job and row a killed process left "running", with a torn preview object. */
async function readoutLeftRunning(restarts: number) {
  await stopJobs(); // so the readout's job does not start before we "kill" it
  const m = await database();
  const study = await createStudy(ctx, {
    name: `Recovery ${Math.random().toString(36).slice(2, 7)}`,
    tissue: "skin",
    organism: "chick",
    description: null,
  });
  const specimen = await createSpecimen(ctx, study.id, {
    label: "R-1",
    condition: "control",
    stage: null,
    genotype: null,
    notes: null,
  });
  // Geometry is the source: stripes of period 16 px at 0.5 µm/px have λ = 8 µm.
  const bytes = await encodePng(
    makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 0, noise: 0.05, seed: 3 }),
  );
  const file = path.join(tmp, `stripes-${restarts}.png`);
  writeFileSync(file, bytes);
  const upload = await storeUpload(ctx, specimen.id, {
    path: file,
    filename: "stripes.png",
    sizeBytes: bytes.length,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    kind: "image",
    contentType: "image/png",
    pixelSizeUm: 0.5,
    pixelSizeSource: "uploader",
  });
  const readout = await startReadout(ctx, upload.id, {});
  await m.Job.update(
    { status: "running", startedAt: new Date(), progress: 0.5, restarts },
    { where: { id: readout.jobId! } },
  );
  await m.Readout.update({ status: "running" }, { where: { id: readout.id } });
  const previewKey = readoutDerivedKey(w.labId, upload.id, readout.id, "preview.png");
  await services().store.put(previewKey, Buffer.from("torn"), { contentType: "image/png", contentLength: 4 });
  return { readout, previewKey };
}

describe("jobs after a server stop", () => {
  it("a job left running is re-queued once with a note and then completes", async () => {
    const job = await leftRunning(0);
    await restartServer();
    const m = await database();
    const after = await m.Job.findByPk(job.id);
    // Either still queued with the note, or already picked up again (the runner starts it at once).
    expect(after!.restarts).toBe(1);
    if (after!.status === "queued") expect(after!.progressNote).toBe(RESTARTED_NOTE);
    expect(await waitForJob(job.id, 10_000)).toMatchObject({
      status: "succeeded",
      restarts: 1,
      result: { echo: "recovered" },
      error: null,
    });
  });

  it("a job interrupted a second time fails with the reason", async () => {
    const job = await leftRunning(1);
    await restartServer();
    expect(await waitForJob(job.id, 10_000)).toMatchObject({ status: "failed", error: INTERRUPTED_TWICE, restarts: 1 });
    expect(INTERRUPTED_TWICE).toMatch(/^failed: the server stopped twice while this job ran/);
  });

  it("a queued job starts at start-up without any new job being queued", async () => {
    await stopJobs();
    const m = await database();
    const job = await m.Job.create({
      labId: w.labId,
      kind: "echo",
      status: "queued",
      payload: { ms: 20, value: "waited" },
      requestedBy: null,
    });
    forgetRunnerStateForTest();
    await runStartupTasks();
    expect(await waitForJob(job.id, 10_000)).toMatchObject({ status: "succeeded", result: { echo: "waited" } });
  });

  it("a re-queued readout is read again and its torn derived object overwritten", async () => {
    const { readout, previewKey } = await readoutLeftRunning(0);
    await restartServer();
    expect(await waitForJob(readout.jobId!, 60_000)).toMatchObject({ status: "succeeded", restarts: 1 });
    const m = await database();
    const row = await m.Readout.findByPk(readout.id);
    expect(row!.status).toBe("succeeded");
    expect(row!.wavelengthUm).toBeCloseTo(8, 1); // 16 px × 0.5 µm/px, as above
    const preview = await services().store.getBuffer(previewKey);
    expect(preview.subarray(1, 4).toString("latin1")).toBe("PNG"); // PNG signature (PNG spec §5.2)
  });

  it("a readout whose job is given up ends failed with the same reason, and its torn objects are removed", async () => {
    const { readout, previewKey } = await readoutLeftRunning(1);
    await restartServer();
    expect(await waitForJob(readout.jobId!, 10_000)).toMatchObject({ status: "failed", error: INTERRUPTED_TWICE });
    const m = await database();
    const row = await m.Readout.findByPk(readout.id);
    expect(row).toMatchObject({ status: "failed", error: INTERRUPTED_TWICE, result: null });
    expect(await services().store.exists(previewKey)).toBe(false);
  });

  it("a readout written before the kill, whose job row was not, makes its re-queued job succeed without reading again", async () => {
    const { readout } = await readoutLeftRunning(0);
    const m = await database();
    await m.Readout.update(
      { status: "succeeded", wavelengthUm: 8.01, periodFound: true },
      { where: { id: readout.id } },
    );
    await restartServer();
    expect(await waitForJob(readout.jobId!, 10_000)).toMatchObject({
      status: "succeeded",
      restarts: 1,
      result: { readoutId: readout.id, wavelengthUm: 8.01, periodFound: true },
    });
    expect((await m.Readout.findByPk(readout.id))!.status).toBe("succeeded");
  });

  it(
    "a job of a process killed with SIGKILL mid-job is recovered and completes here",
    { timeout: 90_000 },
    async () => {
      await stopJobs(); // this process must not run the other process's job while it is alive
      const m = await database();
      let child: ChildProcess | undefined;
      try {
        child = spawn(
          process.execPath,
          [
            "--conditions=react-server", // lib/server imports server-only (see SERVER_NODE_FLAGS)
            "--import",
            "tsx",
            "tests/support/job-child.ts",
            "--db",
            stack.services.config.databaseUrl || stack.services.config.databasePath,
            "--lab",
            w.labId,
            "--ms",
            "6000",
          ],
          { cwd: process.cwd(), stdio: ["ignore", "pipe", "pipe"], env: stackChildEnv(stack) },
        );
        let stderr = "";
        child.stderr!.on("data", (b: Buffer) => (stderr += b.toString()));
        const jobId = await new Promise<string>((resolve, reject) => {
          let out = "";
          child!.stdout!.on("data", (b: Buffer) => {
            out += b.toString();
            if (out.includes("\n")) resolve(out.trim().split("\n")[0]);
          });
          child!.on("exit", (code) => reject(new Error(`the job process exited (${code}) before queuing: ${stderr}`)));
        });
        // Poll for the job itself: running with progress, in the other process.
        const until = Date.now() + 30_000;
        for (;;) {
          const j = await m.Job.findByPk(jobId);
          if (j?.status === "running" && j.progress > 0) break;
          if (Date.now() > until) throw new Error(`the job never ran in the other process (${j?.status}): ${stderr}`);
          await new Promise((r) => setTimeout(r, 25));
        }
        const exited = new Promise((r) => child!.once("exit", r));
        child.kill("SIGKILL");
        await exited;
        expect((await m.Job.findByPk(jobId))!.status).toBe("running"); // what the killed process left
        forgetRunnerStateForTest();
        await runStartupTasks();
        expect(await waitForJob(jobId, 30_000)).toMatchObject({
          status: "succeeded",
          restarts: 1,
          result: { echo: "from the killed process" },
        });
      } finally {
        if (child && child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
      }
    },
  );
});

describe("temporary folders of killed jobs", () => {
  it("folders older than a day are removed at start-up, younger ones and other names kept", async () => {
    const root = mkdtempSync(path.join(tmpdir(), "morphokin-stale-test-"));
    try {
      const now = Date.now();
      const old = path.join(root, "morphokin-run-old"),
        young = path.join(root, "morphokin-readout-young"),
        other = path.join(root, "something-else-old");
      for (const d of [old, young, other]) mkdirSync(d);
      writeFileSync(path.join(old, "RUN.json"), "{}");
      const aged = (now - STALE_AFTER_MS - 60_000) / 1000;
      utimesSync(old, aged, aged);
      utimesSync(other, aged, aged);
      expect(await removeStaleJobFolders(now, root)).toBe(1);
      expect([existsSync(old), existsSync(young), existsSync(other)]).toEqual([false, true, true]);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  });
});
