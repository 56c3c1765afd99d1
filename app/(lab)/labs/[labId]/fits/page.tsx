import { LinkButton } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { pageLab } from "@/lib/server/web/page-access";
import { FitsList } from "./fits-list";

export const dynamic = "force-dynamic";

export default async function FitsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  const ctx = await pageLab(labId);
  const canFit = can(ctx.role, "fit.create");
  return (
    <>
      <PageHeader
        title="Fits"
        subtitle="Which kinetics, with which parameters, explain the measured spacing: fits of predicted to measured wavelength with confidence intervals, identifiability and a ranking. Fits are hypotheses, not measurements."
        actions={
          canFit ? (
            <LinkButton href={`/labs/${labId}/fits/new`} data-testid="new-fit">
              New fit
            </LinkButton>
          ) : null
        }
      />
      <FitsList labId={labId} canFit={canFit} canSimulate={can(ctx.role, "run.create")} />
    </>
  );
}
