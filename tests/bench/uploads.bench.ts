/**
 * 200 uploads of a small PNG at once, the target: every request answered within 60 s
 * (201, or 503 with Retry-After), the server healthy afterwards, and upload rows = originals in
 * the bucket = 201 answers, every upload with its readout, no temporary folder left.
 *
 * Two modes, both on 127.0.0.1 only:
 * - in-process (default): the route handler called directly against a test stack;
 * - `BENCH_UPLOADS_URL_MODE=server`: a real `next start` (needs `npx next build` first) on a free
 *   port, with its own data dir and the fakes started here; requests go over HTTP.
 * BENCH_UPLOADS_N changes the count (default 200).
 */
import { existsSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import type { BenchRow } from "./run";
import { encodePng } from "../../lib/imaging";
import { makeStripes } from "../../lib/synthetic";
import { createSpecimen } from "../../lib/server/studies/specimens";
import { createStudy } from "../../lib/server/studies/studies";
import { stopJobs } from "../../lib/server/jobs/worker";
import { database } from "../../lib/server/services";
import { call, discoverRoutes, multipart } from "../support/api";
import { startTestStack, type TestStack } from "../support/stack";
import { startServer } from "./next-server";
import { makeWorld } from "../support/world";

const N = Number(process.env.BENCH_UPLOADS_N ?? 200);
/** The bound: every request answered within 60 s. */
const ANSWER_WITHIN_MS = 60_000;

interface Answer {
  status: number;
  ms: number;
  retryAfter: string | null;
}

async function listOriginals(stack: TestStack, labId: string): Promise<Set<string>> {
  const s3 = stack.services.config.s3;
  const client = new S3Client({
    region: s3.region,
    endpoint: s3.endpoint,
    forcePathStyle: true,
    credentials: { accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey },
  });
  const keys = new Set<string>();
  let token: string | undefined;
  do {
    const out = await client.send(
      new ListObjectsV2Command({ Bucket: s3.bucket, Prefix: `labs/${labId}/uploads/`, ContinuationToken: token }),
    );
    for (const o of out.Contents ?? []) if (o.Key?.endsWith("/original")) keys.add(o.Key);
    token = out.NextContinuationToken;
  } while (token);
  client.destroy();
  return keys;
}

/** Temporary upload folders: ours under the data dir, and the system temp folder (where they were once kept). */
const tempFolders = (dataDir: string) => {
  const ours = path.join(dataDir, "tmp", "uploads");
  return [
    ...(existsSync(ours) ? readdirSync(ours) : []),
    ...readdirSync(tmpdir()).filter((n) => n.startsWith("morphokin-upload-")),
  ];
};

export default async function bench(): Promise<BenchRow[]> {
  const serverMode = process.env.BENCH_UPLOADS_URL_MODE === "server";
  const stack = await startTestStack();
  try {
    const w = await makeWorld();
    await stopJobs(); // readouts stay queued in this process: the bench measures the upload path
    const ctx = { actor: w.people.scientist.actor, labId: w.labId, labName: "Test Lab", role: "scientist" as const };
    const study = await createStudy(ctx, { name: "Bench study", tissue: "skin", organism: "chick", description: null });
    const specimenId = (
      await createSpecimen(ctx, study.id, {
        label: "B-1",
        condition: "control",
        stage: null,
        genotype: null,
        notes: null,
      })
    ).id;
    const png = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0 }));
    const server = serverMode ? await startServer(stack) : null;
    const routes = serverMode ? null : await discoverRoutes();
    const routePath = "/api/v1/labs/[labId]/specimens/[specimenId]/uploads";

    const send = async (i: number): Promise<Answer> => {
      const t0 = performance.now();
      const body = multipart({ name: `tile-${i}.png`, bytes: png }, { pixelSizeUm: "0.5" });
      try {
        const res = server
          ? await fetch(`${server.url}/api/v1/labs/${w.labId}/specimens/${specimenId}/uploads`, {
              method: "POST",
              headers: { authorization: `Bearer ${w.people.scientist.token}` },
              body,
              signal: AbortSignal.timeout(ANSWER_WITHIN_MS),
            })
          : await Promise.race([
              call(routes!.get(`POST ${routePath}`)!, "POST", routePath, {
                token: w.people.scientist.token,
                params: { labId: w.labId, specimenId },
                body,
              }),
              new Promise<never>((_, reject) =>
                setTimeout(() => reject(new Error("no answer")), ANSWER_WITHIN_MS).unref(),
              ),
            ]);
        await res.arrayBuffer();
        return { status: res.status, ms: performance.now() - t0, retryAfter: res.headers.get("retry-after") };
      } catch {
        return { status: 0, ms: performance.now() - t0, retryAfter: null }; // no answer (timeout, reset)
      }
    };
    const probeHealth = async () => {
      const t = performance.now();
      const ok = server
        ? await fetch(`${server.url}/api/health`, { signal: AbortSignal.timeout(10_000) }).then(
            (r) => r.ok,
            () => false,
          )
        : await (await import("../../app/api/health/route")).GET().then(
            (r) => r.ok,
            () => false,
          );
      return { ok, ms: performance.now() - t };
    };
    const tempBefore = new Set(tempFolders(stack.services.config.dataDir));
    const t0 = performance.now();
    // The health check every 500 ms during the burst: does the server still answer anything?
    const healthDuring: { ok: boolean; ms: number }[] = [];
    let bursting = true;
    const prober = (async () => {
      while (bursting) {
        healthDuring.push(await probeHealth());
        await new Promise((r) => setTimeout(r, 500));
      }
    })();
    const answers = await Promise.all(Array.from({ length: N }, (_, i) => send(i)));
    const wallS = (performance.now() - t0) / 1000;
    bursting = false;
    await prober;

    const healthOk = (await probeHealth()).ok;
    server?.stop();
    const m = await database();
    const rows = await m.Upload.unscoped().findAll({ where: { labId: w.labId } });
    const originals = await listOriginals(stack, w.labId);
    const readoutUploads = new Set(
      (await m.Readout.findAll({ where: { labId: w.labId }, attributes: ["uploadId"] })).map((r) => r.uploadId),
    );
    const count = (s: number) => answers.filter((a) => a.status === s).length;
    const ms = answers.map((a) => a.ms).sort((a, b) => a - b);
    const q = (p: number, of = ms) => of[Math.min(of.length - 1, Math.floor(of.length * p))];
    const createdMs = answers
      .filter((a) => a.status === 201)
      .map((a) => a.ms)
      .sort((a, b) => a - b);
    const created = count(201);
    const mode = serverMode ? "next start" : "in-process";
    const name = (what: string) => `uploads ×${N} (${mode}): ${what}`;
    return [
      { name: name("answered 201"), value: created, unit: "requests" },
      {
        name: name("answered 503 with Retry-After"),
        value: answers.filter((a) => a.status === 503 && Number(a.retryAfter) > 0).length,
        unit: "requests",
      },
      { name: name("other answers (500, no answer…)"), value: N - created - count(503), unit: "requests", target: "0" },
      { name: name("p50 answer time"), value: q(0.5), unit: "ms" },
      { name: name("p95 answer time"), value: q(0.95), unit: "ms" },
      { name: name("p50 of the 201 answers"), value: q(0.5, createdMs) ?? NaN, unit: "ms" },
      { name: name("p95 of the 201 answers"), value: q(0.95, createdMs) ?? NaN, unit: "ms" },
      { name: name("slowest answer"), value: ms.at(-1)!, unit: "ms", target: `< ${ANSWER_WITHIN_MS}` },
      { name: name("wall time"), value: wallS, unit: "s" },
      {
        name: name("health checks during the burst that failed"),
        value: healthDuring.filter((h) => !h.ok).length,
        unit: `of ${healthDuring.length}`,
        target: "0",
      },
      {
        name: name("slowest health check during the burst"),
        value: Math.max(...healthDuring.map((h) => h.ms)),
        unit: "ms",
      },
      { name: name("health ok afterwards (1 = yes)"), value: healthOk ? 1 : 0, unit: "", target: "1" },
      { name: name("upload rows − 201 answers"), value: rows.length - created, unit: "rows", target: "0" },
      {
        name: name("originals in bucket − 201 answers"),
        value: originals.size - created,
        unit: "objects",
        target: "0",
      },
      {
        name: name("uploads without a readout row"),
        value: rows.filter((r) => !readoutUploads.has(r.id)).length,
        unit: "rows",
        target: "0",
      },
      {
        name: name("temporary upload folders left"),
        value: tempFolders(stack.services.config.dataDir).filter((f) => !tempBefore.has(f)).length,
        unit: "folders",
        target: "0",
      },
    ];
  } finally {
    await stack.close();
  }
}
