"use client";
import type { ImageLayout } from "@/lib/imaging/read-image-layout";
import type { ReadoutDetailDto } from "@/lib/server/readouts/readouts";

/** What a readout reads of a stack (0-based, as the API takes it; the form counts from 1). */
export interface StackChoiceInput {
  plane: number;
  timePoint: number;
  projection: "none" | "max-z";
}

const selectClass = "rounded-md border border-rule bg-card px-2 py-1.5 text-sm";

/** The stack choice a new readout starts from: this readout's own. */
export function initialStackChoice(readout: ReadoutDetailDto): StackChoiceInput {
  const s = readout.settings.kind === "image" ? readout.settings : null;
  return { plane: s?.plane ?? 0, timePoint: s?.timePoint ?? 0, projection: s?.projection ?? "none" };
}

/** The file's planes and time points: from the upload's headers, else from a finished readout. */
export function stackSizesOf(readout: ReadoutDetailDto): { planes: number; timePoints: number } {
  const layout: Pick<ImageLayout, "planes" | "timePoints"> | null = readout.imageLayout ?? null;
  const image = readout.result?.type === "image" ? readout.result.image : null;
  return { planes: layout?.planes ?? image?.planes ?? 1, timePoints: layout?.timePoints ?? image?.timePoints ?? 1 };
}

/**
 * Plane (z) and time point of a multi-page TIFF or OME-TIFF, or the maximum over z; shown only
 * when the file has more than one plane or time point.
 */
export function StackFields({
  readout,
  value,
  onChange,
}: {
  readout: ReadoutDetailDto;
  value: StackChoiceInput;
  onChange: (v: StackChoiceInput) => void;
}) {
  const { planes, timePoints } = stackSizesOf(readout);
  if (planes <= 1 && timePoints <= 1) return null;
  const planeValue = value.projection === "max-z" ? "max-z" : String(value.plane);
  return (
    <div className="flex flex-wrap items-end gap-4" data-testid="stack-fields">
      {planes > 1 && (
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Plane (z)</span>
          <select
            className={selectClass}
            value={planeValue}
            data-testid="rerun-plane"
            onChange={(e) =>
              onChange(
                e.target.value === "max-z"
                  ? { ...value, projection: "max-z" }
                  : { ...value, projection: "none", plane: Number(e.target.value) },
              )
            }
          >
            {Array.from({ length: planes }, (_, z) => (
              <option key={z} value={String(z)}>
                plane {z + 1} of {planes}
              </option>
            ))}
            <option value="max-z">maximum over all {planes} planes</option>
          </select>
        </label>
      )}
      {timePoints > 1 && (
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Time point</span>
          <select
            className={selectClass}
            value={String(value.timePoint)}
            data-testid="rerun-time-point"
            onChange={(e) => onChange({ ...value, timePoint: Number(e.target.value) })}
          >
            {Array.from({ length: timePoints }, (_, t) => (
              <option key={t} value={String(t)}>
                time point {t + 1} of {timePoints}
              </option>
            ))}
          </select>
        </label>
      )}
    </div>
  );
}

/** Which page of a stack a readout read, in words (counted from 1), or "" for a single plane. */
export function describeStackUsed(image: {
  planes?: number;
  timePoints?: number;
  planeUsed?: number | null;
  timePointUsed?: number;
  projection?: "none" | "max-z";
  reduceFactor?: number;
}): string {
  const parts: string[] = [];
  if ((image.planes ?? 1) > 1)
    parts.push(
      image.projection === "max-z"
        ? `maximum over ${image.planes} planes`
        : `plane ${(image.planeUsed ?? 0) + 1} of ${image.planes}`,
    );
  if ((image.timePoints ?? 1) > 1) parts.push(`time point ${(image.timePointUsed ?? 0) + 1} of ${image.timePoints}`);
  if ((image.reduceFactor ?? 1) > 1) parts.push(`read reduced ${image.reduceFactor}×`);
  return parts.length ? `, ${parts.join(", ")}` : "";
}
