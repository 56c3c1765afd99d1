"use client";
/** Snapshots of a run over time: a slider over the snapshot times and a species choice, showing one field image. */
import { useState } from "react";
import { FieldImage } from "./field-image";
import { formatSig } from "./spectrum-format";

export interface ScrubberSnapshot {
  timeS: number;
  step: number;
  range: { min: number; max: number }[];
}

export interface RunScrubberProps {
  snapshots: ScrubberSnapshot[];
  species: string[];
  /** Image URL of snapshot i, species s. */
  imageUrl: (i: number, s: number) => string | undefined;
  width: number;
  lengthUnit: string;
  /** Multiplies solver time into the shown time unit. */
  timeFactor: number;
  timeUnit: string;
  oneDimensional: boolean;
}

export function RunScrubber({
  snapshots,
  species,
  imageUrl,
  width,
  lengthUnit,
  timeFactor,
  timeUnit,
  oneDimensional,
}: RunScrubberProps) {
  const [i, setI] = useState(snapshots.length - 1);
  const [s, setS] = useState(0);
  const snap = snapshots[i];
  const url = snap ? imageUrl(i, s) : undefined;
  if (!snap) return <p className="text-sm text-ink-soft">No snapshots were kept.</p>;
  return (
    <div className="space-y-3" data-testid="snapshot-scrubber">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <input
          type="range"
          min={0}
          max={snapshots.length - 1}
          step={1}
          value={i}
          onChange={(e) => setI(Number(e.target.value))}
          className="w-64 accent-moss"
          aria-label="snapshot"
          data-testid="scrubber-slider"
        />
        <span className="num" data-testid="scrubber-time">
          t = {formatSig(snap.timeS * timeFactor, 4)} {timeUnit}
        </span>
        <span className="num text-xs text-ink-soft">
          step {snap.step} · snapshot {i + 1} of {snapshots.length}
        </span>
        {species.length > 1 && (
          <select
            className="rounded-md border border-rule bg-card px-2 py-1 text-sm"
            value={s}
            onChange={(e) => setS(Number(e.target.value))}
            aria-label="species"
          >
            {species.map((name, j) => (
              <option key={name} value={j}>
                {name}
              </option>
            ))}
          </select>
        )}
      </div>
      {url && (
        <FieldImage
          src={url}
          alt={`${species[s]} at t = ${formatSig(snap.timeS * timeFactor, 4)} ${timeUnit}`}
          width={width}
          unit={lengthUnit}
          min={snap.range[s].min}
          max={snap.range[s].max}
          species={species[s]}
          oneDimensional={oneDimensional}
          testId="snapshot-image"
        />
      )}
    </div>
  );
}
