import { describe, expect, it } from "vitest";
import { startWorker } from "@/lib/parallel/start-worker";

/** Resolves with the worker's first message, or rejects on its error or after the deadline. */
function firstEvent(worker: ReturnType<typeof startWorker>, deadlineMs: number): Promise<unknown> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error("no message before the deadline")), deadlineMs);
    worker.once("message", (m) => (clearTimeout(timer), resolve(m)));
    worker.once("error", (e) => (clearTimeout(timer), reject(e)));
  });
}

describe("startWorker (the one way a worker thread starts)", () => {
  it("starts the Turing-map worker from TypeScript, which reports ready", async () => {
    const worker = startWorker("map-worker");
    try {
      // map-worker.ts posts { ready: true } once loaded (common practice, no source).
      await expect(firstEvent(worker, 15_000)).resolves.toEqual({ ready: true });
    } finally {
      await worker.terminate();
    }
  });

  it("raises the shared failure word when the entry cannot start (a parent in Atomics.wait sees no error event)", async () => {
    const words = new Int32Array(new SharedArrayBuffer(8));
    const worker = startWorker("no-such-entry", { failure: { words, index: 1 } });
    worker.on("error", () => {}); // expected: the entry does not exist
    try {
      // Poll the word itself until a deadline (the worker sets it without a notify).
      const deadline = Date.now() + 15_000;
      while (Atomics.load(words, 1) === 0 && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 20));
      }
      expect(Atomics.load(words, 1)).toBe(1);
      expect(words[0]).toBe(0);
    } finally {
      await worker.terminate();
    }
  });
});
