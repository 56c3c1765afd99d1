import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { pageLab } from "@/lib/server/web/page-access";
import { StudiesView } from "../studies-view";

export const metadata: Metadata = { title: "Studies" };
export const dynamic = "force-dynamic";

export default async function StudiesPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  return (
    <>
      <PageHeader
        title="Studies"
        subtitle="A study groups specimens of one tissue and organism, under one or more conditions."
      />
      <StudiesView labId={labId} canCreate={can(ctx.role, "study.create")} />
    </>
  );
}
