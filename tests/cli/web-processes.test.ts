/**
 * `npm start` serves with one web process per core (at most 4) sharing the port; only the first
 * runs jobs, and a job queued or cancelled in another reaches it through the cluster's primary.
 * (Design choices of lib/cli/web-processes.ts; no outside source.) The browser tests run the whole
 * app this way on the CI machine's 2 cores.
 */
import { afterEach, describe, expect, it, vi } from "vitest";
import { COPY_NODE_FLAGS, copyEnv, splitArgs, webProcessCount } from "@/lib/cli/web-processes";
import { parseConfig } from "@/lib/server/config";

describe("how many web processes", () => {
  it("is one per core, at most 4, unless WEB_PROCESSES says", () => {
    expect(webProcessCount(null, 1)).toBe(1);
    expect(webProcessCount(null, 2)).toBe(2);
    expect(webProcessCount(null, 16)).toBe(4);
    expect(webProcessCount(6, 2)).toBe(6);
  });

  it("reads WEB_PROCESSES and refuses what is not a whole number ≥ 1, naming the variable", () => {
    expect(parseConfig({ WEB_PROCESSES: "3" }).webProcesses).toBe(3);
    expect(parseConfig({}).webProcesses).toBeNull();
    expect(() => parseConfig({ WEB_PROCESSES: "0" })).toThrow(/WEB_PROCESSES must be a whole number ≥ 1/);
    expect(() => parseConfig({ WEB_PROCESSES: "two" })).toThrow(/WEB_PROCESSES must be a whole number ≥ 1/);
  });

  it("gives jobs to the first copy only, and to none when JOBS_IN_WEB=0", () => {
    expect(copyEnv(0, true)).toEqual({ MORPHOKIN_WEB_PROCESS: "0", JOBS_IN_WEB: "1" });
    expect(copyEnv(1, true)).toEqual({ MORPHOKIN_WEB_PROCESS: "1", JOBS_IN_WEB: "0" });
    expect(copyEnv(0, false)).toEqual({ MORPHOKIN_WEB_PROCESS: "0", JOBS_IN_WEB: "0" });
  });

  it("gives Node's CPU-profile flags to each copy's Node and the rest to next start", () => {
    // Each copy then writes its own profile (Node names it by process id); design choice, no outside source.
    expect(splitArgs(["-H", "127.0.0.1", "-p", "3000", "--cpu-prof", "--cpu-prof-dir=/tmp/p"])).toEqual({
      nodeFlags: ["--cpu-prof", "--cpu-prof-dir=/tmp/p"],
      nextArgs: ["-H", "127.0.0.1", "-p", "3000"],
    });
    expect(splitArgs(["-p", "3000"])).toEqual({ nodeFlags: [], nextArgs: ["-p", "3000"] });
  });

  it("starts each copy with a young generation sized for many requests in flight", () => {
    // A design choice measured in issue "Speed" (the server under load), no outside source; V8's flag, in MB.
    expect(COPY_NODE_FLAGS).toEqual(["--max-semi-space-size=64"]);
  });
});

describe("the job bus between sibling web processes", () => {
  const g = globalThis as { __morphokinJobBus?: unknown };
  const realSend = process.send;

  async function freshBus(inCluster: boolean) {
    vi.resetModules();
    delete g.__morphokinJobBus;
    if (inCluster) vi.stubEnv("MORPHOKIN_WEB_PROCESS", "1");
    else vi.stubEnv("MORPHOKIN_WEB_PROCESS", undefined as unknown as string);
    const sent: unknown[] = [];
    process.send = ((m: unknown) => {
      sent.push(m);
      return true;
    }) as typeof process.send;
    return { bus: await import("@/lib/server/jobs/local-bus"), sent };
  }

  afterEach(() => {
    process.send = realSend;
    vi.unstubAllEnvs();
    delete g.__morphokinJobBus;
  });

  it("passes a queued job and a cancellation it cannot serve itself to the siblings", async () => {
    const { bus, sent } = await freshBus(true);
    const heard: string[] = [];
    bus.listenForQueued(() => heard.push("queued"));
    bus.listenForCancel((id) => id === "mine");
    bus.announceQueued();
    expect(heard).toEqual(["queued"]);
    expect(bus.announceCancel("mine")).toBe(true);
    expect(bus.announceCancel("elsewhere")).toBe(false);
    expect(sent).toEqual([{ morphokin: "job-queued" }, { morphokin: "job-cancel", jobId: "elsewhere" }]);
  });

  it("hears a sibling's announcements as its own, and ignores other messages", async () => {
    const { bus } = await freshBus(true);
    const heard: string[] = [];
    bus.listenForQueued(() => heard.push("queued"));
    bus.listenForCancel((id) => (heard.push(`cancel ${id}`), true));
    process.emit("message", { morphokin: "job-queued" }, undefined);
    process.emit("message", { morphokin: "job-cancel", jobId: "j1" }, undefined);
    process.emit("message", { morphokin: "something else" }, undefined);
    process.emit("message", "not ours", undefined);
    expect(heard).toEqual(["queued", "cancel j1"]);
  });

  it("tells nobody outside a cluster of web processes (tests, workers, the command line)", async () => {
    const { bus, sent } = await freshBus(false);
    bus.announceQueued();
    bus.announceCancel("x");
    expect(sent).toEqual([]);
  });
});
