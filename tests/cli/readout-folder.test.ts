/**
 * `readout FOLDER`: one CSV row per file; a bad file gets its row with status failed and the
 * reason, the others are read, and the exit code says that some failed.
 */
import { execFile } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { makeHexSpots, makeStripes } from "@/lib/synthetic";

const run = promisify(execFile);
const ROOT = path.resolve(import.meta.dirname, "../..");
const cli = (args: string[]) =>
  run(process.execPath, ["--import", "tsx", path.join(ROOT, "lib/cli/main.ts"), ...args], {
    cwd: ROOT,
    timeout: 120_000,
  }).then(
    (r) => ({ code: 0, ...r }),
    (e: { code: number; stdout: string; stderr: string }) => ({ code: e.code, stdout: e.stdout, stderr: e.stderr }),
  );

let dir: string;
let folder: string;
beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), "morphokin-cli-folder-"));
  folder = path.join(dir, "frames");
  mkdirSync(folder);
  mkdirSync(path.join(folder, "sub")); // subfolders are not read
  // Stripes of period 16 px and hexagonal spots of spacing 24 px at 0.5 µm/px: λ = 8 µm and
  // (√3/2)·24·0.5 = 10.39 µm by construction (SCIENCE.md §5: Fourier wavelength of a hexagonal lattice).
  writeFileSync(
    path.join(folder, "a-stripes.png"),
    await encodePng(makeStripes({ width: 192, height: 192, wavelengthPx: 16, angleDeg: 30, noise: 0.1, seed: 11 })),
  );
  writeFileSync(
    path.join(folder, "b-spots.png"),
    await encodePng(
      makeHexSpots({ width: 256, height: 256, spacingPx: 24, angleDeg: 8, spotRadiusPx: 6, noise: 0.05, seed: 3 }),
    ),
  );
  writeFileSync(path.join(folder, "c-broken.png"), Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2]));
  writeFileSync(path.join(folder, "d-spacings.csv"), "spacing_um\n10\n12\n11\n");
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("cli readout FOLDER", () => {
  it("writes one CSV row per file; the broken file fails alone with its reason; exit code 4", async () => {
    const out = path.join(dir, "out.csv");
    const r = await cli(["readout", folder, "--pixel-size", "0.5", "--spacing", "spacing_um", "--csv", out]);
    expect(r.code).toBe(4);
    expect(r.stdout).toContain("4 file(s) read: 3 read, 1 failed");
    const lines = readFileSync(out, "utf8").trim().split("\n");
    expect(lines[0]).toBe("file,wavelength_um,uncertainty_um,symmetry,significance,status,message");
    const rows = lines.slice(1).map((l) => l.split(","));
    expect(rows.map((c) => c[0])).toEqual(["a-stripes.png", "b-spots.png", "c-broken.png", "d-spacings.csv"]);
    expect(Number(rows[0][1])).toBeWithinRelative(8, 0.01);
    expect(rows[0][3]).toBe("stripes");
    expect(rows[0][5]).toBe("read");
    expect(Number(rows[1][1])).toBeWithinRelative((Math.sqrt(3) / 2) * 24 * 0.5, 0.02);
    expect(rows[1][3]).toBe("hexagonal");
    expect(rows[2][5]).toBe("failed");
    expect(rows[2][6].length).toBeGreaterThan(10);
    // Mean of the listed spacings 10, 12, 11 µm (arithmetic).
    expect(Number(rows[3][1])).toBeCloseTo(11, 10);
  }, 180_000);

  it("--json prints one object with the rows; without failures the exit code is 0", async () => {
    const good = path.join(dir, "good");
    mkdirSync(good);
    writeFileSync(
      path.join(good, "s.png"),
      await encodePng(makeStripes({ width: 128, height: 128, wavelengthPx: 16, angleDeg: 0, seed: 2 })),
    );
    const r = await cli(["readout", good, "--pixel-size", "0.5", "--json"]);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const j = JSON.parse(lines[0]);
    expect(j).toMatchObject({ files: 1, failed: 0 });
    expect(j.rows[0].wavelengthUm).toBeWithinRelative(8, 0.01);
  }, 120_000);
});
