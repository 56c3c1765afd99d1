/**
 * 50 uploads at once through the real upload route handler (in-process, the test stack's fake S3
 * on 127.0.0.1). Every request is answered — 201, or 503 with Retry-After — none with 500, each
 * within a bounded time; afterwards the health check is ok and nothing is half-written: upload
 * rows = originals in the bucket = 201 answers, every upload row has its readout row, and no
 * temporary upload folder is left. Before the write queue this run saw 500s (SQLITE_BUSY) and
 * p95 of many seconds (figures in the commit that added this file).
 */
import { existsSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as health } from "@/app/api/health/route";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { uploadGate } from "@/lib/server/uploads/back-pressure";
import { stopJobs } from "@/lib/server/jobs/worker";
import { uploadTempRoot } from "@/lib/server/uploads/multipart";
import { database, setServicesForTest } from "@/lib/server/services";
import { call, discoverRoutes, multipart } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { makeWorld, type World } from "../support/world";

/** The in-suite size (issue 10: "e.g. 50 concurrent uploads"); the bench runs 200. */
const CONCURRENT = Number(process.env.LOAD_N ?? 50);
/** Every request answered within this (ms): well inside the 60 s target for 200. */
const ANSWER_WITHIN_MS = 30_000;

let stack: TestStack;
let w: World;
let routes: Awaited<ReturnType<typeof discoverRoutes>>;
let specimenId: string;
let png: Uint8Array;

const ctxOf = () => ({
  actor: w.people.scientist.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "scientist" as const,
});

/** Keys under `prefix` in the test bucket, listed straight from the fake S3 (not through the app). */
async function listKeys(prefix: string): Promise<string[]> {
  const s3 = stack.services.config.s3;
  const client = new S3Client({
    region: s3.region,
    endpoint: s3.endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey },
  });
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const out = await client.send(
      new ListObjectsV2Command({ Bucket: s3.bucket, Prefix: prefix, ContinuationToken: token }),
    );
    keys.push(...(out.Contents ?? []).map((o) => o.Key!));
    token = out.NextContinuationToken;
  } while (token);
  client.destroy();
  return keys;
}

/** Temporary upload folders: ours under the data dir, and the system temp folder (where they were once kept). */
const tempUploadFolders = () => [
  ...(existsSync(uploadTempRoot(stack.services.config.dataDir))
    ? readdirSync(uploadTempRoot(stack.services.config.dataDir))
    : []),
  ...readdirSync(tmpdir()).filter((n) => n.startsWith("morphokin-upload-")),
];

beforeAll(async () => {
  stack = await startTestStack();
  w = await makeWorld();
  routes = await discoverRoutes();
  const study = await createStudy(ctxOf(), {
    name: "Load study",
    tissue: "skin",
    organism: "chick",
    description: null,
  });
  specimenId = (
    await createSpecimen(ctxOf(), study.id, {
      label: "L-1",
      condition: "control",
      stage: null,
      genotype: null,
      notes: null,
    })
  ).id;
  png = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0 }));
  // Readout jobs stay queued: this test is about the upload path, not the readouts' CPU.
  await stopJobs();
});
afterAll(async () => stack?.close());

