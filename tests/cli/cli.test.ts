/**
 * The command line as scripts use it: `npm run -s cli -- <command> … --json` prints exactly one
 * JSON object on stdout; errors go to stderr with a non-zero exit code.
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
  run(process.execPath, ["--import", "tsx", path.join(ROOT, "lib/cli/main.ts"), ...args], {
    cwd: ROOT,
    timeout: 60_000,
  });

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "morphokin-cli-"));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("cli", () => {
  it("--help lists the commands", async () => {
    const { stdout } = await cli(["--help"]);
    expect(stdout).toMatch(/readout\s+Dominant wavelength/);
  });

  it("readout --json prints one JSON object with the wavelength in µm", async () => {
    // 16 px stripes at 0.5 µm/px: λ = 8 µm by construction (geometry of the generated pattern).
    const file = path.join(dir, "stripes.png");
    writeFileSync(
      file,
      await encodePng(makeStripes({ width: 256, height: 256, wavelengthPx: 16, angleDeg: 30, seed: 3 })),
    );
    const { stdout, stderr } = await cli(["readout", file, "--pixel-size", "0.5", "--json"]);
    const lines = stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const out = JSON.parse(lines[0]);
    expect(out.periodFound).toBe(true);
    expect(Math.abs(out.wavelengthUm - 8) / 8).toBeLessThan(0.01);
    expect(stderr).not.toMatch(/error/);
  });

  it("an error goes to stderr as JSON with a non-zero exit code", async () => {
    const err = await cli(["readout", path.join(dir, "missing.png"), "--json"]).catch(
      (e) => e as { code: number; stdout: string; stderr: string },
    );
    expect((err as { code: number }).code).not.toBe(0);
    expect((err as { stdout: string }).stdout).toBe("");
    const parsed = JSON.parse((err as { stderr: string }).stderr.trim().split("\n").pop()!);
    expect(parsed.error.message).toMatch(/missing\.png/);
  });

  it("an unknown command is an error naming it", async () => {
    const err = (await cli(["frobnicate"]).catch((e) => e)) as { code: number; stderr: string };
    expect(err.code).toBe(2);
    expect(err.stderr).toContain('unknown command "frobnicate"');
  });
});
