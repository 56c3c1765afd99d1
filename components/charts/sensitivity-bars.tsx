"use client";
/** Elasticities ∂ln λ* / ∂ln p as horizontal bars, sorted by magnitude (unit-free). */
import {
  Bar,
  BarChart,
  CartesianGrid,
  Cell,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatNumber } from "./dispersion-format";

export function SensitivityBars({ items }: { items: { name: string; elasticity: number }[] }) {
  const data = [...items].sort((a, b) => Math.abs(b.elasticity) - Math.abs(a.elasticity));
  return (
    <div data-testid="sensitivity-bars">
      <ResponsiveContainer width="100%" height={Math.max(120, 30 * data.length + 50)}>
        <BarChart data={data} layout="vertical" margin={{ top: 4, right: 24, bottom: 24, left: 8 }}>
          <CartesianGrid stroke="#d9cfbb" strokeDasharray="2 4" horizontal={false} />
          <XAxis
            type="number"
            tickFormatter={(v: number) => formatNumber(v, 2)}
            tick={{ fontSize: 11, fontFamily: "IBM Plex Mono" }}
            label={{
              value: "elasticity ∂ln λ*/∂ln p (unit-free)",
              position: "insideBottom",
              offset: -12,
              fill: "#5c574c",
              fontSize: 12,
            }}
          />
          <YAxis type="category" dataKey="name" width={72} tick={{ fontSize: 12, fontFamily: "IBM Plex Mono" }} />
          <ReferenceLine x={0} stroke="#22201b" strokeOpacity={0.5} />
          <Tooltip
            formatter={(v) => formatNumber(Number(v))}
            contentStyle={{ fontSize: 12, fontFamily: "IBM Plex Mono" }}
          />
          <Bar dataKey="elasticity" isAnimationActive={false}>
            {data.map((d) => (
              <Cell key={d.name} fill={d.elasticity >= 0 ? "#5b3c8f" : "#9b86bf"} />
            ))}
          </Bar>
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
