import Link from "next/link";
import { Discussion } from "@/components/discussion/discussion";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { getFit } from "@/lib/server/fits/fits";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { FitLineage } from "./fit-lineage";
import { FitView } from "./fit-view";

export const dynamic = "force-dynamic";

export default async function FitPage({ params }: { params: Promise<{ labId: string; fitId: string }> }) {
  const { labId, fitId } = await params;
  const ctx = await pageLab(labId);
  const fit = await orNotFound(getFit(ctx, fitId));
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/fits`} className="hover:underline">
            Fits
          </Link>
        }
        title={fit.name}
        subtitle={
          <>
            {fit.kind === "comparison" ? `Comparison of ${fit.kinetics.join(", ")}` : fit.kinetics[0]} · {fit.n}{" "}
            measurements in {fit.conditions.join(", ")} · started {fit.createdAt.slice(0, 16).replace("T", " ")} UTC
            {fit.createdByEmail ? ` by ${fit.createdByEmail}` : ""}
            {fit.rerunOf && (
              <>
                {" "}
                · re-run of{" "}
                <Link className="text-moss hover:underline" href={`/labs/${labId}/fits/${fit.rerunOf}`}>
                  an earlier fit
                </Link>
              </>
            )}
          </>
        }
      />
      <FitLineage labId={labId} fit={fit} />
      <FitView labId={labId} initial={fit} canSimulate={can(ctx.role, "run.create")} />
      <div className="mt-8" id="discussion">
        <Discussion labId={labId} targetType="fit" targetId={fit.id} />
      </div>
    </>
  );
}
