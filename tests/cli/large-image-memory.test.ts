/**
 * A slide-scan-sized file is read without holding its bytes (issue 13: "read without decoding the
 * whole image into memory at full resolution, with peak memory of a readout ≤ 1 GiB"). The test
 * writes, into a temporary folder, an uncompressed 16-bit TIFF of 20 000 × 20 000 px — 800 MB,
 * more than the limits below — and runs the readout child process (lib/workers/readout-child.ts, as
 * a readout job starts it) on its path, measuring the child's peak resident memory.
 *
 * Why this size: a readout whose bytes were held would need the 763 MiB of the file on top of
 * everything else, so (1) a readout of a 2048² ROI (the whole file is still read once, reduced, for
 * the preview) must stay under 600 MiB, below the file's own size (a 4096² ROI's readout alone
 * peaks at ~720 MiB, too close to tell), and (2) the whole image, read
 * reduced 5×, must stay within the 1 GiB. 20 000² keeps both under a minute on 2 cores;
 * 30 000² (1.8 GB) was measured by hand (see lib/readout/README.md, "Large images").
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, statSync, writeFileSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { writePlainTiff16 } from "../support/write-plain-tiff16";

const ROOT = path.resolve(__dirname, "../..");
const dir = mkdtempSync(path.join(tmpdir(), "morphokin-large-memory-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const SIDE = 20_000,
  LAMBDA_PX = 60,
  PIXEL_UM = 0.5;
const file = path.join(dir, "scan.tif");

beforeAll(() => {
  // Vertical stripes, λ = 60 px exactly by construction, on a 16-bit grey level of 30 000 ± 20 000.
  const row = new Uint16Array(SIDE);
  for (let x = 0; x < SIDE; x++) row[x] = Math.round(30_000 + 20_000 * Math.cos((2 * Math.PI * x) / LAMBDA_PX));
  writePlainTiff16(file, SIDE, SIDE, (_y, out) => out.set(row), PIXEL_UM);
});

const settings = {
  kind: "image",
  roi: null,
  channel: "luminance",
  plane: 0,
  timePoint: 0,
  projection: "none",
  invert: false,
  flatten: "plane",
  window: "hann",
  profileAxis: "x",
  pixelSizeUm: PIXEL_UM,
  pixelSizeSource: "readout settings",
};

/** Runs the readout child on the file; returns its result and its peak resident memory in bytes. */
function readInChild(name: string, roi: object | null) {
  const out = path.join(dir, name);
  mkdirSync(out);
  const settingsFile = path.join(out, "settings.json");
  writeFileSync(settingsFile, JSON.stringify({ ...settings, roi }));
  const r = spawnSync(
    process.execPath,
    [
      "--conditions=react-server",
      "--import",
      "tsx",
      "--require",
      path.join(ROOT, "tests/support/report-peak-memory.cjs"),
      path.join(ROOT, "lib/workers/readout-child.ts"),
      ...["--input", file, "--settings", settingsFile, "--out", out, "--threads", "2"],
    ],
    { cwd: ROOT, encoding: "utf8", env: { ...process.env, NODE_OPTIONS: "" }, maxBuffer: 16 * 1024 * 1024 },
  );
  if (r.status !== 0) throw new Error(`the readout child failed: ${r.stderr}`);
  const peak = /^peak-rss (\d+)$/m.exec(r.stderr);
  if (!peak) throw new Error(`the child reported no peak memory: ${r.stderr}`);
  const result = JSON.parse(r.stdout.trim().split("\n").at(-1)!);
  return { result, peakRssBytes: Number(peak[1]), previewBytes: readFileSync(path.join(out, "preview.png")).length };
}

const MIB = 2 ** 20;

describe("a slide-scan-sized TIFF is read from its file, never held whole", () => {
  it("the file is larger than the limits the readouts are held to", () => {
    expect(statSync(file).size).toBeGreaterThan(600 * MIB);
    expect(statSync(file).size).toBe(8 + 2 * SIDE * SIDE + 2 + 12 * 12 + 4 + 2 * 4 * 1250 + 2 * 8); // header, strips, IFD
  });

  it(
    "a 2048² ROI of the 20 000² scan: λ within 2 %, peak memory below the file's own size (600 MiB)",
    { timeout: 300_000 },
    () => {
      const { result, peakRssBytes, previewBytes } = readInChild("roi", {
        kind: "rect",
        x: 8000,
        y: 6000,
        width: 2048,
        height: 2048,
      });
      const w = result.wavelength;
      expect(w.periodFound).toBe(true);
      expect(Math.abs(w.wavelengthPx - LAMBDA_PX) / LAMBDA_PX).toBeLessThan(0.02); // issue 13: within 2 %
      expect(w.symmetry).toBe("stripes");
      expect(result.image).toMatchObject({ width: SIDE, height: SIDE, reduceFactor: 1 });
      expect(previewBytes).toBeGreaterThan(0); // the whole scan was read once more, reduced, for the preview
      console.log(`peak RSS, 2048² ROI of a 20 000² scan: ${(peakRssBytes / MIB).toFixed(0)} MiB`);
      expect(peakRssBytes).toBeLessThan(600 * MIB); // design choice: below the 763 MiB file, so its bytes were not held
    },
  );

  it("the whole 20 000² scan: read reduced 5×, λ within 2 %, peak memory ≤ 1 GiB", { timeout: 300_000 }, () => {
    const { result, peakRssBytes } = readInChild("whole", null);
    const w = result.wavelength;
    expect(w.periodFound).toBe(true);
    expect(Math.abs(w.wavelengthPx - LAMBDA_PX) / LAMBDA_PX).toBeLessThan(0.02); // issue 13: within 2 %
    expect(Math.abs(w.wavelengthUm - LAMBDA_PX * PIXEL_UM) / (LAMBDA_PX * PIXEL_UM)).toBeLessThan(0.02);
    expect(w.symmetry).toBe("stripes");
    // 20 000 / 4096 → the smallest integer factor that fits the analysis limit is 5.
    expect(result.image).toMatchObject({ width: SIDE, height: SIDE, reduceFactor: 5 });
    console.log(`peak RSS, whole 20 000² scan: ${(peakRssBytes / MIB).toFixed(0)} MiB`);
    expect(peakRssBytes).toBeLessThanOrEqual(1024 * MIB); // issue 13: a readout's peak memory ≤ 1 GiB
  });
});
