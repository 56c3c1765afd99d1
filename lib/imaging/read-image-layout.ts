import sharp from "sharp";
import { ImagingError } from "./errors";
import { sharpInput, type ImageInput } from "./image-input";
import { readTiffPages } from "./read-tiff-pages";
import { describeStack } from "./stack-layout";

/** What an image file holds, from its headers only (no pixel is decoded): shown with the upload, checked before a readout. */
export interface ImageLayout {
  /** Size (px) after EXIF orientation. */
  width: number;
  height: number;
  format: string;
  bitDepth: 8 | 16 | 32;
  /** Channels to choose from (samples per pixel, or the stack's channels when they are pages). */
  channels: number;
  planes: number;
  timePoints: number;
  pages: number;
  channelsIn: "samples" | "pages";
  stackSource: "ome-xml" | "imagej" | "pages" | "single";
  /** Page dimensions fastest-varying first, e.g. "ZCT". */
  order: string;
  /** Why the file's stack cannot be read as described (every readout would fail with this), or null. */
  problem: string | null;
  /** Pages (from 1) that cannot be read, each with the reason. */
  damagedPages: Array<{ page: number; reason: string }>;
}

/** Reads the layout of an image file from its headers; null when sharp cannot read the header. */
export async function readImageLayout(input: ImageInput): Promise<ImageLayout | null> {
  const meta = await sharp(sharpInput(input), { limitInputPixels: false })
    .metadata()
    .catch(() => null);
  if (!meta || !meta.format) return null;
  const samples = meta.channels ?? 1;
  const depth = meta.depth;
  const layout: ImageLayout = {
    width: meta.autoOrient?.width ?? meta.width ?? 0,
    height: meta.autoOrient?.height ?? meta.height ?? 0,
    format: meta.format,
    bitDepth: depth === "float" || depth === "double" ? 32 : depth === "ushort" || depth === "short" ? 16 : 8,
    channels: samples,
    planes: 1,
    timePoints: 1,
    pages: meta.pages ?? 1,
    channelsIn: "samples",
    stackSource: "single",
    order: "ZCT",
    problem: null,
    damagedPages: [],
  };
  if (meta.format !== "tiff") return layout;
  const tiff = readTiffPages(input);
  try {
    const s = describeStack(tiff, meta.pages ?? 1, samples);
    Object.assign(layout, {
      channels: s.channelsIn === "pages" ? s.channels : samples,
      planes: s.planes,
      timePoints: s.timePoints,
      pages: s.pageCount,
      channelsIn: s.channelsIn,
      stackSource: s.source,
      order: s.order,
    });
    layout.damagedPages = (tiff?.pages ?? []).flatMap((p, i) => (p.damage ? [{ page: i + 1, reason: p.damage }] : []));
  } catch (e) {
    if (!(e instanceof ImagingError)) throw e;
    layout.problem = e.message;
  }
  return layout;
}
