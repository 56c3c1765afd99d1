"use client";
/**
 * The curve of equally good solutions of a non-identifiable fit: one parameter stepped, the
 * others re-optimised, Δχ² above the best fit; points under the 95 % threshold fit as well.
 */
import {
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceLine,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatNumber } from "./dispersion-format";

export function FitValley({
  parameter,
  points,
  threshold,
  other,
}: {
  parameter: string;
  points: { x: number; y: number | null; deltaChiSquare: number; within: boolean }[];
  threshold: number;
  other: string | null;
}) {
  const data = points.map((p) => ({ x: p.x, d: p.deltaChiSquare, y: p.y }));
  return (
    <div data-testid="valley-plot" className="grid gap-4 md:grid-cols-2">
      <ResponsiveContainer width="100%" height={240}>
        <ComposedChart data={data} margin={{ top: 8, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <XAxis
            dataKey="x"
            type="number"
            domain={["auto", "auto"]}
            tickFormatter={(v: number) => formatNumber(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: `${parameter} (stepped)`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis
            type="number"
            tickFormatter={(v: number) => formatNumber(v, 2)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={56}
            label={{
              value: "Δχ² (unit-free)",
              angle: -90,
              position: "insideLeft",
              fill: "#5c574c",
              fontSize: 12,
              style: { textAnchor: "middle" },
            }}
          />
          <ReferenceLine
            y={threshold}
            stroke="#a8650a"
            strokeDasharray="4 3"
            label={{
              value: `95 % (Δχ² = ${formatNumber(threshold, 3)})`,
              position: "insideTopRight",
              fill: "#a8650a",
              fontSize: 11,
            }}
          />
          <Tooltip
            formatter={(v) => formatNumber(Number(v))}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
          <Line dataKey="d" stroke="#5b3c8f" dot={{ r: 3 }} isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
      {other && (
        <ResponsiveContainer width="100%" height={240}>
          <ComposedChart margin={{ top: 8, right: 16, bottom: 28, left: 16 }}>
            <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
            <XAxis
              dataKey="x"
              type="number"
              domain={["auto", "auto"]}
              tickFormatter={(v: number) => formatNumber(v, 3)}
              tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
              label={{ value: parameter, position: "insideBottom", offset: -16, fill: "#5c574c", fontSize: 12 }}
            />
            <YAxis
              dataKey="y"
              type="number"
              domain={["auto", "auto"]}
              tickFormatter={(v: number) => formatNumber(v, 3)}
              tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
              width={56}
              label={{
                value: `${other} (re-optimised)`,
                angle: -90,
                position: "insideLeft",
                fill: "#5c574c",
                fontSize: 12,
                style: { textAnchor: "middle" },
              }}
            />
            <Scatter
              name="within 95 %"
              data={points.filter((p) => p.within && p.y !== null)}
              fill="#5b3c8f"
              isAnimationActive={false}
              line
            />
            <Scatter
              name="outside"
              data={points.filter((p) => !p.within && p.y !== null)}
              fill="#c9bedf"
              isAnimationActive={false}
            />
          </ComposedChart>
        </ResponsiveContainer>
      )}
    </div>
  );
}
