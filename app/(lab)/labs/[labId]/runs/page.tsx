import { LinkButton } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { pageLab } from "@/lib/server/web/page-access";
import { RunsList } from "./runs-list";

export const dynamic = "force-dynamic";

export default async function RunsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  const canRun = can(ctx.role, "run.create");
  return (
    <>
      <PageHeader
        title="Verification runs"
        subtitle="Kinetics simulated on an interval or a rectangle, their final pattern read by the same readout as tissue and set beside the linear prediction 2π/k*."
        actions={
          canRun ? (
            <LinkButton href={`/labs/${labId}/runs/new`} data-testid="new-run">
              New run
            </LinkButton>
          ) : null
        }
      />
      <RunsList labId={labId} canRun={canRun} />
    </>
  );
}
