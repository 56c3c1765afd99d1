/**
 * Stacks through the API: an OME-TIFF upload reports its channels, planes and time points; a new
 * readout picks a channel and a plane (0-based in the API) and reads that page; a choice the file
 * does not have is refused with 422 before anything is queued; an OME-XML that disagrees with the
 * pages keeps the upload and says why no readout started.
 */
import { describe, expect, it } from "vitest";
import { makeStripes } from "@/lib/synthetic";
import type { ReadoutDto } from "@/lib/server/readouts/readouts";
import { database } from "@/lib/server/services";
import { setupReadoutLab } from "../support/readouts";
import { omeXml, writeTiffPages } from "../support/tiff-writer";

const { api, newSpecimen, uploadFile, finished } = setupReadoutLab();

const W = 160,
  H = 128;
/** A page of stripes of the given period (px), as 16-bit values. */
const stripesPage = (wavelengthPx: number, seed: number) => ({
  width: W,
  height: H,
  data: Array.from(makeStripes({ width: W, height: H, wavelengthPx, angleDeg: 0, noise: 0.05, seed }).data, (v) =>
    Math.round(Math.min(1, Math.max(0, v)) * 65535),
  ),
});

/** 2 channels × 2 planes, XYZCT (page = z + 2·c): only channel 2, plane 2 (page 4) has 16 px stripes; the others 10 px. */
function stack(description = omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 2, sizeT: 1, physicalSizeX: 0.5 })) {
  return writeTiffPages([stripesPage(10, 1), stripesPage(10, 2), stripesPage(10, 3), stripesPage(16, 4)], {
    bits: 16,
    description,
  });
}

describe("stacks through the API", () => {
  let uploadId = "";

  it("an OME-TIFF upload reports its layout and its pixel size from PhysicalSizeX", async () => {
    const up = await uploadFile((await newSpecimen()).id, "stack.ome.tif", stack());
    expect(up.status).toBe(201);
    uploadId = up.body.id;
    const got = await (await api("GET /api/v1/labs/[labId]/uploads/[uploadId]", { uploadId })).json();
    expect(got.imageLayout).toMatchObject({ channels: 2, planes: 2, timePoints: 1, pages: 4, stackSource: "ome-xml" });
    expect(got.pixelSizeUm).toBe(0.5);
    expect(got.pixelSizeSource).toBe("ome-xml");
    // The default readout reads channel 1, plane 1 (page 1: 10 px stripes) and says which channel it took.
    const first = await finished(up.body.readout);
    expect(first.status).toBe("succeeded");
    expect(Math.abs(first.headline!.wavelengthUm! - 5) / 5).toBeLessThan(0.01); // 10 px × 0.5 µm/px
    if (first.result?.type !== "image") throw new Error("expected an image readout");
    expect(first.result.wavelength.warnings.join(" ")).toMatch(/channel 1 was read/);
  });

  it("a readout of channel 2, plane 2 (API: channel 1, plane 1) reads that page", async () => {
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId },
      { json: { channel: 1, plane: 1 } },
    );
    expect(res.status).toBe(202);
    const r = await finished((await res.json()) as ReadoutDto);
    expect(r.settings).toMatchObject({ kind: "image", channel: 1, plane: 1, timePoint: 0, projection: "none" });
    expect(Math.abs(r.headline!.wavelengthUm! - 8) / 8).toBeLessThan(0.01); // 16 px × 0.5 µm/px
    if (r.result?.type !== "image") throw new Error("expected an image readout");
    expect(r.result.image).toMatchObject({ channelUsed: 1, planeUsed: 1, planes: 2, timePointUsed: 0 });
    // The readout page offers the upload's planes and time points from its headers.
    expect(r.imageLayout).toMatchObject({ channels: 2, planes: 2, timePoints: 1 });
  });

  it("a channel, plane or time point the file lacks is a 422 naming it from 1; nothing is queued", async () => {
    const m = await database();
    const before = await m.Readout.count({ where: { uploadId } });
    const post = (json: unknown) =>
      api("POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts", { uploadId }, { json });
    const channel = await post({ channel: 2 });
    expect(channel.status).toBe(422);
    expect((await channel.json()).error.message).toBe(
      "Channel 3 does not exist: this file has 2 channels (1–2); the API's channel counts from 0, so channel: 2 is channel 3.",
    );
    const plane = await post({ channel: 0, plane: 2 });
    expect(plane.status).toBe(422);
    expect((await plane.json()).error.message).toMatch(/^Plane 3 does not exist: this file has 2 planes \(z\) \(1–2\)/);
    const time = await post({ timePoint: 1 });
    expect(time.status).toBe(422);
    expect((await time.json()).error.message).toMatch(/^Time point 2 does not exist: this file has 1 time point/);
    expect((await post({ projection: "sum" })).status).toBe(400);
    expect(await m.Readout.count({ where: { uploadId } })).toBe(before);
  });

  it("an OME-XML that disagrees with the pages keeps the upload and says why no readout started", async () => {
    const xml = omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 3, sizeT: 1, physicalSizeX: 0.5 });
    const up = await uploadFile((await newSpecimen()).id, "bad.ome.tif", stack(xml));
    expect(up.status).toBe(201);
    expect(up.body.readout).toBeNull();
    expect(up.body.readoutError).toBe(
      "The OME-XML in this TIFF describes SizeC × SizeZ × SizeT = 2 × 3 × 1 = 6 images, but the file holds 4 pages; the description disagrees with the pixel data.",
    );
    const m = await database();
    expect(await m.Upload.count({ where: { id: up.body.id } })).toBe(1);
    expect(await m.Readout.count({ where: { uploadId: up.body.id } })).toBe(0);
  });

  it("a damaged page: the upload and its readout of plane 1 work; plane 2 is refused naming the page", async () => {
    const good = writeTiffPages([stripesPage(16, 5), stripesPage(16, 6), stripesPage(16, 7)], {
      bits: 16,
      resolution: { pxPerUnit: 2, unit: 3 }, // 2 px/cm: 5000 µm/px, a pixel size the file carries (TIFF 6.0 tag 282)
    });
    // Point page 2's strip offset past the end of the file (TIFF 6.0 tag 273, StripOffsets).
    const bad = Buffer.from(good);
    let ifd = bad.readUInt32LE(4);
    ifd = bad.readUInt32LE(ifd + 2 + bad.readUInt16LE(ifd) * 12);
    for (let e = 0; e < bad.readUInt16LE(ifd); e++)
      if (bad.readUInt16LE(ifd + 2 + e * 12) === 273) bad.writeUInt32LE(bad.length + 10, ifd + 2 + e * 12 + 8);
    const up = await uploadFile((await newSpecimen()).id, "damaged.tif", bad);
    expect(up.status).toBe(201);
    expect((await finished(up.body.readout)).status).toBe("succeeded");
    const res = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { plane: 1 } },
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toBe(
      "Page 2 of the TIFF is damaged: its pixel data lies beyond the end of the file (the file may be truncated).",
    );
    const maxZ = await api(
      "POST /api/v1/labs/[labId]/uploads/[uploadId]/readouts",
      { uploadId: up.body.id },
      { json: { projection: "max-z" } },
    );
    expect(maxZ.status).toBe(422);
  });
});
