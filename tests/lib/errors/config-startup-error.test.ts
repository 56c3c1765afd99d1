/**
 * The configuration is read once and checked: a bad value stops start-up with a message naming
 * the variable, the rule and the value given; unset or empty values take today's defaults.
 * Defaults are the product's own (README "Configuration", .env.example; common practice, no source).
 */
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ConfigError, parseConfig, readConfig } from "@/lib/server/config";

describe("configuration", () => {
  it("names the variable, the rule and the value of a bad whole number", () => {
    expect(() => parseConfig({ JOB_CONCURRENCY: "x" })).toThrow(ConfigError);
    expect(() => parseConfig({ JOB_CONCURRENCY: "x" })).toThrow('JOB_CONCURRENCY must be a whole number ≥ 1, got "x"');
    expect(() => parseConfig({ JOB_CONCURRENCY: "0" })).toThrow('JOB_CONCURRENCY must be a whole number ≥ 1, got "0"');
    expect(() => parseConfig({ UPLOADS_IN_FLIGHT: "2.5" })).toThrow(
      'UPLOADS_IN_FLIGHT must be a whole number ≥ 1, got "2.5"',
    );
  });

  it("lists every bad variable in one message", () => {
    expect(() =>
      parseConfig({ TRUST_PROXY: "-1", UPLOAD_WAIT_MS: "soon", SIMULATION_THREADS: "4", NEXTAUTH_URL: "localhost" }),
    ).toThrow(
      'invalid configuration: NEXTAUTH_URL must be an absolute URL such as http://127.0.0.1:3000, got "localhost"; ' +
        'TRUST_PROXY must be a whole number ≥ 0, got "-1"; UPLOAD_WAIT_MS must be a number ≥ 0, got "soon"; ' +
        'SIMULATION_THREADS must be 1 or 2, got "4"',
    );
  });

  it("keeps today's defaults when nothing is set", () => {
    const c = parseConfig({});
    expect(c.dataDir).toBe(path.resolve("storage/data"));
    expect(c.databasePath).toBe(path.join(path.resolve("storage/data"), "morphokin.sqlite"));
    expect(c.appUrl).toBe("http://127.0.0.1:3000");
    expect(c.s3).toMatchObject({ endpoint: "http://127.0.0.1:4569", bucket: "morphokin-dev", forcePathStyle: true });
    expect(c.devMailboxUrl).toBe("http://127.0.0.1:2526");
    expect(c.rateLimits.signIn).toEqual({ perAccount: 30, perAddress: 100 });
    expect(c.uploadsInFlight).toBe(8);
    expect(c.simulationThreads).toBe(2);
    expect(c.jobConcurrency).toBe(1);
    expect(c.jobMailAfterS).toBe(10);
    expect(c.readoutInProcess).toBe(false);
    expect(parseConfig({ NODE_ENV: "production" }).devMailboxUrl).toBe("");
    expect(parseConfig({ JOB_CONCURRENCY: "" }).jobConcurrency).toBe(1);
  });

  it("reads typed values", () => {
    const c = parseConfig({
      JOB_CONCURRENCY: "3",
      JOB_MAIL_AFTER_S: "0",
      FIT_IN_PROCESS: "1",
      S3_FORCE_PATH_STYLE: "false",
    });
    expect([c.jobConcurrency, c.jobMailAfterS, c.fitInProcess, c.s3.forcePathStyle]).toEqual([3, 0, true, false]);
  });

  it("reads the environment once per process", () => {
    expect(readConfig()).toBe(readConfig());
  });
});
