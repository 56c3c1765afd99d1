/**
 * Readouts of bad input: the upload stays, the readout fails and says why, and nothing derived is
 * written; bad settings are refused at once.
 */
import { crc32 } from "node:zlib";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { READOUT_MESSAGES } from "@/lib/readout";
import { makeStripes } from "@/lib/synthetic";
import { waitForJob } from "@/lib/server/jobs/queue";
import { database } from "@/lib/server/services";
import { errorOf } from "../support/lab-api";
import { setupReadoutLab } from "../support/readouts";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();

describe("bad input", () => {
  it("a truncated PNG is kept as an upload; its readout fails and says why, with no result or derived objects", async () => {
    const good = await encodePng(
      makeStripes({ width: 128, height: 128, wavelengthPx: 10, angleDeg: 0, noise: 0.3, seed: 2 }),
    );
    const bytes = good.subarray(0, Math.floor(good.length * 0.6));
    const up = await uploadFile((await newSpecimen()).id, "cut.png", bytes, { pixelSizeUm: "1" });
    expect(up.status).toBe(201);
    const r = await finished(up.body.readout);
    expect(r.status).toBe("failed");
    expect(r.error).toMatch(/^The PNG file could not be decoded; it may be truncated or damaged/);
    expect(r.result).toBeNull();
    expect(r.derived).toEqual({});
    const m = await database();
    expect((await m.Readout.findByPk(r.id))!.derivedKeys).toBeNull();
    expect((await api("GET /api/v1/labs/[labId]/uploads/[uploadId]", { uploadId: up.body.id })).status).toBe(200);
    expect((await waitForJob(r.jobId!)).error).toBe(r.error);
  });

  it("an image without variation fails with the reason", async () => {
    const flat = await sharp({ create: { width: 64, height: 64, channels: 3, background: { r: 120, g: 120, b: 120 } } })
      .greyscale()
      .png()
      .toBuffer();
    const up = await uploadFile((await newSpecimen()).id, "flat.png", flat, { pixelSizeUm: "1" });
    const r = await finished(up.body.readout);
    expect(r).toMatchObject({ status: "failed", error: READOUT_MESSAGES.noVariation });
  });

  it("a zero-area ROI, a field for the other kind, and a table in px without pixel size are refused at once", async () => {
    const bytes = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0, seed: 1 }));
    const img = await uploadFile((await newSpecimen()).id, "small.png", bytes, { pixelSizeUm: "1" });
    const start = (uploadId: string, json: unknown) =>
      api("POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts", { uploadId }, { json });
    const zero = await start(img.body.id, { roi: { kind: "rect", x: 5, y: 5, width: 0, height: 20 } });
    expect(zero.status).toBe(422);
    expect((await errorOf(zero)).message).toBe(READOUT_MESSAGES.zeroAreaRoi);
    const line = await start(img.body.id, {
      roi: {
        kind: "polygon",
        points: [
          [0, 0],
          [10, 10],
          [20, 20],
        ],
      },
    });
    expect(line.status).toBe(422);
    const wrong = await start(img.body.id, { columns: { spacing: "a" } });
    expect(wrong.status).toBe(400);
    expect((await errorOf(wrong)).message).toContain("columns");
    const table = await uploadFile(
      (await newSpecimen()).id,
      "px.csv",
      new TextEncoder().encode("spacing_px\n10\n12\n"),
    );
    const px = await start(table.body.id, { columns: { spacing: "spacing_px" }, unit: "px" });
    expect(px.status).toBe(422);
    expect((await errorOf(px)).message).toBe(
      'The table is in pixels (unit "px") but no pixel size is known: give the pixel size in µm/px.',
    );
    const m = await database();
    expect(await m.Readout.count({ where: { uploadId: img.body.id } })).toBe(1); // only the upload's own
  });

  it("an image above the pixel limit is refused at upload from its header (413)", async () => {
    // A 1×1 PNG whose IHDR claims 40000×30000 (CRC recomputed): only the header is ever read.
    const big = Buffer.from(
      await sharp({ create: { width: 1, height: 1, channels: 3, background: { r: 0, g: 0, b: 0 } } })
        .png()
        .toBuffer(),
    );
    big.writeUInt32BE(40000, 16);
    big.writeUInt32BE(30000, 20);
    big.writeUInt32BE(crc32(big.subarray(12, 29)), 29);
    const up = await uploadFile((await newSpecimen()).id, "huge.png", big, { pixelSizeUm: "1" });
    expect(up.status).toBe(413);
    expect(up.body.error!.message).toBe(
      "“huge.png” is 40000×30000 = 1200000000 pixels, above the limit of 1000000000 pixels (about 31 600 × 31 600); crop or bin it before uploading",
    );
  });
});
