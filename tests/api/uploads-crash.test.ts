/**
 * A server killed (SIGKILL) in the middle of an upload leaves nothing half-written once the sweep
 * has run: upload rows and originals in the bucket match one to one, no row is left "receiving",
 * and no temporary upload folder remains. Each upload runs in a child process
 * (tests/support/upload-child.ts) through the real route handler, against this test's database
 * and fake S3; the test polls for the state it wants to interrupt, then kills the child.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { stopJobs } from "@/lib/server/jobs/worker";
import { uploadTempRoot } from "@/lib/server/uploads/multipart";
import { database } from "@/lib/server/services";
import { sweepUploads } from "@/lib/server/uploads/recovery";
import { call, discoverRoutes, multipart } from "../support/api";
import { stackChildEnv, startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

/** Size of the slowly stored table (bytes): large enough that its put takes seconds when throttled (common practice, no source). */
const PUT_BYTES = 1024 * 1024;
const ROOT = path.resolve(import.meta.dirname, "../..");

let stack: TestStack;
let w: World;
let specimenId: string;
const children: ChildProcess[] = [];

const ctxOf = () => ({
  actor: w.people.scientist.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "scientist" as const,
});
const tempRoot = () => uploadTempRoot(stack.services.config.dataDir);

function startChild(mode: "slow-body" | "slow-put") {
  const child = spawn(
    process.execPath,
    [
      "--conditions=react-server", // lib/server imports server-only (see SERVER_NODE_FLAGS)
      "--import",
      "tsx",
      path.join(ROOT, "tests/support/upload-child.ts"),
      mode,
      w.labId,
      specimenId,
      w.people.scientist.token,
      String(PUT_BYTES),
    ],
    {
      cwd: ROOT,
      stdio: ["ignore", "pipe", "pipe"],
      env: {
        ...stackChildEnv(stack),
        MAX_UPLOAD_BYTES: String(4 * PUT_BYTES),
        JOB_CONCURRENCY: "1",
      },
    },
  );
  children.push(child);
  const out = { text: "", err: "" };
  child.stdout!.on("data", (d: Buffer) => (out.text += d.toString()));
  child.stderr!.on("data", (d: Buffer) => (out.err += d.toString()));
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  return { child, out, exited };
}

