/** GET /api/health reports each part; 503 when one is down (product rule, no source). */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET } from "@/app/api/health/route";
import { createS3ObjectStore } from "@/storage/s3-object-store";
import { createSmtpMailer } from "@/lib/server/mail";
import { setServicesForTest } from "@/lib/server/services";
import { describeTestDialect } from "../support/test-db";
import { DEAD_PORT, startTestStack, type TestStack } from "../support/stack";

let stack: TestStack;
beforeAll(async () => {
  stack = await startTestStack();
});
afterAll(async () => stack?.close());

describe("health", () => {
  it("is ok when database, storage and mail answer", async () => {
    const res = await GET();
    expect(res.status).toBe(200);
    // The dialect is the one this run's project chose (vitest.config.mts): sqlite or postgres.
    const dialect = describeTestDialect();
    expect(await res.json()).toEqual({
      ok: true,
      database: { ok: true, dialect },
      storage: { ok: true },
      mail: { ok: true },
      // pg-boss on PostgreSQL, the in-process runner on SQLite (README "Several machines");
      // the exact count of live workers is tested in tests/api/jobs-workers.test.ts.
      jobs: { queue: dialect === "postgres" ? "pg-boss" : "in-process", liveWorkers: expect.any(Number) },
    });
  });

  it("is 503 and names the part that is down", async () => {
    const port = DEAD_PORT;
    setServicesForTest({
      ...stack.services,
      store: createS3ObjectStore({ ...stack.services.config.s3, endpoint: `http://127.0.0.1:${port}` }),
      mailer: createSmtpMailer({ url: `smtp://127.0.0.1:${port}`, from: "x@y.test" }),
    });
    try {
      const res = await GET();
      expect(res.status).toBe(503);
      const body = await res.json();
      expect(body.ok).toBe(false);
      expect(body.database).toEqual({ ok: true, dialect: describeTestDialect() });
      expect(body.storage.ok).toBe(false);
      expect(body.storage.error).toBe("object storage is unreachable (head bucket)");
      expect(body.mail.ok).toBe(false);
    } finally {
      setServicesForTest(stack.services);
    }
  });
});
