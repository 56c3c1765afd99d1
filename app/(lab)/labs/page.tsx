import { redirect } from "next/navigation";
import { AppShell } from "@/components/layout/app-shell";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { getMe } from "@/lib/server/accounts/accounts";
import { pageActor } from "@/lib/server/web/page-access";
import { CreateLabForm } from "../account/create-lab-form";

export const dynamic = "force-dynamic";

export default async function LabsIndex() {
  const me = await getMe(await pageActor("/labs"));
  if (me.labs.length > 0) redirect(`/labs/${me.labs[0].id}`);
  return (
    <AppShell me={me}>
      <PageHeader title="No lab yet" />
      <EmptyState title="You are not a member of any lab.">
        Ask a lab manager for an invitation, or start a lab of your own:
        <div className="mx-auto mt-4 max-w-sm text-left">
          <CreateLabForm />
        </div>
      </EmptyState>
    </AppShell>
  );
}
