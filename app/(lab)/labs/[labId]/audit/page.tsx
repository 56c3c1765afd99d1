import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/panel";
import { pageLab } from "@/lib/server/page-access";
import { AuditView } from "./audit-view";

export const metadata: Metadata = { title: "Audit trail" };
export const dynamic = "force-dynamic";

export default async function AuditPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  await pageLab(labId, "audit.read");
  return (
    <>
      <PageHeader title="Audit trail" subtitle="Who changed access and who created or deleted what, newest first. Entries cannot be edited." />
      <AuditView labId={labId} />
    </>
  );
}
