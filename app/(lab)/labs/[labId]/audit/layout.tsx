import { pageLab } from "@/lib/server/web/page-access";

/**
 * Only roles that may read the audit trail get past here, answered before the section's loading
 * skeleton streams so a refused visit is a real 404; the page checks again itself.
 */
export default async function AuditLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string }>;
}) {
  await pageLab((await params).labId, "audit.read");
  return <>{children}</>;
}
