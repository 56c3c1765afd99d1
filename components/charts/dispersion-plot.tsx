"use client";
/**
 * The dispersion relation: Re and Im of the leading growth rate σ(k), unstable bands shaded amber,
 * admissible modes of a bounded domain as dots, k* marked with 2π/k*. Inputs are plain arrays in
 * model units; `units` converts them for display (k/ℓ, σ/τ).
 */
import {
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatNumber, type AxisUnits } from "./dispersion-format";

export interface DispersionPlotProps {
  k: number[];
  sigma: number[];
  imSigma: number[];
  bands: { kLow: number; kHigh: number }[];
  kStar: number | null;
  modes: { k: number; sigma: number }[] | null;
  units: AxisUnits & { kFactor: number; sigmaFactor: number; lengthFactor: number };
  height?: number;
}

export function DispersionPlot({ k, sigma, imSigma, bands, kStar, modes, units, height = 320 }: DispersionPlotProps) {
  const { kFactor: kf, sigmaFactor: sf, lengthFactor: lf } = units;
  const data = k.map((kk, i) => ({ k: kk * kf, re: sigma[i] * sf, im: imSigma[i] * sf }));
  const kMax = k.length ? k[k.length - 1] * kf : 1;
  const points = (modes ?? []).filter((m) => m.k * kf <= kMax).map((m) => ({ k: m.k * kf, mode: m.sigma * sf }));
  const hasIm = imSigma.some((v) => Math.abs(v) > 1e-12);
  return (
    <div data-testid="dispersion-plot">
      <ResponsiveContainer width="100%" height={height}>
        <ComposedChart data={data} margin={{ top: 24, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <XAxis
            dataKey="k"
            type="number"
            domain={[0, kMax]}
            tickFormatter={(v: number) => formatNumber(v, 3)}
            label={{
              value: `wavenumber k (${units.k})`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
          />
          <YAxis
            type="number"
            tickFormatter={(v: number) => formatNumber(v, 3)}
            label={{
              value: `growth rate σ (${units.sigma})`,
              angle: -90,
              position: "insideLeft",
              offset: 0,
              fill: "#5c574c",
              fontSize: 12,
              style: { textAnchor: "middle" },
            }}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={64}
          />
          {bands.map((b, i) => (
            <ReferenceArea
              key={i}
              x1={b.kLow * kf}
              x2={b.kHigh * kf}
              fill="#f8e9cc"
              fillOpacity={0.9}
              stroke="#a8650a"
              strokeOpacity={0.4}
              ifOverflow="hidden"
            />
          ))}
          <ReferenceLine y={0} stroke="#22201b" strokeOpacity={0.5} />
          {kStar !== null && (
            <ReferenceLine
              x={kStar * kf}
              stroke="#5b3c8f"
              strokeDasharray="4 3"
              label={{ value: "k*", position: "top", fill: "#5b3c8f", fontSize: 12 }}
            />
          )}
          <Line
            dataKey="re"
            name={`Re σ (${units.sigma})`}
            type="monotone"
            dot={false}
            stroke="#5b3c8f"
            strokeWidth={2}
            isAnimationActive={false}
          />
          {hasIm && (
            <Line
              dataKey="im"
              name={`Im σ (${units.sigma})`}
              type="monotone"
              dot={false}
              stroke="#5b3c8f"
              strokeOpacity={0.5}
              strokeDasharray="5 4"
              isAnimationActive={false}
            />
          )}
          {points.length > 0 && (
            <Scatter
              data={points}
              dataKey="mode"
              name={`admissible mode σ (${units.sigma})`}
              fill="#1f5c45"
              shape={(d: { cx?: number; cy?: number }) => (
                <circle cx={d.cx} cy={d.cy} r={points.length > 60 ? 1.6 : 3} fill="#1f5c45" fillOpacity={0.8} />
              )}
              isAnimationActive={false}
            />
          )}
          <Tooltip
            formatter={(v) => formatNumber(Number(v))}
            labelFormatter={(v) => `k = ${formatNumber(Number(v))} ${units.k}`}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
        </ComposedChart>
      </ResponsiveContainer>
      {kStar !== null && (
        <p className="num text-xs text-iris" data-testid="k-star-label">
          k* = {formatNumber(kStar * kf)} {units.k} · 2π/k* = {formatNumber(((2 * Math.PI) / kStar) * lf)}{" "}
          {units.length}
        </p>
      )}
      <p className="mt-1 text-xs text-ink-soft">
        <span className="inline-block h-2 w-4 align-middle" style={{ background: "#5b3c8f" }} /> Re σ
        {hasIm && <> · dashed: Im σ</>} ·{" "}
        <span className="inline-block h-2 w-4 align-middle bg-ochre-soft border border-ochre/40" /> unstable band (σ
        &gt; 0)
        {points.length > 0 && (
          <>
            {" "}
            · <span className="inline-block h-2 w-2 rounded-full align-middle bg-moss" /> admissible modes of the domain
          </>
        )}
      </p>
    </div>
  );
}
