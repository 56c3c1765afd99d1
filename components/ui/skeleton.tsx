/**
 * Loading placeholders in the house look: paper-toned blocks that pulse gently, shaped like the
 * page that is coming (a header, then panels or a table), so the layout does not jump when it lands.
 */
function Bar({ className = "" }: { className?: string }) {
  return <div className={`rounded bg-paper-deep motion-safe:animate-pulse ${className}`} />;
}

function PanelSkeleton({ rows }: { rows: number }) {
  return (
    <div className="rounded-lg border border-rule bg-card">
      <div className="border-b border-rule px-4 py-3">
        <Bar className="h-3.5 w-32" />
      </div>
      <div className="space-y-3 p-4">
        {Array.from({ length: rows }, (_, i) => (
          <Bar key={i} className={`h-3 ${i % 3 === 2 ? "w-2/3" : "w-full"}`} />
        ))}
      </div>
    </div>
  );
}

/**
 * A page-shaped placeholder. `layout`: "panels" for dashboards and detail pages, "table" for lists.
 * Screen readers hear the label once (role=status) instead of a run of empty blocks.
 */
export function PageSkeleton({ label, layout = "panels" }: { label: string; layout?: "panels" | "table" }) {
  return (
    <div role="status" aria-live="polite" data-testid="page-skeleton">
      <span className="sr-only">{label}</span>
      <div className="mb-6 space-y-2" aria-hidden="true">
        <Bar className="h-7 w-64" />
        <Bar className="h-3.5 w-96 max-w-full" />
      </div>
      {layout === "table" ? (
        <div aria-hidden="true">
          <PanelSkeleton rows={8} />
        </div>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]" aria-hidden="true">
          <PanelSkeleton rows={6} />
          <PanelSkeleton rows={4} />
        </div>
      )}
    </div>
  );
}
