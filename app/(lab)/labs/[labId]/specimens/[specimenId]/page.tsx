import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { getSpecimen } from "@/lib/server/studies/specimens";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { services } from "@/lib/server/services";
import { SpecimenView } from "./specimen-view";

export const dynamic = "force-dynamic";

export default async function SpecimenPage({ params }: { params: Promise<{ labId: string; specimenId: string }> }) {
  const { labId, specimenId } = await params;
  const ctx = await pageLab(labId);
  const specimen = await orNotFound(getSpecimen(ctx, specimenId));
  return (
    <>
      <PageHeader
        crumbs={
          <>
            <Link href={`/labs/${labId}/studies`} className="hover:underline">
              Studies
            </Link>{" "}
            /{" "}
            <Link href={`/labs/${labId}/studies/${specimen.studyId}`} className="hover:underline">
              {specimen.studyName}
            </Link>
          </>
        }
        title={`Specimen ${specimen.label}`}
        subtitle={[specimen.condition, specimen.stage, specimen.genotype].filter(Boolean).join(" · ")}
      />
      <SpecimenView
        labId={labId}
        specimen={specimen}
        canUpload={can(ctx.role, "upload.create")}
        maxUploadBytes={services().config.maxUploadBytes}
      />
    </>
  );
}
