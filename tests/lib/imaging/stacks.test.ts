/**
 * Multi-page TIFF, OME-TIFF and ImageJ stacks: the page of a channel, plane and time point, the
 * maximum-intensity projection over z, the OME pixel size with its unit, and 32-bit float.
 * Fixtures are written in the test (tests/support/tiff-writer.ts) with a known value per page, so
 * every check value follows from the construction.
 */
import { describe, expect, it } from "vitest";
import { decodeImage, ImagingError } from "@/lib/imaging";
import { omeXml, writeTiffPages } from "../../support/tiff-writer";

const W = 24,
  H = 16;
/** A page whose every pixel is `value` except pixel (1, 0), which is `value + 1` (so max-z is visible). */
const flat = (value: number, bump = 1) => {
  const data = new Array(W * H).fill(value);
  data[1] = value + bump;
  return { width: W, height: H, data };
};

describe("stacks", () => {
  it("a plain multi-page TIFF: pages are z-planes; a plane is chosen, or the max over z", async () => {
    const tif = writeTiffPages([flat(1000), flat(3000, -2000), flat(2000)], { bits: 16 });
    const p2 = await decodeImage(tif, { plane: 1 });
    expect(p2.info.stack).toMatchObject({ pageCount: 3, planes: 3, channels: 1, timePoints: 1, source: "pages" });
    expect(p2.image.data[0]).toBeCloseTo(3000 / 65535, 7); // page 2's value ÷ 65535 (16-bit scale)
    const max = await decodeImage(tif, { projection: "max-z" });
    expect(max.info.planeUsed).toBeNull();
    expect(max.image.data[0]).toBeCloseTo(3000 / 65535, 7); // max(1000, 3000, 2000)
    expect(max.image.data[1]).toBeCloseTo(2001 / 65535, 7); // max(1001, 1000, 2001)
  });

  it("OME-TIFF XYZCT: channel c, plane z, time t is page z + Z·(c + C·t); PhysicalSizeX in nm becomes µm", async () => {
    // 2 channels × 3 planes × 2 time points = 12 pages; page p holds the value 100·(p+1).
    const pages = Array.from({ length: 12 }, (_, p) => flat(100 * (p + 1)));
    const xml = omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 3, sizeT: 2, physicalSizeX: 650, unit: "nm" });
    const tif = writeTiffPages(pages, { bits: 16, description: xml });
    const r = await decodeImage(tif, { channel: 1, plane: 2, timePoint: 1 });
    // page = z + 3·(c + 2·t) = 2 + 3·(1 + 2) = 11 (0-based), value 1200 (OME DimensionOrder definition).
    expect(r.image.data[0]).toBeCloseTo(1200 / 65535, 7);
    expect(r.info.stack).toMatchObject({
      channels: 2,
      planes: 3,
      timePoints: 2,
      channelsIn: "pages",
      source: "ome-xml",
    });
    expect(r.info.channels).toBe(2);
    expect(r.info.pixelSizeUm).toBeCloseTo(0.65, 9); // 650 nm = 0.65 µm
    expect(r.info.pixelSizeSource).toBe("ome-xml");
  });

  it("OME-TIFF XYCZT: channels vary fastest; the default reads channel 1 and says so", async () => {
    const pages = Array.from({ length: 6 }, (_, p) => flat(100 * (p + 1)));
    const xml = omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 3, sizeT: 1, order: "XYCZT", physicalSizeX: 0.5 });
    const tif = writeTiffPages(pages, { bits: 16, description: xml });
    // page = c + 2·z: channel 1, plane 2 → page 1 + 4 = 5, value 600.
    expect((await decodeImage(tif, { channel: 1, plane: 2 })).image.data[0]).toBeCloseTo(600 / 65535, 7);
    const d = await decodeImage(tif);
    expect(d.info.channelUsed).toBe(0);
    expect(d.info.notes[0]).toMatch(/channel 1 was read/);
    // max over z of channel 1: pages 1, 3, 5 → 600.
    expect((await decodeImage(tif, { channel: 1, projection: "max-z" })).image.data[0]).toBeCloseTo(600 / 65535, 7);
  });

  it("an ImageJ hyperstack header: channels, slices and frames in C, Z, T order", async () => {
    const pages = Array.from({ length: 4 }, (_, p) => flat(10 * (p + 1)));
    const tif = writeTiffPages(pages, {
      bits: 8,
      description: "ImageJ=1.54f\nimages=4\nchannels=2\nslices=2\nhyperstack=true\n",
    });
    const r = await decodeImage(tif, { channel: 0, plane: 1 });
    expect(r.info.stack).toMatchObject({ channels: 2, planes: 2, timePoints: 1, source: "imagej" });
    expect(r.image.data[0]).toBeCloseTo(30 / 255, 6); // page c + 2·z = 2, value 30
  });

  it("an ImageJ TIFF's pixel size: ResolutionUnit none with unit=micron in the header", async () => {
    // ImageJ stores 1/pixel width as XResolution and the unit in its header: 2.5 px/µm = 0.4 µm/px.
    const tif = writeTiffPages([flat(1)], {
      bits: 8,
      description: "ImageJ=1.54f\nunit=micron\n",
      resolution: { pxPerUnit: 2.5, unit: 1 },
    });
    const r = await decodeImage(tif);
    expect(r.info.pixelSizeUm).toBeCloseTo(0.4, 9);
    expect(r.info.pixelSizeSource).toBe("tiff-resolution");
  });

  it("32-bit float TIFF is decoded as stored (no ÷65535), bitDepth 32", async () => {
    const data = Array.from({ length: W * H }, (_, i) => i * 0.25 - 7.5);
    const r = await decodeImage(writeTiffPages([{ width: W, height: H, data }], { bits: 32 }));
    expect(r.info.bitDepth).toBe(32);
    expect(r.image.data[0]).toBe(-7.5);
    expect(r.image.data[W * H - 1]).toBe((W * H - 1) * 0.25 - 7.5);
  });
});

