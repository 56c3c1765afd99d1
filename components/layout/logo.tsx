/** Morphokin's mark: three offset rows of dots, a lattice being laid down. */
export function Logo({ className = "h-6 w-6" }: { className?: string }) {
  const dots: [number, number][] = [];
  for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) dots.push([4 + c * 8 + (r % 2) * 4, 5 + r * 7]);
  return (
    <svg viewBox="0 0 28 24" className={className} aria-hidden>
      {dots.map(([x, y], i) => (
        <circle
          key={i}
          cx={x}
          cy={y}
          r={i === 4 ? 3 : 2.2}
          fill={i === 4 ? "var(--color-iris)" : "var(--color-moss)"}
        />
      ))}
    </svg>
  );
}
