import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { decodeImage, encodePng, encodeTiff16, readOmePixelSize, sniffFileKind } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";

const img = makeStripes({ width: 40, height: 24, wavelengthPx: 8, angleDeg: 20 });

describe("decodeImage round trips with encode (values to the quantisation step)", () => {
  it.each([
    [8, 255],
    [16, 65535],
  ] as const)("%i-bit PNG", async (bitDepth, max) => {
    const { image, info } = await decodeImage(await encodePng(img, { bitDepth }));
    expect([info.width, info.height, info.channels, info.bitDepth, info.format]).toEqual([40, 24, 1, bitDepth, "png"]);
    for (let i = 0; i < image.data.length; i += 7)
      expect(Math.abs(image.data[i] - img.data[i])).toBeLessThanOrEqual(0.5 / max + 1e-6);
  });
  it("16-bit TIFF carries its pixel size from the resolution tags (px/cm → µm/px)", async () => {
    const { info } = await decodeImage(await encodeTiff16(img, { pixelSizeUm: 0.325 }));
    expect(info.bitDepth).toBe(16);
    expect(info.pixelSizeSource).toBe("tiff-resolution");
    expect(info.pixelSizeUm).toBeCloseTo(0.325, 6);
  });
  it("a 72 dpi resolution is a writer default, not a pixel size", async () => {
    const buf = await sharp(new Uint16Array(16), { raw: { width: 4, height: 4, channels: 1 } })
      .toColourspace("grey16")
      .tiff({ compression: "none", xres: 72 / 25.4, yres: 72 / 25.4, resolutionUnit: "inch" })
      .toBuffer();
    const { info } = await decodeImage(buf);
    expect(info.pixelSizeUm).toBeNull();
    expect(info.pixelSizeNote).toContain("72 dpi");
  });
  it("an image written without a resolution (libvips' 1 px/mm default) has no pixel size", async () => {
    expect((await decodeImage(await encodePng(img))).info.pixelSizeUm).toBeNull();
  });
  it("picks one channel of an RGB image, or Rec. 709 luminance (ITU-R BT.709 weights)", async () => {
    const rgb = new Uint8Array(4 * 4 * 3);
    for (let i = 0; i < 16; i++) {
      rgb[3 * i] = 200;
      rgb[3 * i + 1] = 100;
      rgb[3 * i + 2] = 50;
    }
    const png = await sharp(rgb, { raw: { width: 4, height: 4, channels: 3 } })
      .png()
      .toBuffer();
    expect((await decodeImage(png, { channel: 1 })).image.data[5]).toBeCloseTo(100 / 255, 6);
    expect((await decodeImage(png)).image.data[5]).toBeCloseTo((0.2126 * 200 + 0.7152 * 100 + 0.0722 * 50) / 255, 5);
  });
  it("16-bit RGB keeps 16-bit samples per channel", async () => {
    const u16 = new Uint16Array(4 * 2 * 3).map((_, i) => i * 1000 + 1);
    const tif = await sharp(u16, { raw: { width: 4, height: 2, channels: 3 } })
      .toColourspace("rgb16")
      .tiff({ compression: "none" })
      .toBuffer();
    const { image, info } = await decodeImage(tif, { channel: 2 });
    expect([info.bitDepth, info.channels]).toEqual([16, 3]);
    expect(image.data[1]).toBeCloseTo(5001 / 65535, 6);
  });
});

describe("OME-XML and sniffing", () => {
  it("reads PhysicalSizeX with its unit (OME data model attributes)", () => {
    expect(
      readOmePixelSize('<OME><Image><Pixels PhysicalSizeX="0.1625" PhysicalSizeY="0.1625" SizeX="8"/></Image></OME>'),
    ).toBeCloseTo(0.1625, 9);
    expect(readOmePixelSize('<OME><Pixels PhysicalSizeX="650" PhysicalSizeXUnit="nm"/></OME>')).toBeCloseTo(0.65, 9);
  });
  it.each([
    [[0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0], "png"], // PNG signature (PNG spec §5.2)
    [[0xff, 0xd8, 0xff, 0xe0], "jpeg"], // SOI + APP0 (JPEG/JFIF)
    [[0x49, 0x49, 0x2a, 0x00], "tiff"], // TIFF 6.0 header, little-endian
    [[0x4d, 0x4d, 0x00, 0x2a], "tiff"],
    [Array.from(Buffer.from("x,y\n1,2\n3,4\n")), "csv"],
    [Array.from(Buffer.from("x\ty\n1\t2\n")), "tsv"],
    [Array.from(Buffer.from("spacing_um\n12.1\n11.8\n")), "csv"],
    [[0x00, 0x01, 0x02, 0x03], null],
    [Array.from(Buffer.from("<html><body>not a table</body></html>")), null],
  ])("%#", (bytes, kind) => {
    expect(sniffFileKind(Uint8Array.from(bytes as number[]))).toBe(kind);
  });
});
