import { PageHeader } from "@/components/ui/panel";
import { pageLab } from "@/lib/server/web/page-access";
import { BatchesList } from "../batches-list";

export const dynamic = "force-dynamic";

export default async function BatchesPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  await pageLab(labId, "upload.read");
  return (
    <>
      <PageHeader
        title="Batches"
        subtitle="Files uploaded many at once, newest first. Open one to see its summary: λ ± u, symmetry, significance and status per file."
      />
      <BatchesList labId={labId} />
    </>
  );
}
