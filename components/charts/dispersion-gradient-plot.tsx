"use client";
/** Local predicted wavelength along a parameter gradient, with the stretches where patterning is expected shaded. */
import { CartesianGrid, Line, LineChart, ReferenceArea, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { formatNumber } from "./dispersion-format";

export interface GradientPlotProps {
  points: { x: number; wavelength: number | null }[];
  regions: { from: number; to: number }[];
  positionUnit: string;
  wavelengthUnit: string;
}

export function DispersionGradientPlot({ points, regions, positionUnit, wavelengthUnit }: GradientPlotProps) {
  return (
    <div data-testid="gradient-plot">
      <ResponsiveContainer width="100%" height={260}>
        <LineChart data={points} margin={{ top: 8, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          {regions.map((r, i) => (
            <ReferenceArea key={i} x1={r.from} x2={r.to} fill="#e9e1f4" fillOpacity={0.8} ifOverflow="hidden" />
          ))}
          <XAxis
            dataKey="x"
            type="number"
            domain={["dataMin", "dataMax"]}
            tickFormatter={(v: number) => formatNumber(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: `position x (${positionUnit})`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis
            tickFormatter={(v: number) => formatNumber(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={64}
            label={{
              value: `local λ* (${wavelengthUnit})`,
              angle: -90,
              position: "insideLeft",
              fill: "#5c574c",
              fontSize: 12,
              style: { textAnchor: "middle" },
            }}
          />
          <Tooltip
            formatter={(v) => `${formatNumber(Number(v))} ${wavelengthUnit}`}
            labelFormatter={(v) => `x = ${formatNumber(Number(v))} ${positionUnit}`}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
          <Line
            dataKey="wavelength"
            type="monotone"
            dot={false}
            stroke="#5b3c8f"
            strokeWidth={2}
            connectNulls={false}
            isAnimationActive={false}
          />
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
