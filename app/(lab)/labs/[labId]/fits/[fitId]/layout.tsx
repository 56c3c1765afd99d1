import { findFit } from "@/lib/server/fits/fits";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";

/**
 * Answers an unknown or foreign id with a real 404 before this page's loading skeleton streams
 * (after the first byte the status can no longer change); the page loads and checks again itself.
 */
export default async function FitLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string; fitId: string }>;
}) {
  const { labId, fitId } = await params;
  await orNotFound(findFit(await pageLab(labId), fitId));
  return <>{children}</>;
}
