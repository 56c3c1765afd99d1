/**
 * Table readouts run in a child process like image readouts: the server's event loop stays free
 * (see the bench row "table readout job 10⁶ rows" in tests/bench/readout.bench.ts) and a table
 * being parsed can be cancelled — in-process, a synchronous parse could not be interrupted.
 */
import { describe, expect, it } from "vitest";
import { readTable } from "@/lib/server/readouts/process";
import { JobCancelledError } from "@/lib/server/jobs/types";

describe("table readouts in a child process", () => {
  it("gives the hand-computed numbers and can be cancelled while the table is read", async () => {
    // 1-D positions 0, 10, 21, 30, 41 µm: spacings 10, 11, 9, 11, mean 10.25 (by hand).
    const small = new TextEncoder().encode("position_um\n0\n10\n21\n30\n41\n");
    const settings = { kind: "table" as const, pixelSizeUm: null, pixelSizeSource: null };
    const r = await readTable(small, settings, new AbortController().signal);
    if (r.table.kind !== "positions-1d") throw new Error("expected a 1-D positions readout");
    expect(r.table.spacingUm.mean).toBeCloseTo(10.25, 12);

    // 300 000 positions: the child needs far more than the 100 ms before the abort (tsx start-up alone is ~1 s).
    const big = new TextEncoder().encode(
      "position_um\n" + Array.from({ length: 300_000 }, (_, i) => String(10 * i)).join("\n") + "\n",
    );
    const controller = new AbortController();
    const started = Date.now();
    setTimeout(() => controller.abort(), 100);
    await expect(readTable(big, settings, controller.signal)).rejects.toBeInstanceOf(JobCancelledError);
    expect(Date.now() - started).toBeLessThan(5_000); // killed, not run to the end (common practice, no source)
  });
});
