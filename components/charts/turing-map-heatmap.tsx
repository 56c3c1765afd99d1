"use client";
/**
 * Turing-space map as a heat map: one cell per parameter pair, coloured by its exclusive class;
 * Turing cells shaded by predicted wavelength (light = short, dark = long); cells matching the
 * target wavelength outlined, and the target contour drawn. Plain arrays in, row-major iy·nx + ix.
 */
import { useEffect, useRef } from "react";
import { classOf, MAP_CLASSES } from "@/lib/stability/classes";
import { formatNumber } from "./dispersion-format";
import { cellFill, MAP_CLASS_COLOUR, turingShade } from "./map-classes";

export interface TuringMapHeatmapProps {
  nx: number;
  ny: number;
  x: { name: string; scale: "linear" | "log"; values: number[] };
  y: { name: string; scale: "linear" | "log"; values: number[] };
  classes: number[];
  /** Wavelength per cell in display units (null where none). */
  wavelength: (number | null)[];
  wavelengthUnit: string;
  counts: Record<string, number>;
  match: number[] | null;
  /** Target contour segments in parameter values. */
  contour: [number, number, number, number][] | null;
}

/** Parameter value → fractional cell-centre coordinate. */
function toIndex(axis: { scale: "linear" | "log"; values: number[] }, v: number): number {
  const n = axis.values.length,
    a = axis.values[0],
    b = axis.values[n - 1];
  const t = axis.scale === "log" ? Math.log(v / a) / Math.log(b / a) : (v - a) / (b - a);
  return t * (n - 1) + 0.5;
}

export function TuringMapHeatmap(p: TuringMapHeatmapProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const lambdas = p.wavelength.filter((v, i): v is number => v !== null && classOf(p.classes[i]) === "turing");
  const lo = lambdas.length ? Math.min(...lambdas) : 0,
    hi = lambdas.length ? Math.max(...lambdas) : 1;
  useEffect(() => {
    const ctx = canvas.current?.getContext("2d");
    if (!ctx) return;
    for (let iy = 0; iy < p.ny; iy++) {
      for (let ix = 0; ix < p.nx; ix++) {
        const i = iy * p.nx + ix;
        ctx.fillStyle = cellFill(p.classes[i], p.wavelength[i], lo, hi);
        ctx.fillRect(ix, p.ny - 1 - iy, 1, 1);
      }
    }
  }, [p.nx, p.ny, p.classes, p.wavelength, lo, hi]);
  const W = 420,
    H = 420,
    pad = { l: 64, b: 44, t: 8, r: 8 };
  const ticks = (axis: { values: number[] }) => [0, Math.floor((axis.values.length - 1) / 2), axis.values.length - 1];
  const sx = (ix: number) => pad.l + (ix / p.nx) * W,
    sy = (iy: number) => pad.t + H - (iy / p.ny) * H;
  return (
    <div data-testid="turing-map" className="space-y-2">
      <div className="relative" style={{ width: W + pad.l + pad.r, height: H + pad.t + pad.b }}>
        <canvas
          ref={canvas}
          width={p.nx}
          height={p.ny}
          style={{ position: "absolute", left: pad.l, top: pad.t, width: W, height: H, imageRendering: "pixelated" }}
          className="border border-rule"
        />
        <svg
          width={W + pad.l + pad.r}
          height={H + pad.t + pad.b}
          className="absolute left-0 top-0"
          aria-label={`Turing-space map of ${p.y.name} against ${p.x.name}`}
        >
          {p.match &&
            p.match.map((m, i) =>
              m ? (
                <rect
                  key={i}
                  x={sx(i % p.nx)}
                  y={sy(Math.floor(i / p.nx) + 1)}
                  width={W / p.nx}
                  height={H / p.ny}
                  fill="none"
                  stroke="#1f5c45"
                  strokeWidth={0.8}
                />
              ) : null,
            )}
          {p.contour?.map(([x1, y1, x2, y2], i) => (
            <line
              key={i}
              x1={sx(toIndex(p.x, x1))}
              y1={sy(toIndex(p.y, y1))}
              x2={sx(toIndex(p.x, x2))}
              y2={sy(toIndex(p.y, y2))}
              stroke="#15422f"
              strokeWidth={2}
            />
          ))}
          {ticks(p.x).map((i) => (
            <text
              key={`x${i}`}
              x={sx(i + 0.5)}
              y={pad.t + H + 16}
              textAnchor="middle"
              fontSize={11}
              fontFamily="IBM Plex Mono"
              fill="#22201b"
            >
              {formatNumber(p.x.values[i], 3)}
            </text>
          ))}
          {ticks(p.y).map((i) => (
            <text
              key={`y${i}`}
              x={pad.l - 6}
              y={sy(i + 0.5) + 4}
              textAnchor="end"
              fontSize={11}
              fontFamily="IBM Plex Mono"
              fill="#22201b"
            >
              {formatNumber(p.y.values[i], 3)}
            </text>
          ))}
          <text x={pad.l + W / 2} y={pad.t + H + 36} textAnchor="middle" fontSize={12} fill="#5c574c">
            {p.x.name} ({p.x.scale}, model units)
          </text>
          <text
            transform={`translate(14 ${pad.t + H / 2}) rotate(-90)`}
            textAnchor="middle"
            fontSize={12}
            fill="#5c574c"
          >
            {p.y.name} ({p.y.scale}, model units)
          </text>
        </svg>
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span className="inline-flex items-center gap-1">
          <span
            className="inline-block h-3 w-16"
            style={{ background: `linear-gradient(to right, ${turingShade(0)}, ${turingShade(1)})` }}
          />
          {lambdas.length ? (
            <>
              Turing: λ* <span className="num">{formatNumber(lo)}</span>–
              <span className="num">
                {formatNumber(hi)} {p.wavelengthUnit}
              </span>{" "}
              (<span className="num">{p.counts.turing ?? 0}</span> cells)
            </>
          ) : (
            "Turing: no cell in this box"
          )}
        </span>
        {MAP_CLASSES.filter((c) => c.name !== "turing" && (p.counts[c.name] ?? 0) > 0).map((c) => (
          <span key={c.name} className="inline-flex items-center gap-1" data-testid={`map-class-${c.name}`}>
            <span
              className="inline-block h-3 w-3 border border-rule"
              style={{ background: MAP_CLASS_COLOUR[c.name as Exclude<typeof c.name, "turing">] }}
            />
            {c.label} (<span className="num">{p.counts[c.name]}</span>)
          </span>
        ))}
        {p.match && (
          <span className="inline-flex items-center gap-1">
            <span className="inline-block h-3 w-3 border-2 border-moss" /> target wavelength ± tolerance
          </span>
        )}
      </div>
    </div>
  );
}
