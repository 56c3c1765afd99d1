import { getCatalogueEntry } from "@/lib/server/kinetics/catalogue";
import { getLabKinetics } from "@/lib/server/kinetics/kinetics";
import { isUuid } from "@/lib/server/access";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";

/**
 * Answers an unknown or foreign kinetics with a real 404 before the page's loading skeleton
 * streams (after the first byte the status can no longer change); the page loads and checks again.
 * The edit page sits outside this group, with no skeleton, so its own 404 stays a 404.
 */
export default async function KineticsLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ labId: string; kineticsId: string }>;
}) {
  const { labId, kineticsId } = await params;
  const ctx = await pageLab(labId);
  if (isUuid(kineticsId)) await orNotFound(getLabKinetics(ctx, kineticsId));
  else await orNotFound(Promise.resolve().then(() => getCatalogueEntry(kineticsId)));
  return <>{children}</>;
}
