export function Panel({
  title,
  actions,
  children,
  className = "",
}: {
  title?: React.ReactNode;
  actions?: React.ReactNode;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <section className={`rounded-lg border border-rule bg-card ${className}`}>
      {(title || actions) && (
        <header className="flex items-center justify-between gap-3 border-b border-rule px-4 py-2.5">
          {title && <h2 className="text-sm font-semibold tracking-wide text-ink">{title}</h2>}
          {actions && <div className="flex items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className="p-4">{children}</div>
    </section>
  );
}

export function PageHeader({
  title,
  subtitle,
  actions,
  crumbs,
}: {
  title: string;
  subtitle?: React.ReactNode;
  actions?: React.ReactNode;
  crumbs?: React.ReactNode;
}) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0 max-w-full">
        {crumbs && <div className="mb-1 text-xs text-ink-soft [overflow-wrap:anywhere]">{crumbs}</div>}
        {/* A name of 120 characters without spaces wraps anywhere instead of widening the page. */}
        <h1 className="text-2xl font-semibold text-ink [overflow-wrap:anywhere]">{title}</h1>
        {subtitle && <p className="mt-1 text-sm text-ink-soft [overflow-wrap:anywhere]">{subtitle}</p>}
      </div>
      {actions && <div className="flex items-center gap-2">{actions}</div>}
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: React.ReactNode }) {
  return (
    <div
      className="rounded-lg border border-dashed border-rule bg-paper px-6 py-10 text-center"
      data-testid="empty-state"
    >
      <p className="font-medium text-ink">{title}</p>
      {children && <div className="mt-2 text-sm text-ink-soft">{children}</div>}
    </div>
  );
}

export function Badge({
  children,
  tone = "plain",
}: {
  children: React.ReactNode;
  tone?: "plain" | "moss" | "iris" | "ochre" | "brick";
}) {
  const cls = {
    plain: "bg-paper-deep text-ink-soft",
    moss: "bg-moss-soft text-moss-dark",
    iris: "bg-iris-soft text-iris",
    ochre: "bg-ochre-soft text-ochre",
    brick: "bg-brick-soft text-brick",
  }[tone];
  return (
    <span className={`inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium ${cls}`}>{children}</span>
  );
}
