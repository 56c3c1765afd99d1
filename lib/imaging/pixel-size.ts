import { headOf, type ImageInput } from "./image-input";
import { readTiffPages } from "./read-tiff-pages";
import { readTiffTags } from "./read-tiff-tags";

export type PixelSizeSource = "ome-xml" | "tiff-resolution" | "png-phys" | "jfif-density" | null;

export interface PixelSizeInfo {
  pixelSizeUm: number | null;
  pixelSizeSource: PixelSizeSource;
  /** Why a present resolution was not used, e.g. a writer's 72 dpi default. */
  pixelSizeNote: string | null;
}

/** Writers' default densities (dpi) that describe a screen or printer, not a microscope; 25.4 dpi is libvips' 1 px/mm. */
const DEFAULT_DPI = [25.4, 72, 96, 150, 300, 600];
const UNIT_UM: Record<string, number> = {
  µm: 1,
  μm: 1,
  um: 1,
  micron: 1,
  microns: 1,
  "\\u00B5m": 1, // ImageJ escapes µ in its header
  nm: 1e-3,
  mm: 1e3,
  cm: 1e4,
  m: 1e6,
  Å: 1e-4,
};

const none = (note: string | null = null): PixelSizeInfo => ({
  pixelSizeUm: null,
  pixelSizeSource: null,
  pixelSizeNote: note,
});

function fromDpi(dpi: number, source: PixelSizeSource): PixelSizeInfo {
  const um = 25400 / dpi;
  if (!(Number.isFinite(um) && um > 0)) return none(`The file's resolution (${dpi} dpi) gives no usable pixel size.`);
  if (DEFAULT_DPI.some((d) => Math.abs(dpi - d) < 0.05))
    return none(`The file's resolution (${Number(dpi.toFixed(1))} dpi) is a writer's default, not a pixel size.`);
  return { pixelSizeUm: um, pixelSizeSource: source, pixelSizeNote: null };
}

/** OME-XML `<Pixels PhysicalSizeX="…" PhysicalSizeXUnit="…">` (OME data model; unit default µm). */
export function readOmePixelSize(xml: string): number | null {
  const pixels = /<(?:\w+:)?Pixels\b[^>]*>/.exec(xml)?.[0];
  if (!pixels) return null;
  const size = /PhysicalSizeX="([^"]+)"/.exec(pixels)?.[1];
  const unit = /PhysicalSizeXUnit="([^"]+)"/.exec(pixels)?.[1] ?? "µm";
  const v = Number(size);
  const scale = UNIT_UM[unit];
  return Number.isFinite(v) && v > 0 && scale ? v * scale : null;
}

/** Bytes of a PNG file searched for pHYs (design choice: ancillary chunks before the pixels are small). */
const PNG_HEAD_BYTES = 1024 * 1024;

/** PNG pHYs chunk (PNG spec §11.3.5.3): pixels per unit, unit 1 = metre. */
function readPngPhys(b: Uint8Array): { x: number; unit: number } | null {
  const view = new DataView(b.buffer, b.byteOffset, b.byteLength);
  for (let at = 8; at + 12 <= b.length;) {
    const len = view.getUint32(at);
    const type = String.fromCharCode(b[at + 4], b[at + 5], b[at + 6], b[at + 7]);
    if (type === "pHYs" && len >= 9 && at + 17 <= b.length) return { x: view.getUint32(at + 8), unit: b[at + 16] };
    if (type === "IDAT" || type === "IEND") return null;
    at += 12 + len;
  }
  return null;
}

/** Pixel size from the file's own metadata, most specific source first. */
export function readPixelSize(input: ImageInput, format: string, density?: number): PixelSizeInfo {
  if (format === "tiff") {
    const tags = readTiffTags(input);
    if (!tags) {
      // BigTIFF: only OME-XML is read from it (the resolution tags of large scans are rarely set).
      const description = readTiffPages(input)?.description;
      const um = description?.includes("<OME") ? readOmePixelSize(description) : null;
      return um ? { pixelSizeUm: um, pixelSizeSource: "ome-xml", pixelSizeNote: null } : none();
    }
    if (tags.imageDescription?.includes("<OME")) {
      const um = readOmePixelSize(tags.imageDescription);
      if (um) return { pixelSizeUm: um, pixelSizeSource: "ome-xml", pixelSizeNote: null };
    }
    const xres = tags.xResolution;
    if (xres === undefined) return none();
    if (!(Number.isFinite(xres) && xres > 0)) {
      return none(
        `The TIFF resolution (${tags.xResolutionText ?? String(xres)} pixels per unit) is not a positive number, so it gives no pixel size.`,
      );
    }
    const unit = tags.resolutionUnit ?? 2;
    // ImageJ writes ResolutionUnit "none" and its unit into the description ("unit=micron").
    const imagejUnit = /^ImageJ=/.test(tags.imageDescription ?? "")
      ? /^unit=(.+)$/m.exec(tags.imageDescription!)?.[1]?.trim()
      : undefined;
    if (unit === 1 && imagejUnit && UNIT_UM[imagejUnit])
      return { pixelSizeUm: UNIT_UM[imagejUnit] / xres, pixelSizeSource: "tiff-resolution", pixelSizeNote: null };
    if (unit === 3) return fromDpi(xres * 2.54, "tiff-resolution");
    if (unit === 2) return fromDpi(xres, "tiff-resolution");
    return none("The TIFF resolution has no unit (ResolutionUnit = 1).");
  }
  if (format === "png") {
    // pHYs comes before the first IDAT (PNG spec §5.6): the file's head holds it.
    const phys = readPngPhys(headOf(input, PNG_HEAD_BYTES));
    if (!phys || phys.unit !== 1 || !(phys.x > 0)) return none();
    return fromDpi(phys.x * 0.0254, "png-phys");
  }
  if (format === "jpeg" && density && density > 0) return fromDpi(density, "jfif-density");
  return none();
}
