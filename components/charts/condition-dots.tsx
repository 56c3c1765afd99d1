"use client";
/**
 * Dot plot of readouts by condition: one dot per upload (jittered sideways), the condition mean
 * as a bar and its 95 % CI as a whisker. Plain arrays in; values in µm.
 */
import { axisRangeFor, clipInterval } from "./clip-interval";
import { formatSig } from "./spectrum-format";

export interface ConditionDotsGroup {
  condition: string;
  values: Array<{ value: number; label: string }>;
  mean: number;
  ci95: [number, number] | null;
}

function niceTicks(lo: number, hi: number, count = 5): number[] {
  const span = hi - lo || Math.abs(hi) || 1;
  const step0 = span / count;
  const mag = 10 ** Math.floor(Math.log10(step0));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((s) => s >= step0) ?? step0;
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + 1e-9 * step; t += step) ticks.push(Number(t.toPrecision(12)));
  return ticks;
}

export function ConditionDots({
  groups,
  yLabel,
  height = 280,
}: {
  groups: ConditionDotsGroup[];
  yLabel: string;
  height?: number;
}) {
  const slot = 120;
  const left = 64,
    bottom = 44,
    top = 12;
  // 40 px on the right: room for the last group's "↑ 412 µm" label beside its whisker.
  const width = left + Math.max(1, groups.length) * slot + 40;
  // A whisker far wider than the dots (two replicates) is cut at the axis and its end labelled.
  const range = axisRangeFor(
    groups.flatMap((g) => [...g.values.map((v) => v.value), g.mean]),
    groups.map((g) => g.ci95),
  );
  const { lo, hi } = range;
  const y = (v: number) => top + (1 - (v - lo) / (hi - lo)) * (height - top - bottom);
  const ticks = niceTicks(lo, hi);
  return (
    <figure data-testid="condition-dots" className="overflow-x-auto">
      <svg width={width} height={height} role="img" aria-label={`dot plot of ${yLabel} by condition`}>
        {ticks.map((t) => (
          <g key={t}>
            <line x1={left} x2={width - 8} y1={y(t)} y2={y(t)} stroke="#d9cfbb" strokeDasharray="2 4" />
            <text
              x={left - 6}
              y={y(t)}
              fontSize={11}
              fontFamily="IBM Plex Mono"
              fill="#5c574c"
              textAnchor="end"
              dominantBaseline="middle"
            >
              {formatSig(t, 4)}
            </text>
          </g>
        ))}
        <text
          transform={`translate(14 ${(height - bottom + top) / 2}) rotate(-90)`}
          fontSize={12}
          fill="#5c574c"
          textAnchor="middle"
        >
          {yLabel}
        </text>
        {groups.map((g, gi) => {
          const cx = left + gi * slot + slot / 2;
          return (
            <g key={g.condition} data-testid="condition-dots-group">
              {g.ci95 && <Whisker x={cx + 22} ci={clipInterval(g.ci95, range)} y={y} />}
              <line x1={cx - 26} x2={cx + 30} y1={y(g.mean)} y2={y(g.mean)} stroke="#22201b" strokeWidth={2} />
              {g.values.map((v, i) => {
                const jitter = g.values.length > 1 ? (i / (g.values.length - 1) - 0.5) * 28 : 0;
                return (
                  <circle
                    key={i}
                    cx={cx - 6 + jitter}
                    cy={y(v.value)}
                    r={4.5}
                    fill="#1f5c45"
                    fillOpacity={0.75}
                    stroke="#15422f"
                  >
                    <title>{`${v.label}: ${formatSig(v.value, 4)} µm`}</title>
                  </circle>
                );
              })}
              <text x={cx} y={height - bottom + 18} fontSize={12} fill="#22201b" textAnchor="middle">
                {g.condition.length > 18 ? `${g.condition.slice(0, 17)}…` : g.condition}
              </text>
              <text
                x={cx}
                y={height - bottom + 33}
                fontSize={10}
                fontFamily="IBM Plex Mono"
                fill="#5c574c"
                textAnchor="middle"
              >
                n = {g.values.length}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="text-xs text-ink-soft">
        Dots: one upload each (its latest finished readout). Bar: condition mean; whisker: 95 % CI of the mean (t, n −
        1).
      </figcaption>
    </figure>
  );
}

/** A CI whisker inside the axes: a cap at an end that fits, an arrow and the value at an end cut off. */
function Whisker({ x, ci, y }: { x: number; ci: ReturnType<typeof clipInterval>; y: (v: number) => number }) {
  const ends: Array<{ at: number; beyond: number | null; up: boolean }> = [
    { at: ci.lo, beyond: ci.beyondLow, up: false },
    { at: ci.hi, beyond: ci.beyondHigh, up: true },
  ];
  return (
    <g data-testid="ci-whisker">
      <line x1={x} x2={x} y1={y(ci.lo)} y2={y(ci.hi)} stroke="#22201b" strokeWidth={1.5} />
      {ends.map(({ at, beyond, up }) =>
        beyond === null ? (
          <line key={String(up)} x1={x - 5} x2={x + 5} y1={y(at)} y2={y(at)} stroke="#22201b" strokeWidth={1.5} />
        ) : (
          <g key={String(up)} data-testid="ci-beyond">
            <path
              d={
                up
                  ? `M${x - 5},${y(at) + 6} L${x},${y(at)} L${x + 5},${y(at) + 6}`
                  : `M${x - 5},${y(at) - 6} L${x},${y(at)} L${x + 5},${y(at) - 6}`
              }
              fill="none"
              stroke="#22201b"
              strokeWidth={1.5}
            />
            <text x={x + 7} y={y(at) + (up ? 10 : -4)} fontSize={10} fontFamily="IBM Plex Mono" fill="#5c574c">
              {`${up ? "↑" : "↓"} ${formatSig(beyond, 4)} µm`}
            </text>
          </g>
        ),
      )}
    </g>
  );
}
