/**
 * A large, compressed TIFF (12 000 × 10 000 px, above the old 8192² limit) is read without
 * decoding it whole at full resolution: reduced 3 × 3 by a box average (the readout's own binning),
 * the wavelength of the generated stripes is right within 2 %, and the readout's peak resident
 * memory, measured in a child process, stays within 1 GiB (issue 13's limit).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, describe, expect, it } from "vitest";

const ROOT = path.resolve(__dirname, "../../..");
const dir = mkdtempSync(path.join(tmpdir(), "morphokin-large-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const W = 12_000,
  H = 10_000,
  LAMBDA_PX = 24;

/** Vertical stripes of period 24 px, 8-bit, written as a deflate-compressed tiled TIFF. */
async function writeStripes(file: string): Promise<void> {
  const row = new Uint8Array(W);
  for (let x = 0; x < W; x++) row[x] = Math.round(127.5 + 100 * Math.cos((2 * Math.PI * x) / LAMBDA_PX));
  const raw = new Uint8Array(W * H);
  for (let y = 0; y < H; y++) raw.set(row, y * W);
  const tif = await sharp(raw, { raw: { width: W, height: H, channels: 1 }, limitInputPixels: false })
    .toColourspace("b-w")
    .tiff({ compression: "deflate", tile: true, tileWidth: 256, tileHeight: 256 })
    .toBuffer();
  writeFileSync(file, tif);
}

function readInChild(file: string, settings: object) {
  const r = spawnSync(
    process.execPath,
    [
      "--conditions=react-server",
      "--import",
      "tsx",
      path.join(ROOT, "tests/support/large-readout-child.ts"),
      file,
      JSON.stringify(settings),
    ],
    { cwd: ROOT, encoding: "utf8", env: { ...process.env, NODE_OPTIONS: "" }, maxBuffer: 16 * 1024 * 1024 },
  );
  if (r.status !== 0) throw new Error(`the readout child failed: ${r.stderr}`);
  return JSON.parse(r.stdout.trim().split("\n").at(-1)!);
}

const base = {
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
  pixelSizeUm: 0.5,
  pixelSizeSource: "readout settings",
};

describe("large images", () => {
  it(
    "a 12 000 × 10 000 tiled TIFF: λ within 2 %, read reduced 3×, peak memory ≤ 1 GiB",
    { timeout: 180_000 },
    async () => {
      const file = path.join(dir, "stripes.tif");
      await writeStripes(file);
      const r = readInChild(file, base);
      // Geometry is the source: 24 px stripes; 12 000 / 4096 → the smallest integer factor that fits is 3.
      expect(r.periodFound).toBe(true);
      expect(Math.abs(r.wavelengthPx - LAMBDA_PX) / LAMBDA_PX).toBeLessThan(0.02);
      expect(Math.abs(r.wavelengthUm - LAMBDA_PX * 0.5) / (LAMBDA_PX * 0.5)).toBeLessThan(0.02);
      expect(r.symmetry).toBe("stripes");
      expect(r.image).toMatchObject({ width: W, height: H, reduceFactor: 3 });
      expect(r.warnings.join(" ")).toMatch(/read reduced 3×3/);
      expect(r.preview).toMatchObject({ width: 1024, height: 853 }); // 1024 · 10 000 / 12 000, rounded
      console.log(`peak RSS of the 12 000 × 10 000 readout: ${(r.maxRssBytes / 2 ** 20).toFixed(0)} MiB`);
      expect(r.maxRssBytes).toBeLessThanOrEqual(2 ** 30); // issue 13: a readout's peak memory ≤ 1 GiB
    },
  );

  it(
    "a rectangular ROI of the large image is read by itself (offset kept in the result)",
    { timeout: 180_000 },
    async () => {
      const file = path.join(dir, "stripes.tif");
      const roi = { kind: "rect", x: 1000, y: 500, width: 6000, height: 5000 };
      const r = readInChild(file, { ...base, roi });
      // 6000 / 4096 → factor 2; the stripes' period is unchanged by the crop.
      expect(r.image.reduceFactor).toBe(2);
      expect(Math.abs(r.wavelengthPx - LAMBDA_PX) / LAMBDA_PX).toBeLessThan(0.02);
    },
  );

  it(
    "the command line reads the large image reduced too, and gives lengths in source pixels",
    { timeout: 180_000 },
    async () => {
      const file = path.join(dir, "stripes.tif");
      const run = spawnSync(
        process.execPath,
        [
          "--conditions=react-server",
          "--import",
          "tsx",
          path.join(ROOT, "lib/cli/main.ts"),
          "readout",
          file,
          "--pixel-size",
          "0.5",
          "--json",
        ],
        { cwd: ROOT, encoding: "utf8", env: { ...process.env, NODE_OPTIONS: "" }, maxBuffer: 16 * 1024 * 1024 },
      );
      expect(run.status, run.stderr).toBe(0);
      const r = JSON.parse(run.stdout) as { wavelengthPx: number; wavelengthUm: number; warnings: string[] };
      expect(Math.abs(r.wavelengthPx - LAMBDA_PX) / LAMBDA_PX).toBeLessThan(0.02);
      expect(Math.abs(r.wavelengthUm - LAMBDA_PX * 0.5) / (LAMBDA_PX * 0.5)).toBeLessThan(0.02);
      expect(r.warnings.join(" ")).toMatch(/read reduced 3×3/);
    },
  );
});
