"use client";
/**
 * Radially averaged power spectrum of a readout: log₁₀ power against spatial frequency
 * (cycles/µm), the fitted background, the low-frequency cut shaded, the peak 1/λ marked and its
 * uncertainty band 1/(λ ± u) shaded green.
 */
import {
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceArea,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatSig } from "./spectrum-format";

export interface SpectrumPlotProps {
  frequencyPerUm: number[];
  power: number[];
  background: number[];
  lowCutPerUm: number;
  /** Peak wavelength and one standard uncertainty (µm); null when no significant period. */
  wavelengthUm: number | null;
  uncertaintyUm: number | null;
  height?: number;
  /** The length unit of the axis and labels: "µm", or "model length" for non-dimensional kinetics without ℓ. */
  lengthUnit?: string;
}

export function SpectrumPlot({
  frequencyPerUm,
  power,
  background,
  lowCutPerUm,
  wavelengthUm,
  uncertaintyUm,
  height = 300,
  lengthUnit = "µm",
}: SpectrumPlotProps) {
  const log = (v: number) => (v > 0 ? Math.log10(v) : null);
  const peak = wavelengthUm ? 1 / wavelengthUm : null;
  const fMax = frequencyPerUm.length ? frequencyPerUm[frequencyPerUm.length - 1] : 1;
  const xMax = peak ? Math.min(fMax, Math.max(4 * peak, 2 * lowCutPerUm)) : fMax;
  const data = frequencyPerUm
    .map((f, i) => ({ f, power: log(power[i]), background: log(background[i]) }))
    .filter((d) => d.f <= xMax);
  const band =
    peak && uncertaintyUm && wavelengthUm
      ? [1 / (wavelengthUm + uncertaintyUm), wavelengthUm > uncertaintyUm ? 1 / (wavelengthUm - uncertaintyUm) : xMax]
      : null;
  return (
    <div data-testid="spectrum-plot">
      <ResponsiveContainer width="100%" height={height}>
        <ComposedChart data={data} margin={{ top: 24, right: 16, bottom: 28, left: 16 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" />
          <ReferenceArea x1={0} x2={lowCutPerUm} fill="#ece4d3" fillOpacity={0.9} ifOverflow="hidden" />
          {band && (
            <ReferenceArea
              x1={band[0]}
              x2={Math.min(band[1], xMax)}
              fill="#dcebe2"
              fillOpacity={0.9}
              ifOverflow="hidden"
            />
          )}
          <XAxis
            dataKey="f"
            type="number"
            domain={[0, xMax]}
            tickFormatter={(v: number) => formatSig(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: `spatial frequency (cycles/${lengthUnit})`,
              position: "insideBottom",
              offset: -16,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis
            type="number"
            domain={["auto", "auto"]}
            tickFormatter={(v: number) => formatSig(v, 3)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            width={56}
            label={{
              value: "log₁₀ power (a.u.)",
              angle: -90,
              position: "insideLeft",
              dy: 50,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          {peak && (
            <ReferenceLine
              x={peak}
              stroke="#1f5c45"
              strokeDasharray="4 3"
              label={{
                value: `peak 1/λ = ${formatSig(peak, 4)} cycles/${lengthUnit}`,
                position: "top",
                fill: "#1f5c45",
                fontSize: 11,
              }}
            />
          )}
          <Line
            dataKey="background"
            name="fitted background"
            type="monotone"
            dot={false}
            stroke="#5c574c"
            strokeDasharray="5 4"
            strokeWidth={1.5}
            isAnimationActive={false}
          />
          <Line
            dataKey="power"
            name="radial power"
            type="monotone"
            dot={false}
            stroke="#1f5c45"
            strokeWidth={2}
            isAnimationActive={false}
          />
          <Tooltip
            formatter={(v, name) => [formatSig(Number(v), 4), `log₁₀ ${name}`]}
            labelFormatter={(v) =>
              `f = ${formatSig(Number(v), 4)} cycles/${lengthUnit} (λ = ${formatSig(1 / Number(v), 4)} ${lengthUnit})`
            }
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
        </ComposedChart>
      </ResponsiveContainer>
      <p className="mt-1 text-xs text-ink-soft">
        <span className="inline-block h-0.5 w-4 align-middle bg-moss" /> radial power · dashed: fitted power-law
        background · <span className="inline-block h-2 w-4 align-middle bg-moss-soft border border-moss/30" /> peak ±
        uncertainty · <span className="inline-block h-2 w-4 align-middle bg-paper-deep border border-rule" /> below the
        low-frequency cut (too few periods), not searched
      </p>
    </div>
  );
}
