"use client";
/**
 * Predicted against measured wavelength per condition: every measurement in green with its
 * uncertainty (on the Fourier scale the model predicts), the model's 2π/k* at the fit in violet.
 */
import {
  CartesianGrid,
  ComposedChart,
  ErrorBar,
  Legend,
  ResponsiveContainer,
  Scatter,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { axisRangeFor, clipInterval } from "./clip-interval";
import { formatNumber } from "./dispersion-format";

export interface PredictedMeasuredProps {
  conditions: string[];
  measured: { condition: string; valueUm: number; uncertaintyUm: number }[];
  predicted: { condition: string; valueUm: number | null }[];
}

export function FitPredictedMeasured({ conditions, measured, predicted }: PredictedMeasuredProps) {
  const x = (c: string) => conditions.indexOf(c);
  // Spread repeated measurements of a condition a little so each is visible.
  const seen = new Map<string, number>();
  const m = measured.map((d) => {
    const j = seen.get(d.condition) ?? 0;
    seen.set(d.condition, j + 1);
    return { x: x(d.condition) - 0.12 + 0.06 * (j % 5), y: d.valueUm, err: d.uncertaintyUm };
  });
  const p = predicted
    .filter((d) => d.valueUm !== null)
    .map((d) => ({ x: x(d.condition) + 0.18, y: d.valueUm as number }));
  // Whiskers stay inside the axes: a very wide one is cut at the edge, its end marked and labelled.
  const range = axisRangeFor(
    [...m.map((d) => d.y), ...p.map((d) => d.y)],
    m.map((d) => [d.y - d.err, d.y + d.err]),
  );
  const measuredClipped = m.map((d) => {
    const c = clipInterval([d.y - d.err, d.y + d.err], range);
    return { ...d, errClipped: [d.y - c.lo, c.hi - d.y], c };
  });
  const beyond = measuredClipped.flatMap((d) => [
    ...(d.c.beyondHigh !== null ? [{ x: d.x, y: d.c.hi, value: d.c.beyondHigh, up: true }] : []),
    ...(d.c.beyondLow !== null ? [{ x: d.x, y: d.c.lo, value: d.c.beyondLow, up: false }] : []),
  ]);
  return (
    <div data-testid="predicted-measured">
      <ResponsiveContainer width="100%" height={300}>
        <ComposedChart margin={{ top: 12, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <XAxis
            type="number"
            dataKey="x"
            domain={[-0.5, conditions.length - 0.5]}
            ticks={conditions.map((_, i) => i)}
            tickFormatter={(i: number) => conditions[i] ?? ""}
            tick={{ fontSize: 11 }}
            label={{ value: "condition", position: "insideBottom", offset: -16, fill: "#5c574c", fontSize: 12 }}
          />
          <YAxis
            type="number"
            dataKey="y"
            domain={[range.lo, range.hi]}
            allowDataOverflow
            tickFormatter={(v: number) => formatNumber(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={64}
            label={{
              value: "Fourier wavelength λ (µm)",
              angle: -90,
              position: "insideLeft",
              fill: "#5c574c",
              fontSize: 12,
              style: { textAnchor: "middle" },
            }}
          />
          <Tooltip
            formatter={(v) => `${formatNumber(Number(v))} µm`}
            labelFormatter={() => ""}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
          <Legend verticalAlign="top" height={24} wrapperStyle={{ fontSize: 12 }} />
          <Scatter name="measured ± uncertainty" data={measuredClipped} fill="#1f5c45" isAnimationActive={false}>
            <ErrorBar dataKey="errClipped" direction="y" width={4} stroke="#1f5c45" />
          </Scatter>
          {beyond.length > 0 && (
            <Scatter data={beyond} legendType="none" isAnimationActive={false} shape={BeyondMark} tooltipType="none" />
          )}
          <Scatter name="model 2π/k* at the fit" data={p} fill="#5b3c8f" shape="diamond" isAnimationActive={false} />
        </ComposedChart>
      </ResponsiveContainer>
    </div>
  );
}

/** An arrow at the axis edge where an uncertainty bar continues, with the bar's true end. */
function BeyondMark(props: unknown) {
  const { cx, cy, payload } = props as { cx: number; cy: number; payload: { value: number; up: boolean } };
  const tip = payload.up ? -1 : 1;
  return (
    <g data-testid="ci-beyond">
      <path
        d={`M${cx - 4},${cy - 6 * tip} L${cx},${cy} L${cx + 4},${cy - 6 * tip}`}
        fill="none"
        stroke="#1f5c45"
        strokeWidth={1.5}
      />
      <text x={cx + 7} y={cy + (payload.up ? 10 : -4)} fontSize={10} fontFamily="IBM Plex Mono" fill="#5c574c">
        {`${payload.up ? "↑" : "↓"} ${formatNumber(payload.value, 3)} µm`}
      </text>
    </g>
  );
}
