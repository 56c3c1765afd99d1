import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listMemberAccountEvents } from "@/lib/server/audit";
import { pageLab } from "@/lib/server/web/page-access";
import { AccountEventsList } from "../../../account/account-events-list";
import { AuditView } from "./audit-view";

export const metadata: Metadata = { title: "Audit trail" };
export const dynamic = "force-dynamic";

export default async function AuditPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId, "audit.read");
  const memberEvents = await listMemberAccountEvents(ctx, 50);
  return (
    <>
      <PageHeader
        title="Audit trail"
        subtitle="Who changed access and who created, edited or deleted what, newest first. Entries cannot be edited."
      />
      <AuditView labId={labId} />
      <div className="mt-6">
        <Panel title="Members’ sign-ins and API tokens">
          <p className="mb-3 text-sm text-ink-soft">
            The last 50 of the lab’s current members, across all their labs: sign-ins (successful, failed, locked out)
            and API tokens (created, revoked, expired).
          </p>
          <AccountEventsList
            items={memberEvents}
            empty="No sign-ins or API token changes recorded for the members yet."
            testId="member-account-events"
          />
        </Panel>
      </div>
    </>
  );
}
