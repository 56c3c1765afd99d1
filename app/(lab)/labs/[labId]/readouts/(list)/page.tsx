import { PageHeader } from "@/components/ui/panel";
import { pageLab } from "@/lib/server/web/page-access";
import { ReadoutsList } from "../readouts-list";

export const dynamic = "force-dynamic";

export default async function ReadoutsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  await pageLab(labId, "upload.read");
  return (
    <>
      <PageHeader
        title="Readouts"
        subtitle="Every spacing readout in the lab, newest first. Each upload is read when it arrives; open one to see its spectrum or read it again with other settings."
      />
      <ReadoutsList labId={labId} />
    </>
  );
}
