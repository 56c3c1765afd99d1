/**
 * `readout --threads 1|2`: the 2-D FFT of a large image on one or two threads gives the same
 * numbers (every row and column is one transform by the same code on either thread), and a
 * wrong value is refused naming the option.
 */
import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";

const run = promisify(execFile);
const ROOT = path.resolve(import.meta.dirname, "../..");
const cli = (args: string[]) =>
  run(process.execPath, ["--conditions=react-server", "--import", "tsx", path.join(ROOT, "lib/cli/main.ts"), ...args], {
    cwd: ROOT,
    timeout: 120_000,
  });

let dir: string;
let file: string;
beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "morphokin-cli-threads-"));
  file = path.join(dir, "stripes-1024.png");
  // 1024² is the smallest transform the second thread takes (MIN_PARALLEL_BINS).
  writeFileSync(
    file,
    await encodePng(makeStripes({ width: 1024, height: 1024, wavelengthPx: 20, angleDeg: 25, seed: 5 })),
  );
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("cli readout --threads", () => {
  it("one and two threads give the same wavelength and uncertainty, to the last digit", async () => {
    const one = JSON.parse((await cli(["readout", file, "--pixel-size", "1", "--threads", "1", "--json"])).stdout);
    const two = JSON.parse((await cli(["readout", file, "--pixel-size", "1", "--threads", "2", "--json"])).stdout);
    // 20 px stripes: λ = 20 µm at 1 µm/px by construction (geometry of the generated pattern).
    expect(Math.abs(one.wavelengthUm - 20) / 20).toBeLessThan(0.02);
    expect(two.wavelengthUm).toBe(one.wavelengthUm);
    expect(two.uncertaintyUm).toBe(one.uncertaintyUm);
    expect(two.symmetry).toBe(one.symmetry);
  });

  it("a thread count other than 1 or 2 is refused, naming the option", async () => {
    const err = (await cli(["readout", file, "--pixel-size", "1", "--threads", "3", "--json"]).catch((e) => e)) as {
      code: number;
      stderr: string;
    };
    expect(err.code).not.toBe(0);
    expect(err.stderr).toMatch(/--threads must be 1 or 2 \(got 3\)/);
  });
});
