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
import { checkStackChoice, ImagingError, pageOf, type ImageLayout } from "@/lib/imaging";
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

/**
 * The channel, plane and time point against the file's headers (recorded at upload), so a choice
 * the file does not have is a 422 naming it as a person counts, not a failed job. Uploads made
 * before the layout was recorded are checked by the readout itself.
 */
function checkStackFields(layout: ImageLayout | null | undefined, s: ImageReadoutSettings): void {
  if (!layout) return;
  if (layout.problem) throw new AppError("unprocessable", layout.problem, { field: "file" });
  try {
    checkStackChoice(layout, s, true);
    const channel = layout.channelsIn === "pages" && s.channel !== "luminance" ? s.channel : 0;
    const zs = s.projection === "max-z" ? Array.from({ length: layout.planes }, (_, z) => z) : [s.plane];
    for (const z of zs) {
      const page = pageOf(layout, channel, z, s.timePoint) + 1;
      const damaged = layout.damagedPages.find((d) => d.page === page);
      if (damaged)
        throw new AppError("unprocessable", damaged.reason, {
          field: s.projection === "max-z" ? "projection" : "plane",
        });
    }
  } catch (e) {
    if (e instanceof ImagingError) throw new AppError("unprocessable", e.message, { field: e.field ?? "channel" });
    throw e;
  }
}

export function resolveStartSettings(
  upload: {
    kind: string;
    pixelSizeUm: number | null;
    pixelSizeSource: string | null;
    imageLayout?: ImageLayout | null;
  },
  body: unknown,
): StoredReadoutSettings {
  const input = body ?? {};
  if (upload.kind === "image") {
    const parsed = imageReadoutSettingsSchema.safeParse(input);
    if (!parsed.success) throw parsed.error;
    const s = parsed.data;
    checkRoiArea(s.roi);
    checkStackFields(upload.imageLayout, s);
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
