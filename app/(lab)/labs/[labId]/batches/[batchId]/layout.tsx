import { findBatch } from "@/lib/server/batches/batches";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";

/** An unknown or foreign batch answers a real 404 before the loading skeleton streams. */
export default async function BatchLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string; batchId: string }>;
}) {
  const { labId, batchId } = await params;
  await orNotFound(findBatch(await pageLab(labId), batchId));
  return <>{children}</>;
}
