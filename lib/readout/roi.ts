import type { GreyImage } from "../imaging/grey-image";
import { MESSAGES, ReadoutError } from "./errors";

/** A rectangle in pixel coordinates of the image (x to the right, y downwards). */
export interface RectRoi {
  kind: "rect";
  x: number;
  y: number;
  width: number;
  height: number;
}

/** A closed polygon of vertices [x, y] in pixels; a pixel is inside when its centre is. */
export interface PolygonRoi {
  kind: "polygon";
  points: Array<[number, number]>;
}

export type Roi = RectRoi | PolygonRoi;

/** The cropped bounding box of the ROI, with `included[i] = 1` for analysed pixels. */
export interface RoiPixels {
  /** Column and row of the crop's top-left pixel in the source image. */
  x0: number;
  y0: number;
  width: number;
  height: number;
  data: Float32Array;
  /** 1 = analysed, 0 = outside the polygon or excluded by the mask; null = all analysed. */
  included: Uint8Array | null;
  includedCount: number;
  /** Sums taken while the crop was copied, over every pixel of it (the included ones or not). */
  stats: RegionStats;
}

/**
 * What one pass over a copied crop can also give, so later steps need not read it again: the
 * extremes and how many pixels sit at each (the saturation scan), and the plane fit's sums (used
 * only while every pixel is analysed).
 */
export interface RegionStats {
  min: number;
  max: number;
  atMin: number;
  atMax: number;
  /** Σz, Σx·z, Σy·z over the region (x, y from 0 at its top-left). */
  sumZ: number;
  sumXZ: number;
  sumYZ: number;
}

/** Copies rows [y0, y1) × columns [x0, x1) of the image, taking the RegionStats on the way. */
function copyWithStats(
  image: GreyImage,
  x0: number,
  y0: number,
  width: number,
  height: number,
): { data: Float32Array; stats: RegionStats } {
  const src = image.data,
    W = image.width;
  const data = new Float32Array(width * height);
  let min = Infinity,
    max = -Infinity,
    atMin = 0,
    atMax = 0,
    sumZ = 0,
    sumXZ = 0,
    sumYZ = 0;
  for (let y = 0; y < height; y++) {
    const from = (y + y0) * W + x0,
      to = y * width;
    let rz = 0,
      rxz = 0;
    for (let x = 0; x < width; x++) {
      const v = src[from + x];
      data[to + x] = v;
      // Written so, the counts compile to plain branches (a conditional expression made this loop 4× slower).
      if (v >= max) {
        if (v > max) {
          max = v;
          atMax = 0;
        }
        atMax++;
      }
      if (v <= min) {
        if (v < min) {
          min = v;
          atMin = 0;
        }
        atMin++;
      }
      rz += v;
      rxz += x * v;
    }
    sumZ += rz;
    sumXZ += rxz;
    sumYZ += y * rz;
  }
  return { data, stats: { min, max, atMin, atMax, sumZ, sumXZ, sumYZ } };
}

/** Even–odd ray casting point-in-polygon test (Shimrat 1962, CACM 5:434). */
function insidePolygon(px: number, py: number, pts: Array<[number, number]>): boolean {
  let inside = false;
  for (let i = 0, j = pts.length - 1; i < pts.length; j = i++) {
    const [xi, yi] = pts[i];
    const [xj, yj] = pts[j];
    if (yi > py !== yj > py && px < ((xj - xi) * (py - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/**
 * Crops the ROI (default: the whole image). `excludeMask`, when given, has one byte per source
 * pixel; non-zero marks a pixel to leave out (debris, a tear, a label).
 */
export function extractRoi(image: GreyImage, roi?: Roi, excludeMask?: Uint8Array): RoiPixels {
  const { width: W, height: H } = image;
  let x0 = 0,
    y0 = 0,
    x1 = W,
    y1 = H;
  if (roi?.kind === "rect") {
    x0 = Math.max(0, Math.floor(roi.x));
    y0 = Math.max(0, Math.floor(roi.y));
    x1 = Math.min(W, Math.floor(roi.x + roi.width));
    y1 = Math.min(H, Math.floor(roi.y + roi.height));
  } else if (roi?.kind === "polygon") {
    if (roi.points.length < 3) throw new ReadoutError("zero_area_roi", MESSAGES.zeroAreaRoi, "roi");
    x0 = Math.max(0, Math.floor(Math.min(...roi.points.map((p) => p[0]))));
    y0 = Math.max(0, Math.floor(Math.min(...roi.points.map((p) => p[1]))));
    x1 = Math.min(W, Math.ceil(Math.max(...roi.points.map((p) => p[0]))));
    y1 = Math.min(H, Math.ceil(Math.max(...roi.points.map((p) => p[1]))));
  }
  const width = x1 - x0;
  const height = y1 - y0;
  if (!(width > 0 && height > 0)) throw new ReadoutError("zero_area_roi", MESSAGES.zeroAreaRoi, "roi");
  const { data, stats } = copyWithStats(image, x0, y0, width, height);
  if (roi?.kind !== "polygon" && !excludeMask)
    return { x0, y0, width, height, data, included: null, includedCount: width * height, stats };
  const included = new Uint8Array(width * height);
  let includedCount = 0;
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const inPoly = roi?.kind !== "polygon" || insidePolygon(x + x0 + 0.5, y + y0 + 0.5, roi.points);
      const masked = excludeMask ? excludeMask[(y + y0) * W + x + x0] !== 0 : false;
      if (inPoly && !masked) {
        included[y * width + x] = 1;
        includedCount++;
      }
    }
  }
  if (includedCount === 0) throw new ReadoutError("zero_area_roi", MESSAGES.zeroAreaRoi, "roi");
  return { x0, y0, width, height, data, included, includedCount, stats };
}
