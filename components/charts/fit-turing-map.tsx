"use client";
/**
 * Turing-space map around a fit, all SVG (so it exports as a figure): Turing cells in violet
 * shaded by predicted wavelength, other classes in paper tones, the contour where the predicted
 * wavelength equals the measured one in green, and the fitted point marked.
 */
import { classOf, MAP_CLASSES } from "@/lib/stability/classes";
import { formatNumber } from "./dispersion-format";
import { cellFill, MAP_CLASS_COLOUR, turingShade as shade } from "./map-classes";

export interface FitTuringMapProps {
  nx: number;
  ny: number;
  x: { name: string; scale: "linear" | "log"; values: number[] };
  y: { name: string; scale: "linear" | "log"; values: number[] };
  classes: number[];
  /** Wavelength per cell, µm (null where none). */
  wavelengthUm: (number | null)[];
  contour: [number, number, number, number][] | null;
  point: { x: number; y: number };
  measuredUm: number;
}

const W = 380,
  H = 380,
  pad = { l: 64, b: 44, t: 8, r: 12 };

function frac(axis: FitTuringMapProps["x"], v: number): number {
  const a = axis.values[0],
    b = axis.values[axis.values.length - 1];
  return axis.scale === "log" ? Math.log(v / a) / Math.log(b / a) : (v - a) / (b - a);
}

export function FitTuringMap(p: FitTuringMapProps) {
  const turing = (i: number) => classOf(p.classes[i]) === "turing";
  const present = new Set(p.classes.map(classOf));
  const ls = p.wavelengthUm.filter((v, i): v is number => v !== null && turing(i));
  const lo = ls.length ? Math.min(...ls) : 0,
    hi = ls.length ? Math.max(...ls) : 1;
  const cw = W / p.nx,
    ch = H / p.ny;
  // Cell centres sit at fractions (i)/(n−1) of the axis range; the plot spans half a cell beyond.
  const sx = (v: number) => pad.l + (frac(p.x, v) * (p.nx - 1) + 0.5) * cw;
  const sy = (v: number) => pad.t + H - (frac(p.y, v) * (p.ny - 1) + 0.5) * ch;
  const ticks = (n: number) => [0, Math.floor((n - 1) / 2), n - 1];
  return (
    <div data-testid="fit-turing-map" className="space-y-2">
      <svg
        width={W + pad.l + pad.r}
        height={H + pad.t + pad.b}
        role="img"
        aria-label={`Turing-space map of ${p.y.name} against ${p.x.name} around the fit`}
      >
        {p.classes.map((f, i) => {
          const ix = i % p.nx,
            iy = Math.floor(i / p.nx);
          const fill = cellFill(f, p.wavelengthUm[i], lo, hi);
          return (
            <rect
              key={i}
              x={pad.l + ix * cw}
              y={pad.t + H - (iy + 1) * ch}
              width={cw + 0.3}
              height={ch + 0.3}
              fill={fill}
            />
          );
        })}
        <rect x={pad.l} y={pad.t} width={W} height={H} fill="none" stroke="#d9cfbb" />
        {p.contour?.map(([x1, y1, x2, y2], i) => (
          <line key={i} x1={sx(x1)} y1={sy(y1)} x2={sx(x2)} y2={sy(y2)} stroke="#1f5c45" strokeWidth={2.2} />
        ))}
        <g data-testid="fitted-point">
          <circle cx={sx(p.point.x)} cy={sy(p.point.y)} r={6} fill="#fbf8f1" stroke="#22201b" strokeWidth={2} />
          <circle cx={sx(p.point.x)} cy={sy(p.point.y)} r={2.5} fill="#5b3c8f" />
        </g>
        {ticks(p.nx).map((i) => (
          <text
            key={`x${i}`}
            x={sx(p.x.values[i])}
            y={pad.t + H + 16}
            textAnchor="middle"
            fontSize={11}
            fontFamily="IBM Plex Mono"
            fill="#22201b"
          >
            {formatNumber(p.x.values[i], 3)}
          </text>
        ))}
        {ticks(p.ny).map((i) => (
          <text
            key={`y${i}`}
            x={pad.l - 6}
            y={sy(p.y.values[i]) + 4}
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
        <text transform={`translate(14 ${pad.t + H / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill="#5c574c">
          {p.y.name} ({p.y.scale}, model units)
        </text>
      </svg>
      <div className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span className="inline-flex items-center gap-1">
          <span
            className="inline-block h-3 w-16"
            style={{ background: `linear-gradient(to right, ${shade(0)}, ${shade(1)})` }}
          />
          {ls.length ? (
            <>
              Turing: λ*{" "}
              <span className="num">
                {formatNumber(lo)}–{formatNumber(hi)} µm
              </span>
            </>
          ) : (
            "no Turing cell in this box"
          )}
        </span>
        <span className="inline-flex items-center gap-1">
          <span className="inline-block h-0.5 w-5 bg-moss" /> predicted = measured (
          <span className="num">{formatNumber(p.measuredUm)} µm</span>)
        </span>
        <span className="inline-flex items-center gap-1">
          <span className="inline-block h-3 w-3 rounded-full border-2 border-ink" /> fitted point
        </span>
        {MAP_CLASSES.filter((c) => c.name !== "turing" && present.has(c.name)).map((c) => (
          <span key={c.name} className="inline-flex items-center gap-1">
            <span
              className="inline-block h-3 w-3 border border-rule"
              style={{ background: MAP_CLASS_COLOUR[c.name as Exclude<typeof c.name, "turing">] }}
            />{" "}
            {c.label}
          </span>
        ))}
      </div>
    </div>
  );
}
