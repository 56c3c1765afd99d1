import { getRun } from "@/lib/server/runs/runs";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";

/**
 * Answers an unknown or foreign id with a real 404 before this page's loading skeleton streams
 * (after the first byte the status can no longer change); the page loads and checks again itself.
 */
export default async function RunLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string; runId: string }>;
}) {
  const { labId, runId } = await params;
  await orNotFound(getRun(await pageLab(labId), runId));
  return <>{children}</>;
}
