"use client";
/** The local wavelength read from the simulated pattern (green, ± 1 SD) along x, and the local linear prediction 2π/k*(x) (violet; constant without a gradient). */
import { CartesianGrid, ComposedChart, ErrorBar, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { formatSig } from "./spectrum-format";

export interface RunGradientProfileProps {
  measured: { positions: number[]; wavelengths: Array<number | null>; sd: Array<number | null> };
  predicted: { positions: number[]; wavelengths: Array<number | null> };
  /** The parameter that varies, or null when all are uniform (the prediction is then one constant 2π/k*). */
  parameter: string | null;
  unit: string;
  height?: number;
}

export function RunGradientProfile({ measured, predicted, parameter, unit, height = 260 }: RunGradientProfileProps) {
  const rows = [
    ...predicted.positions.map((p, i) => ({
      p,
      predicted: predicted.wavelengths[i],
      measured: null as number | null,
      sd: 0,
    })),
    ...measured.positions.map((p, i) => ({
      p,
      predicted: null as number | null,
      measured: measured.wavelengths[i],
      sd: measured.sd[i] ?? 0,
    })),
  ].sort((a, b) => a.p - b.p);
  return (
    <div data-testid="run-gradient-profile">
      <ResponsiveContainer width="100%" height={height}>
        <ComposedChart data={rows} margin={{ top: 8, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <XAxis
            dataKey="p"
            type="number"
            domain={["dataMin", "dataMax"]}
            tickFormatter={(v: number) => formatSig(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: `position x (${unit})`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis
            type="number"
            domain={["auto", "auto"]}
            tickFormatter={(v: number) => formatSig(v, 4)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={56}
            label={{
              value: `local λ (${unit})`,
              angle: -90,
              position: "insideLeft",
              dy: 36,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <Line
            dataKey="predicted"
            name="2π/k*(x)"
            stroke="#5b3c8f"
            strokeWidth={2}
            dot={false}
            connectNulls
            isAnimationActive={false}
          />
          <Line
            dataKey="measured"
            name="readout"
            stroke="#1f5c45"
            strokeWidth={0}
            dot={{ r: 3, fill: "#1f5c45" }}
            connectNulls={false}
            isAnimationActive={false}
          >
            <ErrorBar dataKey="sd" width={4} stroke="#1f5c45" strokeOpacity={0.6} direction="y" />
          </Line>
          <Tooltip
            formatter={(v, name) => [`${formatSig(Number(v), 4)} ${unit}`, String(name)]}
            labelFormatter={(v) => `x = ${formatSig(Number(v), 4)} ${unit}`}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
        </ComposedChart>
      </ResponsiveContainer>
      <p className="mt-1 text-xs text-ink-soft">
        <span className="inline-block h-0.5 w-4 align-middle bg-iris" />{" "}
        {parameter
          ? `local linear prediction 2π/k* as ${parameter} varies`
          : "linear prediction 2π/k* (uniform parameters)"}{" "}
        · <span className="inline-block h-2 w-2 rounded-full align-middle bg-moss" /> local wavelength of the simulated
        pattern (tiles, ± 1 SD)
      </p>
    </div>
  );
}
