/** Heavy job children (readout, fit, simulate) run at a lower CPU priority than the web server. */
import { spawn } from "node:child_process";
import { getPriority } from "node:os";
import { expect, test } from "vitest";
import { CHILD_NICENESS, lowerChildPriority } from "@/lib/workers/start-child";

test("a child started for a job runs at niceness 10, below the server", async () => {
  const child = spawn(process.execPath, ["-e", "setTimeout(() => {}, 30000)"], { stdio: "ignore" });
  try {
    lowerChildPriority(child);
    // 10: nice(1)'s default adjustment (from memory); never above the server's own niceness.
    expect(CHILD_NICENESS).toBe(10);
    expect(getPriority(child.pid)).toBe(Math.max(10, getPriority()));
  } finally {
    child.kill("SIGKILL");
  }
});
