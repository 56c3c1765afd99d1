/**
 * A minimal multi-page TIFF writer for tests: little-endian, uncompressed, one strip per page,
 * grey or interleaved samples, 8/16-bit unsigned or 32-bit float, an optional ImageDescription on
 * the first page (OME-XML, ImageJ header). Layout: TIFF 6.0 specification (Adobe 1992), sections
 * 2 (header, IFD, next-IFD offset), 8 (baseline tags) and tag 339 SampleFormat (section 19).
 */
export interface TiffPageInput {
  width: number;
  height: number;
  /** Samples per pixel, interleaved. @default 1 */
  samples?: number;
  /** Row-major, `width · height · samples` values. */
  data: ArrayLike<number>;
}

export interface WriteTiffOptions {
  bits: 8 | 16 | 32;
  /** Written as ImageDescription (tag 270) of page 1. */
  description?: string;
  /** XResolution = YResolution = pixels per unit; ResolutionUnit 1 none, 2 inch, 3 cm (TIFF 6.0 tag 296). */
  resolution?: { pxPerUnit: number; unit: 1 | 2 | 3 };
}

interface Entry {
  tag: number;
  type: number;
  values: number[] | Uint8Array;
}

const SIZE: Record<number, number> = { 2: 1, 3: 2, 4: 4, 5: 8 };

export function writeTiffPages(pages: TiffPageInput[], options: WriteTiffOptions): Buffer {
  const bytesPer = options.bits / 8;
  const chunks: Buffer[] = [];
  let at = 8;
  const header = Buffer.alloc(8);
  header.write("II", 0, "latin1");
  header.writeUInt16LE(42, 2);
  chunks.push(header);
  const ifdOffsets: number[] = [];
  const nextFields: Array<{ chunk: Buffer; pos: number }> = [];
  pages.forEach((p, index) => {
    const spp = p.samples ?? 1;
    const pixels = Buffer.alloc(p.width * p.height * spp * bytesPer);
    for (let i = 0; i < p.width * p.height * spp; i++) {
      if (options.bits === 8) pixels.writeUInt8(p.data[i], i);
      else if (options.bits === 16) pixels.writeUInt16LE(p.data[i], 2 * i);
      else pixels.writeFloatLE(p.data[i], 4 * i);
    }
    const pixelsAt = at;
    chunks.push(pixels);
    at += pixels.length + (pixels.length % 2);
    if (pixels.length % 2) chunks.push(Buffer.alloc(1));
    const entries: Entry[] = [
      { tag: 256, type: 4, values: [p.width] },
      { tag: 257, type: 4, values: [p.height] },
      { tag: 258, type: 3, values: Array(spp).fill(options.bits) },
      { tag: 259, type: 3, values: [1] },
      { tag: 262, type: 3, values: [spp >= 3 ? 2 : 1] },
      { tag: 273, type: 4, values: [pixelsAt] },
      { tag: 277, type: 3, values: [spp] },
      { tag: 278, type: 4, values: [p.height] },
      { tag: 279, type: 4, values: [pixels.length] },
      { tag: 284, type: 3, values: [1] },
      { tag: 339, type: 3, values: Array(spp).fill(options.bits === 32 ? 3 : 1) },
    ];
    if (index === 0 && options.description)
      entries.push({ tag: 270, type: 2, values: new Uint8Array(Buffer.from(options.description + "\0", "utf8")) });
    if (options.resolution) {
      const rational = [Math.round(options.resolution.pxPerUnit * 1e6), 1e6];
      entries.push({ tag: 282, type: 5, values: rational });
      entries.push({ tag: 283, type: 5, values: rational });
      entries.push({ tag: 296, type: 3, values: [options.resolution.unit] });
    }
    entries.sort((a, b) => a.tag - b.tag);
    // Values longer than 4 bytes go after the IFD.
    const ifdAt = at;
    const ifd = Buffer.alloc(2 + entries.length * 12 + 4);
    let extraAt = ifdAt + ifd.length;
    const extras: Buffer[] = [];
    ifd.writeUInt16LE(entries.length, 0);
    entries.forEach((e, i) => {
      const count = e.type === 5 ? e.values.length / 2 : e.values.length;
      const size = (SIZE[e.type] ?? 1) * count;
      const val = Buffer.alloc(Math.max(4, size + (size % 2)));
      if (e.type === 2) Buffer.from(e.values as Uint8Array).copy(val);
      else
        Array.from(e.values).forEach((v, k) => {
          if (e.type === 3) val.writeUInt16LE(v, 2 * k);
          else val.writeUInt32LE(v, 4 * k);
        });
      const o = 2 + i * 12;
      ifd.writeUInt16LE(e.tag, o);
      ifd.writeUInt16LE(e.type, o + 2);
      ifd.writeUInt32LE(count, o + 4);
      if (size <= 4) val.copy(ifd, o + 8, 0, 4);
      else {
        ifd.writeUInt32LE(extraAt, o + 8);
        extras.push(val);
        extraAt += val.length;
      }
    });
    ifdOffsets.push(ifdAt);
    nextFields.push({ chunk: ifd, pos: 2 + entries.length * 12 });
    chunks.push(ifd, ...extras);
    at = extraAt;
  });
  header.writeUInt32LE(ifdOffsets[0], 4);
  nextFields.forEach((f, i) => f.chunk.writeUInt32LE(ifdOffsets[i + 1] ?? 0, f.pos));
  return Buffer.concat(chunks);
}

/** OME-XML for one image with the given sizes (OME data model 2016-06). */
export function omeXml(p: {
  sizeX: number;
  sizeY: number;
  sizeC: number;
  sizeZ: number;
  sizeT: number;
  order?: string;
  physicalSizeX?: number;
  physicalSizeY?: number;
  unit?: string;
  type?: string;
}): string {
  const phys =
    p.physicalSizeX !== undefined
      ? ` PhysicalSizeX="${p.physicalSizeX}" PhysicalSizeXUnit="${p.unit ?? "µm"}" PhysicalSizeY="${p.physicalSizeY ?? p.physicalSizeX}" PhysicalSizeYUnit="${p.unit ?? "µm"}"`
      : "";
  return (
    `<?xml version="1.0" encoding="UTF-8"?><OME xmlns="http://www.openmicroscopy.org/Schemas/OME/2016-06">` +
    `<Image ID="Image:0" Name="test"><Pixels ID="Pixels:0" DimensionOrder="${p.order ?? "XYZCT"}" Type="${p.type ?? "uint16"}"` +
    ` SizeX="${p.sizeX}" SizeY="${p.sizeY}" SizeC="${p.sizeC}" SizeZ="${p.sizeZ}" SizeT="${p.sizeT}"${phys}>` +
    `<Channel ID="Channel:0:0" SamplesPerPixel="1"/><TiffData/></Pixels></Image></OME>`
  );
}