describe("stack errors name the page, channel or plane as a person counts", () => {
  const xml = omeXml({ sizeX: W, sizeY: H, sizeC: 2, sizeZ: 3, sizeT: 1 });
  const tif = writeTiffPages(
    Array.from({ length: 6 }, () => flat(5)),
    { bits: 16, description: xml },
  );
  const messageOf = async (p: Promise<unknown>) => {
    try {
      await p;
    } catch (e) {
      expect(e).toBeInstanceOf(ImagingError);
      return (e as Error).message;
    }
    throw new Error("expected a failure");
  };

  it("a channel, plane or time point that does not exist", async () => {
    expect(await messageOf(decodeImage(tif, { channel: 2 }))).toBe(
      "Channel 3 does not exist: this file has 2 channels (1–2); the API's channel counts from 0, so channel: 2 is channel 3.",
    );
    expect(await messageOf(decodeImage(tif, { channel: 0, plane: 3 }))).toBe(
      "Plane 4 does not exist: this file has 3 planes (z) (1–3); the API's plane counts from 0, so plane: 3 is plane 4.",
    );
    expect(await messageOf(decodeImage(tif, { channel: 0, timePoint: 1 }))).toBe(
      "Time point 2 does not exist: this file has 1 time point (1); the API's timePoint counts from 0, so timePoint: 1 is time point 2.",
    );
  });

  it("OME-XML that disagrees with the pages", async () => {
    const five = writeTiffPages(
      Array.from({ length: 5 }, () => flat(5)),
      { bits: 16, description: xml },
    );
    expect(await messageOf(decodeImage(five))).toBe(
      "The OME-XML in this TIFF describes SizeC × SizeZ × SizeT = 2 × 3 × 1 = 6 images, but the file holds 5 pages; the description disagrees with the pixel data.",
    );
  });

  it("OME-XML whose SizeX/SizeY differ from the pages", async () => {
    const wrong = omeXml({ sizeX: W + 1, sizeY: H, sizeC: 2, sizeZ: 3, sizeT: 1 });
    const six = writeTiffPages(
      Array.from({ length: 6 }, () => flat(5)),
      { bits: 16, description: wrong },
    );
    expect(await messageOf(decodeImage(six))).toBe(
      `The OME-XML in this TIFF says the images are ${W + 1}×${H} pixels, but page 1 is ${W}×${H}; the description disagrees with the pixel data.`,
    );
  });

  it("a damaged page inside a stack is named; the other pages still read", async () => {
    const good = writeTiffPages([flat(1), flat(2), flat(3)], { bits: 16 });
    // Point page 2's strip offset past the end of the file.
    const bad = Buffer.from(good);
    const view = new DataView(bad.buffer, bad.byteOffset, bad.byteLength);
    let ifd = view.getUint32(4, true);
    ifd = view.getUint32(ifd + 2 + view.getUint16(ifd, true) * 12, true); // page 2
    for (let e = 0; e < view.getUint16(ifd, true); e++)
      if (view.getUint16(ifd + 2 + e * 12, true) === 273) view.setUint32(ifd + 2 + e * 12 + 8, bad.length + 10, true);
    expect(await messageOf(decodeImage(bad, { plane: 1 }))).toBe(
      "Page 2 of the TIFF is damaged: its pixel data lies beyond the end of the file (the file may be truncated).",
    );
    expect(await messageOf(decodeImage(bad, { projection: "max-z" }))).toMatch(/^Page 2 of the TIFF is damaged/);
    expect((await decodeImage(bad, { plane: 2 })).image.data[0]).toBeCloseTo(3 / 65535, 7);
  });
});

describe("BigTIFF", () => {
  it("the pages of a BigTIFF stack are walked like a classic TIFF's", async () => {
    const sharp = (await import("sharp")).default;
    const w = 32,
      h = 20;
    const px = new Uint8Array(w * h * 3);
    for (let p = 0; p < 3; p++) px.fill(50 * (p + 1), p * w * h, (p + 1) * w * h);
    const big = await sharp(px, { raw: { width: w, height: h * 3, channels: 1, pageHeight: h } })
      .toColourspace("b-w")
      .tiff({ compression: "deflate", bigtiff: true })
      .toBuffer();
    expect(big.readUInt16LE(2)).toBe(43); // the BigTIFF version number (BigTIFF format description)
    const r = await decodeImage(big, { plane: 2 });
    expect(r.info.stack).toMatchObject({ pageCount: 3, planes: 3 });
    expect(r.image.data[0]).toBeCloseTo(150 / 255, 6); // page 3 was filled with 150
  });
});