/** Polls `probe` until it returns true; fails with `what` after `ms`. */
async function until(what: string, probe: () => Promise<boolean> | boolean, ms = 30_000) {
  const deadline = Date.now() + ms;
  while (!(await probe())) {
    if (Date.now() > deadline) throw new Error(`${what}: not seen within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 20));
  }
}

async function originalsInBucket(): Promise<Set<string>> {
  return new Set(
    (await stack.services.store.list(`labs/${w.labId}/uploads/`))
      .map((o) => o.key)
      .filter((k) => k.endsWith("/original")),
  );
}

async function uploadRows() {
  const m = await database();
  return m.Upload.unscoped().findAll({ where: { labId: w.labId } });
}

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  await stopJobs(); // readouts stay queued; this test is about the upload's own writes
  const study = await createStudy(ctxOf(), {
    name: "Crash study",
    tissue: "skin",
    organism: "chick",
    description: null,
  });
  specimenId = (
    await createSpecimen(ctxOf(), study.id, {
      label: "K-1",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
    })
  ).id;
  // One finished upload, so "rows = objects" compares something.
  const routes = await discoverRoutes();
  const png = await encodePng(makeStripes({ width: 32, height: 32, wavelengthPx: 8, angleDeg: 0 }));
  const res = await call(
    routes.get("POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads")!,
    "POST",
    "/api/v1/labs/[labId]/specimens/[specimenId]/uploads",
    {
      token: w.people.scientist.token,
      params: { labId: w.labId, specimenId },
      body: multipart({ name: "kept.png", bytes: png }, { pixelSizeUm: "1" }),
    },
  );
  expect(res.status).toBe(201);
}, 60_000);
afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill("SIGKILL");
  await stack?.close();
});

describe("an upload cut short by kill -9", () => {
  it("killed while the body is written to a temporary file: the sweep removes the folder", async () => {
    const { child, exited } = startChild("slow-body");
    await until("a temporary upload file with bytes in it", () => {
      if (!existsSync(tempRoot())) return false;
      return readdirSync(tempRoot()).some((d) =>
        readdirSync(path.join(tempRoot(), d)).some((f) => statSync(path.join(tempRoot(), d, f)).size > 0),
      );
    });
    child.kill("SIGKILL");
    await exited; // reaped: its pid no longer runs
    expect(readdirSync(tempRoot()).length).toBe(1);
    const report = await sweepUploads({ graceMs: 0 });
    expect(report.tempFoldersRemoved).toBe(1);
    expect(readdirSync(tempRoot())).toEqual([]);
  }, 60_000);

  it("killed while the original is half-stored: the sweep removes the row and the object", async () => {
    const { child, out, exited } = startChild("slow-put");
    await until("half of the original sent to object storage", () => {
      const sent = [...out.text.matchAll(/put-bytes (\d+)/g)].map((x) => Number(x[1]));
      return sent.length > 0 && Math.max(...sent) >= PUT_BYTES / 2;
    });
    const rows = await uploadRows();
    expect(rows.filter((r) => r.state === "receiving").length).toBe(1); // the state we meant to interrupt
    child.kill("SIGKILL");
    await exited;
    expect(out.text).not.toMatch(/answered/);

    const report = await sweepUploads({ graceMs: 0 });
    expect(report.rowsRemoved).toBe(1);
    expect(report.tempFoldersRemoved).toBe(1);
    const after = await uploadRows();
    expect(after.every((r) => r.state === "stored")).toBe(true);
    expect(after.length).toBe(1); // the finished upload from beforeAll
    expect(await originalsInBucket()).toEqual(new Set(after.map((r) => r.storageKey)));
    expect(readdirSync(tempRoot())).toEqual([]);
  }, 60_000);

  it("an object under an upload's prefix with no row is removed, one with a row is kept", async () => {
    const stray = `labs/${w.labId}/uploads/00000000-0000-4000-8000-000000000000/original`;
    await stack.services.store.put(stray, Buffer.from("left behind"), { contentType: "text/plain" });
    const before = await uploadRows();
    expect((await sweepUploads({ graceMs: 0 })).objectsRemoved).toBe(1);
    expect(await originalsInBucket()).toEqual(new Set(before.map((r) => r.storageKey)));
  });
});

describe("an upload cut short in the server", () => {
  const handler = async () => (await discoverRoutes()).get("POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads")!;

  it("a client that goes away mid-body leaves no row, object or temporary folder", async () => {
    const before = await uploadRows();
    const originals = await originalsInBucket();
    const boundary = "----cut";
    let pulls = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulls++;
        if (pulls === 1)
          controller.enqueue(
            new TextEncoder().encode(
              `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="t.csv"\r\nContent-Type: text/csv\r\n\r\nx,y\n1,2\n`,
            ),
          );
        else controller.error(new Error("the client went away")); // as Node reports an aborted request
      },
    });
    const request = new Request(`http://127.0.0.1:3999/api/v1/labs/${w.labId}/specimens/${specimenId}/uploads`, {
      method: "POST",
      headers: {
        authorization: `Bearer ${w.people.scientist.token}`,
        "content-type": `multipart/form-data; boundary=${boundary}`,
      },
      body,
      duplex: "half",
    } as RequestInit);
    const res = await (await handler())(request, { params: Promise.resolve({ labId: w.labId, specimenId }) });
    expect(res.status).toBe(400);
    expect((await uploadRows()).length).toBe(before.length);
    expect(await originalsInBucket()).toEqual(originals);
    expect(readdirSync(tempRoot())).toEqual([]);
  });

  it("an upload whose row vanished while its original was stored removes the object again", async () => {
    const before = await uploadRows();
    const originals = await originalsInBucket();
    const store = stack.services.store;
    const m = await database();
    // The row is removed while the put runs, as a sweep with a too-short grace period would.
    const put = store.put.bind(store);
    store.put = async (key, body, options) => {
      await m.Upload.unscoped().destroy({ where: { storageKey: key } });
      return put(key, body, options);
    };
    try {
      const png = await encodePng(makeStripes({ width: 32, height: 32, wavelengthPx: 8, angleDeg: 0 }));
      const res = await (
        await handler()
      )(
        new Request(`http://127.0.0.1:3999/api/v1/labs/${w.labId}/specimens/${specimenId}/uploads`, {
          method: "POST",
          headers: { authorization: `Bearer ${w.people.scientist.token}` },
          body: multipart({ name: "gone.png", bytes: png }, { pixelSizeUm: "1" }),
        }),
        { params: Promise.resolve({ labId: w.labId, specimenId }) },
      );
      expect(res.status).toBe(503);
      expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
        "storing the file took longer than the server waits for an upload, so it was discarded; try again",
      );
    } finally {
      store.put = put;
    }
    expect((await uploadRows()).length).toBe(before.length);
    expect(await originalsInBucket()).toEqual(originals);
    expect(readdirSync(tempRoot())).toEqual([]);
  });
});
