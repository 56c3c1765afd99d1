"use client";
/**
 * Turing-space map as a heat map: one cell per parameter pair, coloured by instability class;
 * Turing cells shaded by predicted wavelength (light = short, dark = long); cells matching the
 * target wavelength outlined, and the target contour drawn. Plain arrays in, row-major iy·nx + ix.
 */
import { useEffect, useRef } from "react";
import { formatNumber } from "./dispersion-format";

export interface TuringMapHeatmapProps {
  nx: number;
  ny: number;
  x: { name: string; scale: "linear" | "log"; values: number[] };
  y: { name: string; scale: "linear" | "log"; values: number[] };
  classes: number[];
  /** Wavelength per cell in display units (null where none). */
  wavelength: (number | null)[];
  wavelengthUnit: string;
  legend: Record<string, number>;
  counts: Record<string, number>;
  match: number[] | null;
  /** Target contour segments in parameter values. */
  contour: [number, number, number, number][] | null;
}

/** Class colours: Turing is the model-prediction violet; the rest calm paper tones, brick for unstable at k = 0. */
const CLASS_COLOUR: Record<string, string> = {
  stable: "#ece4d3", hopf: "#c8d5e6", wave: "#b9dcd0", "unstable-k0": "#f6dcd6", "no-steady-state": "#9e978a", invalid: "#ffffff",
};
const CLASS_LABEL: Record<string, string> = {
  stable: "stable", turing: "Turing", hopf: "Hopf (k = 0)", wave: "wave (k > 0)", "unstable-k0": "unstable at k = 0", "no-steady-state": "no steady state", invalid: "invalid",
};

function turingShade(t: number): string {
  // violet ramp from #e9e1f4 (short λ) to #3d2466 (long λ)
  const a = [233, 225, 244], b = [61, 36, 102];
  const c = a.map((v, i) => Math.round(v + (b[i] - v) * t));
  return `rgb(${c[0]},${c[1]},${c[2]})`;
}

function cellColour(flags: number, legend: Record<string, number>): string {
  if (flags & legend["no-steady-state"]) return CLASS_COLOUR["no-steady-state"];
  if (flags & legend.invalid) return CLASS_COLOUR.invalid;
  if (flags & legend["unstable-k0"]) return CLASS_COLOUR["unstable-k0"];
  if (flags & legend.hopf) return CLASS_COLOUR.hopf;
  if (flags & legend.wave) return CLASS_COLOUR.wave;
  return CLASS_COLOUR.stable;
}

/** Parameter value → fractional cell-centre coordinate. */
function toIndex(axis: { scale: "linear" | "log"; values: number[] }, v: number): number {
  const n = axis.values.length, a = axis.values[0], b = axis.values[n - 1];
  const t = axis.scale === "log" ? Math.log(v / a) / Math.log(b / a) : (v - a) / (b - a);
  return t * (n - 1) + 0.5;
}

export function TuringMapHeatmap(p: TuringMapHeatmapProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const lambdas = p.wavelength.filter((v, i): v is number => v !== null && (p.classes[i] & p.legend.turing) !== 0);
  const lo = lambdas.length ? Math.min(...lambdas) : 0, hi = lambdas.length ? Math.max(...lambdas) : 1;
  useEffect(() => {
    const ctx = canvas.current?.getContext("2d");
    if (!ctx) return;
    for (let iy = 0; iy < p.ny; iy++) {
      for (let ix = 0; ix < p.nx; ix++) {
        const i = iy * p.nx + ix, f = p.classes[i], l = p.wavelength[i];
        const turing = (f & p.legend.turing) !== 0 && (f & (p.legend["no-steady-state"] | p.legend.invalid)) === 0;
        ctx.fillStyle = turing && l !== null ? turingShade(hi > lo ? (l - lo) / (hi - lo) : 0.5) : cellColour(f, p.legend);
        ctx.fillRect(ix, p.ny - 1 - iy, 1, 1);
      }
    }
  }, [p.nx, p.ny, p.classes, p.wavelength, p.legend, lo, hi]);
  const W = 420, H = 420, pad = { l: 64, b: 44, t: 8, r: 8 };
  const ticks = (axis: { values: number[] }) => [0, Math.floor((axis.values.length - 1) / 2), axis.values.length - 1];
  const sx = (ix: number) => pad.l + (ix / p.nx) * W, sy = (iy: number) => pad.t + H - (iy / p.ny) * H;
  return (
    <div data-testid="turing-map" className="space-y-2">
      <div className="relative" style={{ width: W + pad.l + pad.r, height: H + pad.t + pad.b }}>
        <canvas ref={canvas} width={p.nx} height={p.ny} style={{ position: "absolute", left: pad.l, top: pad.t, width: W, height: H, imageRendering: "pixelated" }} className="border border-rule" />
        <svg width={W + pad.l + pad.r} height={H + pad.t + pad.b} className="absolute left-0 top-0" aria-label={`Turing-space map of ${p.y.name} against ${p.x.name}`}>
          {p.match && p.match.map((m, i) => m ? <rect key={i} x={sx(i % p.nx)} y={sy(Math.floor(i / p.nx) + 1)} width={W / p.nx} height={H / p.ny} fill="none" stroke="#1f5c45" strokeWidth={0.8} /> : null)}
          {p.contour?.map(([x1, y1, x2, y2], i) => (
            <line key={i} x1={sx(toIndex(p.x, x1))} y1={sy(toIndex(p.y, y1))} x2={sx(toIndex(p.x, x2))} y2={sy(toIndex(p.y, y2))} stroke="#15422f" strokeWidth={2} />
          ))}
          {ticks(p.x).map((i) => (
            <text key={`x${i}`} x={sx(i + 0.5)} y={pad.t + H + 16} textAnchor="middle" fontSize={11} fontFamily="IBM Plex Mono" fill="#22201b">{formatNumber(p.x.values[i], 3)}</text>
          ))}
          {ticks(p.y).map((i) => (
            <text key={`y${i}`} x={pad.l - 6} y={sy(i + 0.5) + 4} textAnchor="end" fontSize={11} fontFamily="IBM Plex Mono" fill="#22201b">{formatNumber(p.y.values[i], 3)}</text>
          ))}
          <text x={pad.l + W / 2} y={pad.t + H + 36} textAnchor="middle" fontSize={12} fill="#5c574c">{p.x.name} ({p.x.scale}, model units)</text>
          <text transform={`translate(14 ${pad.t + H / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill="#5c574c">{p.y.name} ({p.y.scale}, model units)</text>
        </svg>
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span className="inline-flex items-center gap-1">
          <span className="inline-block h-3 w-16" style={{ background: `linear-gradient(to right, ${turingShade(0)}, ${turingShade(1)})` }} />
          {lambdas.length ? <>Turing: λ* <span className="num">{formatNumber(lo)}</span>–<span className="num">{formatNumber(hi)} {p.wavelengthUnit}</span> (<span className="num">{p.counts.turing ?? 0}</span> cells)</> : "Turing: no cell in this box"}
        </span>
        {Object.keys(CLASS_COLOUR).filter((c) => (p.counts[c] ?? 0) > 0).map((c) => (
          <span key={c} className="inline-flex items-center gap-1">
            <span className="inline-block h-3 w-3 border border-rule" style={{ background: CLASS_COLOUR[c] }} />
            {CLASS_LABEL[c]} (<span className="num">{p.counts[c]}</span>)
          </span>
        ))}
        {p.match && <span className="inline-flex items-center gap-1"><span className="inline-block h-3 w-3 border-2 border-moss" /> target wavelength ± tolerance</span>}
      </div>
    </div>
  );
}
