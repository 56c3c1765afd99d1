import { ImagingError } from "./errors";
import type { TiffPages } from "./read-tiff-pages";
import { readStackDescription } from "./stack-description";

/**
 * How a file's pages map to channels, z-planes and time points. OME-TIFF and ImageJ hyperstacks
 * say so in their ImageDescription; a plain multi-page TIFF's pages are z-planes; anything else is
 * one plane. Channels are either the samples of each pixel (RGB, a two-channel PNG) or pages.
 */
export interface StackLayout {
  pageCount: number;
  channels: number;
  planes: number;
  timePoints: number;
  channelsIn: "samples" | "pages";
  source: "ome-xml" | "imagej" | "pages" | "single";
  /** Page dimensions fastest-varying first, e.g. "ZCT" (OME DimensionOrder XYZCT). */
  order: string;
  /** From OME PhysicalSizeX / PhysicalSizeY (µm/px), null when absent. */
  pixelSizeXUm: number | null;
  pixelSizeYUm: number | null;
}

/** What the user picked, 0-based as in the API. */
export interface StackChoice {
  channel: number | "luminance";
  plane: number;
  timePoint: number;
  projection: "none" | "max-z";
}

const times = (c: number, z: number, t: number) => `SizeC × SizeZ × SizeT = ${c} × ${z} × ${t} = ${c * z * t}`;

/**
 * @param samples channels per pixel as decoded (sharp's `channels`)
 * @throws ImagingError corrupt when the description disagrees with the pages
 */
export function describeStack(tiff: TiffPages | null, sharpPages: number, samples: number): StackLayout {
  const pageCount = tiff ? tiff.pages.length : Math.max(1, sharpPages);
  const single: StackLayout = {
    pageCount,
    channels: samples,
    planes: pageCount,
    timePoints: 1,
    channelsIn: "samples",
    source: pageCount > 1 ? "pages" : "single",
    order: "ZCT",
    pixelSizeXUm: null,
    pixelSizeYUm: null,
  };
  const d = tiff ? readStackDescription(tiff.description) : null;
  if (!d) return single;
  const what = d.source === "ome-xml" ? "The OME-XML in this TIFF" : "The ImageJ header of this TIFF";
  const broken = tiff?.chainError ? ` ${tiff.chainError}` : "";
  if (d.order.startsWith("invalid:"))
    throw new ImagingError(
      "corrupt",
      `${what} gives DimensionOrder “${d.order.slice(8)}”, which is not one of XYZCT, XYZTC, XYCTZ, XYCZT, XYTCZ, XYTZC.`,
    );
  if (![d.sizeC, d.sizeZ, d.sizeT].every(Number.isInteger))
    throw new ImagingError(
      "corrupt",
      `${what} gives a channel, plane or time-point count that is not a whole number ≥ 1.`,
    );
  const first = tiff!.pages[0];
  if (first && ((d.sizeX !== null && d.sizeX !== first.width) || (d.sizeY !== null && d.sizeY !== first.height)))
    throw new ImagingError(
      "corrupt",
      `${what} says the images are ${d.sizeX}×${d.sizeY} pixels, but page 1 is ${first.width}×${first.height}; the description disagrees with the pixel data.`,
    );
  const base = { pageCount, pixelSizeXUm: d.pixelSizeXUm, pixelSizeYUm: d.pixelSizeYUm, source: d.source };
  if (d.sizeC * d.sizeZ * d.sizeT === pageCount)
    return {
      ...base,
      channels: d.sizeC,
      planes: d.sizeZ,
      timePoints: d.sizeT,
      channelsIn: d.sizeC > 1 ? "pages" : "samples",
      order: d.order,
    };
  // RGB OME-TIFF: SizeC counts the samples of each page.
  if (samples > 1 && d.sizeC === samples && d.sizeZ * d.sizeT === pageCount)
    return {
      ...base,
      channels: samples,
      planes: d.sizeZ,
      timePoints: d.sizeT,
      channelsIn: "samples",
      order: d.order.replace("C", ""),
    };
  throw new ImagingError(
    "corrupt",
    `${what} describes ${times(d.sizeC, d.sizeZ, d.sizeT)} images, but the file holds ${pageCount} page${pageCount === 1 ? "" : "s"}; the description disagrees with the pixel data.${broken}`,
  );
}

/** 0-based page of (channel, plane, time point) under the layout's order. */
export function pageOf(
  layout: Pick<StackLayout, "channels" | "planes" | "timePoints" | "channelsIn" | "order">,
  c: number,
  z: number,
  t: number,
): number {
  const at: Record<string, number> = { C: layout.channelsIn === "pages" ? c : 0, Z: z, T: t };
  const size: Record<string, number> = {
    C: layout.channelsIn === "pages" ? layout.channels : 1,
    Z: layout.planes,
    T: layout.timePoints,
  };
  let page = 0,
    stride = 1;
  for (const dim of layout.order) {
    page += at[dim] * stride;
    stride *= size[dim];
  }
  return page;
}

const range = (n: number) => (n === 1 ? "1" : `1–${n}`);

function checkIndex(field: string, label: string, plural: string, value: number, count: number): void {
  if (!Number.isInteger(value) || value < 0)
    throw new ImagingError("bad_option", `${field} must be a whole number from 0 (got ${String(value)}).`, field);
  if (value >= count)
    throw new ImagingError(
      "bad_option",
      `${label} ${value + 1} does not exist: this file has ${count} ${count === 1 ? label.toLowerCase() : plural} (${range(count)}); the API's ${field} counts from 0, so ${field}: ${value} is ${label.toLowerCase()} ${value + 1}.`,
      field,
    );
}

/**
 * Checks a choice against the layout with messages that count from 1 as a person does.
 * Channels stored as samples keep the decoder's own check (and "luminance") unless `sampleChannelsToo`.
 */
export function checkStackChoice(
  layout: Pick<StackLayout, "channels" | "planes" | "timePoints" | "channelsIn">,
  choice: StackChoice,
  sampleChannelsToo = false,
): void {
  if ((sampleChannelsToo || layout.channelsIn === "pages") && choice.channel !== "luminance")
    checkIndex("channel", "Channel", "channels", choice.channel, layout.channels);
  if (choice.projection !== "max-z") checkIndex("plane", "Plane", "planes (z)", choice.plane, layout.planes);
  checkIndex("timePoint", "Time point", "time points", choice.timePoint, layout.timePoints);
}
