/**
 * Settings of a new readout, checked before anything is queued: a request that cannot work
 * (zero-area ROI, no pixel size, a field for the other kind of file) is refused at once with
 * 400/422 instead of becoming a failed job.
 */
import "server-only";
import {
  imageReadoutSettingsSchema,
  tableReadoutSettingsSchema,
  type ImageReadoutSettings,
  type RoiInput,
  type TableReadoutSettings,
} from "@/lib/contracts/readout";
import { READOUT_MESSAGES } from "@/lib/readout";
import { AppError } from "../errors";

export type StoredImageSettings = ImageReadoutSettings & {
  kind: "image";
  pixelSizeUm: number;
  pixelSizeSource: string | null;
};
export type StoredTableSettings = TableReadoutSettings & {
  kind: "table";
  pixelSizeUm: number | null;
  pixelSizeSource: string | null;
};
export type StoredReadoutSettings = StoredImageSettings | StoredTableSettings;

/** Shoelace area of a polygon (px²). */
function polygonArea(points: Array<[number, number]>): number {
  let a = 0;
  for (let i = 0, j = points.length - 1; i < points.length; j = i++)
    a += (points[j][0] + points[i][0]) * (points[j][1] - points[i][1]);
  return Math.abs(a) / 2;
}

function checkRoiArea(roi: RoiInput | null): void {
  if (!roi) return;
  const empty =
    roi.kind === "rect" ? !(roi.width > 0 && roi.height > 0) : roi.points.length < 3 || !(polygonArea(roi.points) > 0);
  if (empty) throw new AppError("unprocessable", READOUT_MESSAGES.zeroAreaRoi, { field: "roi" });
}

export function resolveStartSettings(
  upload: { kind: string; pixelSizeUm: number | null; pixelSizeSource: string | null },
  body: unknown,
): StoredReadoutSettings {
  const input = body ?? {};
  if (upload.kind === "image") {
    const parsed = imageReadoutSettingsSchema.safeParse(input);
    if (!parsed.success) throw parsed.error;
    const s = parsed.data;
    checkRoiArea(s.roi);
    const pixelSizeUm = s.pixelSizeUm ?? upload.pixelSizeUm;
    if (pixelSizeUm === null || pixelSizeUm === undefined)
      throw new AppError("unprocessable", READOUT_MESSAGES.missingPixelSize, { field: "pixelSizeUm" });
    return {
      kind: "image",
      ...s,
      pixelSizeUm,
      pixelSizeSource: s.pixelSizeUm ? "readout settings" : upload.pixelSizeSource,
    };
  }
  const parsed = tableReadoutSettingsSchema.safeParse(input);
  if (!parsed.success) throw parsed.error;
  const s = parsed.data;
  const c = s.columns ?? {};
  if ((c.x === undefined) !== (c.y === undefined))
    throw new AppError("bad_input", "columns: 2-D centroids need both an x and a y column");
  const pixelSizeUm = s.pixelSizeUm ?? upload.pixelSizeUm;
  if (s.unit === "px" && !pixelSizeUm)
    throw new AppError(
      "unprocessable",
      'The table is in pixels (unit "px") but no pixel size is known: give the pixel size in µm/px.',
      { field: "pixelSizeUm" },
    );
  return {
    kind: "table",
    ...s,
    pixelSizeUm: pixelSizeUm ?? null,
    pixelSizeSource: s.pixelSizeUm ? "readout settings" : upload.pixelSizeSource,
  };
}
