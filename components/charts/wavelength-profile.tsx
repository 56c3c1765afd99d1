"use client";
/** Local wavelength along one axis: the mean of the tiles at each position (µm) with ± 1 SD bars. */
import {
  CartesianGrid,
  ComposedChart,
  ErrorBar,
  Line,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatSig } from "./spectrum-format";

export interface WavelengthProfileProps {
  axis: "x" | "y";
  positionUm: number[];
  wavelengthUm: Array<number | null>;
  sdUm: Array<number | null>;
  /** Whole-region wavelength for reference (µm). */
  globalWavelengthUm: number | null;
  tileSizeUm: number;
  height?: number;
}

export function WavelengthProfile({
  axis,
  positionUm,
  wavelengthUm,
  sdUm,
  globalWavelengthUm,
  tileSizeUm,
  height = 240,
}: WavelengthProfileProps) {
  const data = positionUm.map((p, i) => ({ p, lambda: wavelengthUm[i], sd: sdUm[i] ?? 0 }));
  const found = data.filter((d) => d.lambda !== null).length;
  if (found === 0)
    return (
      <p className="text-sm text-ink-soft" data-testid="wavelength-profile">
        No tile of <span className="num">{formatSig(tileSizeUm, 3)} µm</span> showed a significant period, so there is
        no local profile.
      </p>
    );
  return (
    <div data-testid="wavelength-profile">
      <ResponsiveContainer width="100%" height={height}>
        <ComposedChart data={data} margin={{ top: 8, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <XAxis
            dataKey="p"
            type="number"
            domain={["dataMin", "dataMax"]}
            tickFormatter={(v: number) => formatSig(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: `tile centre along ${axis} (µm)`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis
            type="number"
            domain={["auto", "auto"]}
            tickFormatter={(v: number) => formatSig(v, 5)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={56}
            label={{ value: "local λ (µm)", angle: -90, position: "insideLeft", dy: 36, fill: "#5c574c", fontSize: 12 }}
          />
          {globalWavelengthUm !== null && (
            <ReferenceLine y={globalWavelengthUm} stroke="#5c574c" strokeDasharray="4 3" />
          )}
          <Line
            dataKey="lambda"
            type="linear"
            stroke="#1f5c45"
            strokeWidth={2}
            dot={{ r: 3, fill: "#1f5c45" }}
            connectNulls={false}
            isAnimationActive={false}
          >
            <ErrorBar dataKey="sd" width={4} stroke="#1f5c45" strokeOpacity={0.6} direction="y" />
          </Line>
          <Tooltip
            formatter={(v) => `${formatSig(Number(v), 4)} µm`}
            labelFormatter={(v) => `${axis} = ${formatSig(Number(v), 4)} µm`}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
        </ComposedChart>
      </ResponsiveContainer>
      <p className="mt-1 text-xs text-ink-soft">
        Tiles of <span className="num">{formatSig(tileSizeUm, 3)} µm</span>, half overlapping; bars ± 1 SD across the
        tiles at each position; dashed: whole-region λ.
      </p>
    </div>
  );
}
