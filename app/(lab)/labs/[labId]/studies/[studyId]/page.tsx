import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { getStudy } from "@/lib/server/studies/studies";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { services } from "@/lib/server/services";
import { ConditionComparison } from "./condition-comparison";
import { StudyView } from "./study-view";

export const dynamic = "force-dynamic";

export default async function StudyPage({ params }: { params: Promise<{ labId: string; studyId: string }> }) {
  const { labId, studyId } = await params;
  const ctx = await pageLab(labId);
  const study = await orNotFound(getStudy(ctx, studyId));
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/studies`} className="hover:underline">
            Studies
          </Link>
        }
        title={study.name}
        subtitle={`${study.tissue} · ${study.organism}${study.createdByEmail ? ` · created by ${study.createdByEmail}` : ""}`}
      />
      <StudyView
        labId={labId}
        study={study}
        canAddSpecimen={can(ctx.role, "specimen.create")}
        batchMaxUploadBytes={can(ctx.role, "upload.create") ? services().config.maxUploadBytes : undefined}
      />
      <div className="mt-5">
        <ConditionComparison labId={labId} studyId={study.id} />
      </div>
    </>
  );
}
