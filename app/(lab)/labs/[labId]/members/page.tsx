import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { pageLab } from "@/lib/server/web/page-access";
import { MembersView } from "./members-view";

export const metadata: Metadata = { title: "Members" };
export const dynamic = "force-dynamic";

export default async function MembersPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId, "member.list");
  return (
    <>
      <PageHeader title="Members" subtitle="Everyone in this lab and their role. Roles are per lab." />
      <MembersView labId={labId} canManage={can(ctx.role, "member.manage")} myUserId={ctx.actor.userId} />
    </>
  );
}