describe("uploads under load", () => {
  it(`${CONCURRENT} concurrent uploads: all answered 201 or 503+Retry-After, none 500, nothing half-written`, async () => {
    const tempBefore = new Set(tempUploadFolders());
    const handler = routes.get("POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads")!;
    const started = Date.now();
    const answers = await Promise.all(
      Array.from({ length: CONCURRENT }, async (_, i) => {
        const t0 = Date.now();
        const res = await call(handler, "POST", "/api/v1/labs/[labId]/specimens/[specimenId]/uploads", {
          token: w.people.scientist.token,
          params: { labId: w.labId, specimenId },
          body: multipart({ name: `tile-${i}.png`, bytes: png }, { pixelSizeUm: "0.5" }),
        });
        const body = (await res.json()) as { error?: { message: string } };
        return {
          status: res.status,
          ms: Date.now() - t0,
          retryAfter: res.headers.get("retry-after"),
          message: body.error?.message,
        };
      }),
    );
    const ms = answers.map((a) => a.ms).sort((a, b) => a - b);
    const statuses: Record<number, number> = {};
    for (const a of answers) statuses[a.status] = (statuses[a.status] ?? 0) + 1;
    console.log(
      `uploads-load: ${CONCURRENT} in ${Date.now() - started} ms; statuses ${JSON.stringify(statuses)}; p50 ${ms[Math.floor(ms.length * 0.5)]} ms, p95 ${ms[Math.floor(ms.length * 0.95)]} ms, max ${ms.at(-1)} ms`,
    );

    expect(answers.filter((a) => a.status !== 201 && a.status !== 503)).toEqual([]);
    for (const a of answers.filter((x) => x.status === 503)) {
      expect(Number(a.retryAfter)).toBeGreaterThan(0);
      expect(a.message).toMatch(/try again in \d+ s/);
    }
    expect(ms.at(-1)!).toBeLessThan(ANSWER_WITHIN_MS);
    const created = statuses[201] ?? 0;
    expect(created).toBeGreaterThan(0);

    expect((await health()).status).toBe(200);
    const m = await database();
    const rows = await m.Upload.unscoped().findAll({ where: { labId: w.labId } });
    const originals = (await listKeys(`labs/${w.labId}/uploads/`)).filter((k) => k.endsWith("/original"));
    expect(rows.length).toBe(created);
    expect(originals.length).toBe(created);
    expect(new Set(originals)).toEqual(new Set(rows.map((r) => r.storageKey)));
    const readouts = await m.Readout.findAll({ where: { labId: w.labId }, attributes: ["uploadId"] });
    expect(new Set(readouts.map((r) => r.uploadId))).toEqual(new Set(rows.map((r) => r.id)));
    expect(tempUploadFolders().filter((n) => !tempBefore.has(n))).toEqual([]);
  }, 120_000);

  it("a saturated server refuses an upload at once with 503 + Retry-After, without reading its body", async () => {
    // One slot, no waiting room: the slot taken here leaves none for the request.
    const config = { ...stack.services.config, uploadsInFlight: 1, uploadsWaiting: 0 };
    setServicesForTest({ ...stack.services, config });
    const leave = await uploadGate().enter({ inFlight: 1, waiting: 0, waitMs: 1000 });
    try {
      const request = new Request(`http://127.0.0.1:3999/api/v1/labs/${w.labId}/specimens/${specimenId}/uploads`, {
        method: "POST",
        headers: { authorization: `Bearer ${w.people.scientist.token}` },
        body: multipart({ name: "tile.png", bytes: png }, { pixelSizeUm: "0.5" }),
      });
      const t0 = Date.now();
      const res = await routes.get("POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads")!(request, {
        params: Promise.resolve({ labId: w.labId, specimenId }),
      });
      expect(Date.now() - t0).toBeLessThan(1000); // at once, not after a wait (common practice, no source)
      expect(res.status).toBe(503);
      expect(Number(res.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
      expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(
        /^the server is busy \(it is receiving as many uploads as it can\); try again in \d+ s$/,
      );
      expect(request.bodyUsed).toBe(false);
    } finally {
      leave();
      setServicesForTest(stack.services);
    }
  });
});

describe("upload input", () => {
  it("two files in one upload are a 400 naming the count, not a 413", async () => {
    const form = multipart({ name: "a.png", bytes: png }, { pixelSizeUm: "0.5" });
    form.append("file", new Blob([png as Uint8Array<ArrayBuffer>], { type: "image/png" }), "b.png");
    const before = (await database()).Upload.unscoped().count();
    const res = await call(
      routes.get("POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads")!,
      "POST",
      "/api/v1/labs/[labId]/specimens/[specimenId]/uploads",
      {
        token: w.people.scientist.token,
        params: { labId: w.labId, specimenId },
        body: form,
      },
    );
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
      "send one file per upload; this request had 2 files",
    );
    expect(await (await database()).Upload.unscoped().count()).toBe(await before);
    expect(readdirSync(uploadTempRoot(stack.services.config.dataDir))).toEqual([]);
  });
});
