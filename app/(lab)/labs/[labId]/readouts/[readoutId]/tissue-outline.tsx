/** The tissue region a readout analysed, drawn over the whole-image preview (source-pixel coordinates). */
export function TissueOutline({
  points,
  width,
  height,
}: {
  points: Array<[number, number]>;
  width: number;
  height: number;
}) {
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      preserveAspectRatio="none"
      className="pointer-events-none absolute left-0 top-0 w-full"
      style={{ aspectRatio: `${width} / ${height}` }}
      aria-label="tissue region found automatically"
      data-testid="readout-tissue-outline"
    >
      <polygon
        points={points.map((p) => p.join(",")).join(" ")}
        fill="none"
        stroke="#1f5c45"
        strokeWidth={Math.max(1, width / 200)}
        strokeDasharray={`${Math.max(2, width / 60)} ${Math.max(2, width / 90)}`}
      />
    </svg>
  );
}
