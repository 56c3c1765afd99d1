"use client";
/**
 * Orientation rose: excess power on the peak ring by wave-vector direction θ (1° bins over
 * 0…179°, drawn mirrored over 360° because power at θ and θ + 180° is the same). Angles run from
 * +x towards +y with image rows downwards, so the rose is drawn in the image's own orientation.
 */
import { formatSig } from "./spectrum-format";

export interface OrientationRoseProps {
  angularPower: number[];
  /** Dominant wave-vector direction (°), or null. */
  orientationDeg: number | null;
  anisotropy: number;
  size?: number;
}

export function OrientationRose({ angularPower, orientationDeg, anisotropy, size = 260 }: OrientationRoseProps) {
  const c = size / 2;
  const R = c - 26;
  const max = Math.max(1e-12, ...angularPower.map((v) => (Number.isFinite(v) ? Math.max(0, v) : 0)));
  const n = angularPower.length || 180;
  const pts: string[] = [];
  for (let d = 0; d < 360; d++) {
    const v = Math.max(0, angularPower[Math.round((d * n) / 180) % n] ?? 0) / max;
    const a = (d * Math.PI) / 180;
    pts.push(`${(c + R * v * Math.cos(a)).toFixed(2)},${(c + R * v * Math.sin(a)).toFixed(2)}`);
  }
  const ray = (deg: number, r: number) => [
    c + r * Math.cos((deg * Math.PI) / 180),
    c + r * Math.sin((deg * Math.PI) / 180),
  ];
  return (
    <figure data-testid="orientation-rose" className="inline-block">
      <svg
        width={size}
        height={size}
        viewBox={`0 0 ${size} ${size}`}
        role="img"
        aria-label="orientation rose of the peak-ring power"
      >
        {[0.25, 0.5, 0.75, 1].map((f) => (
          <circle key={f} cx={c} cy={c} r={R * f} fill="none" stroke="#d9cfbb" strokeDasharray="2 4" />
        ))}
        {[0, 45, 90, 135].map((deg) => {
          const [x1, y1] = ray(deg, R);
          const [x2, y2] = ray(deg + 180, R);
          const [tx, ty] = ray(deg, R + 14);
          return (
            <g key={deg}>
              <line x1={x1} y1={y1} x2={x2} y2={y2} stroke="#d9cfbb" />
              <text
                x={tx}
                y={ty}
                fontSize={10}
                fontFamily="IBM Plex Mono"
                fill="#5c574c"
                textAnchor="middle"
                dominantBaseline="middle"
              >
                {deg}°
              </text>
            </g>
          );
        })}
        <polygon points={pts.join(" ")} fill="#dcebe2" fillOpacity={0.8} stroke="#1f5c45" strokeWidth={1.5} />
        {orientationDeg !== null &&
          (() => {
            const [x1, y1] = ray(orientationDeg, R);
            const [x2, y2] = ray(orientationDeg + 180, R);
            return <line x1={x1} y1={y1} x2={x2} y2={y2} stroke="#1f5c45" strokeWidth={2} strokeDasharray="5 3" />;
          })()}
      </svg>
      <figcaption className="mt-1 max-w-[260px] text-xs text-ink-soft">
        Peak-ring power by wave-vector direction θ (°, from +x towards +y, image rows downwards); dashed line: θ ={" "}
        <span className="num">{orientationDeg === null ? "—" : `${formatSig(orientationDeg, 3)}°`}</span>; anisotropy{" "}
        <span className="num">{formatSig(anisotropy, 3)}</span> (0 isotropic … 1 one direction).
      </figcaption>
    </figure>
  );
}
