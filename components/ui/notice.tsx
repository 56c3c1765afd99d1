export function Notice({
  tone = "info",
  children,
  testId,
}: {
  tone?: "info" | "error" | "success" | "warning";
  children: React.ReactNode;
  testId?: string;
}) {
  const cls = {
    info: "border-rule bg-card text-ink",
    error: "border-brick/40 bg-brick-soft text-brick",
    success: "border-moss/40 bg-moss-soft text-moss-dark",
    warning: "border-ochre/40 bg-ochre-soft text-ochre",
  }[tone];
  return (
    <div className={`rounded-md border px-3 py-2 text-sm ${cls}`} data-testid={testId ?? `notice-${tone}`}>
      {children}
    </div>
  );
}
