"use client";
/**
 * One simulated field as a colour image (paper → green → ink, min–max scaled), with a scale bar
 * in the domain's length unit and a colour bar giving the field's range.
 */
import { formatSig } from "./spectrum-format";

/** The colour map of the stored images (lib/server/runs/images.ts). */
export const FIELD_GRADIENT = "linear-gradient(to right, #f6f1e6 0%, #dcebe2 35%, #1f5c45 70%, #22201b 100%)";

/** A round length (1, 2 or 5 × 10ⁿ) near a quarter of the width, for the scale bar. */
export function scaleBarLength(width: number): number {
  const target = width / 4;
  const p = 10 ** Math.floor(Math.log10(target));
  return [5, 2, 1].map((m) => m * p).find((v) => v <= target) ?? p;
}

export interface FieldImageProps {
  src: string;
  alt: string;
  /** Domain width in `unit`. */
  width: number;
  unit: string;
  min: number;
  max: number;
  species: string;
  oneDimensional?: boolean;
  testId?: string;
}

export function FieldImage({
  src,
  alt,
  width,
  unit,
  min,
  max,
  species,
  oneDimensional = false,
  testId = "field-image",
}: FieldImageProps) {
  const bar = scaleBarLength(width);
  return (
    <figure className="w-full max-w-md" data-testid={testId}>
      <div className="relative">
        {/* eslint-disable-next-line @next/next/no-img-element -- a stored PNG served by the API */}
        <img
          src={src}
          alt={alt}
          className={`block w-full rounded border border-rule ${oneDimensional ? "h-12" : "h-auto"}`}
          style={{ imageRendering: "pixelated" }}
        />
        <div className="absolute bottom-2 left-2 rounded bg-card/85 px-1.5 py-0.5" data-testid="scale-bar">
          <div className="h-1 bg-ink" style={{ width: `${(bar / width) * 100}%`, minWidth: 8 }} />
          <span className="num text-[11px] text-ink">
            {formatSig(bar, 3)} {unit}
          </span>
        </div>
      </div>
      <figcaption className="mt-1 flex items-center gap-2 text-xs text-ink-soft">
        <span className="num">{species}</span>
        <span className="num">{formatSig(min, 4)}</span>
        <span
          className="inline-block h-2.5 w-28 rounded-sm border border-rule"
          style={{ background: FIELD_GRADIENT }}
        />
        <span className="num">{formatSig(max, 4)}</span>
        <span>(concentration, min–max of this image)</span>
      </figcaption>
    </figure>
  );
}
