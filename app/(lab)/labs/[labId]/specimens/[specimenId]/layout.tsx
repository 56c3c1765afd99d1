import { findSpecimen } from "@/lib/server/studies/specimens";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";

/**
 * Answers an unknown or foreign id with a real 404 before this page's loading skeleton streams
 * (after the first byte the status can no longer change); the page loads and checks again itself.
 */
export default async function SpecimenLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string; specimenId: string }>;
}) {
  const { labId, specimenId } = await params;
  await orNotFound(findSpecimen(await pageLab(labId), specimenId));
  return <>{children}</>;
}
