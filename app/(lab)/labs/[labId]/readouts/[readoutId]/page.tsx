import Link from "next/link";
import { LinkButton } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { getReadout } from "@/lib/server/readouts/readouts";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { Discussion } from "@/components/discussion/discussion";
import { ReadoutView } from "./readout-view";

export const dynamic = "force-dynamic";

export default async function ReadoutPage({ params }: { params: Promise<{ labId: string; readoutId: string }> }) {
  const { labId, readoutId } = await params;
  const ctx = await pageLab(labId, "upload.read");
  const readout = await orNotFound(getReadout(ctx, readoutId));
  return (
    <>
      <PageHeader
        crumbs={
          <>
            <Link href={`/labs/${labId}/studies`} className="hover:underline">
              Studies
            </Link>{" "}
            /{" "}
            <Link href={`/labs/${labId}/studies/${readout.studyId}`} className="hover:underline">
              {readout.studyName}
            </Link>{" "}
            /{" "}
            <Link href={`/labs/${labId}/specimens/${readout.specimenId}`} className="hover:underline">
              Specimen {readout.specimenLabel}
            </Link>
          </>
        }
        title={`Readout of ${readout.filename}`}
        actions={
          can(ctx.role, "fit.create") && (
            <LinkButton
              variant="secondary"
              href={`/labs/${labId}/fits/new?readout=${readout.id}`}
              data-testid="fit-from-readout"
            >
              Fit kinetics to this readout
            </LinkButton>
          )
        }
        subtitle={`${readout.condition} · ${readout.kind === "image" ? "image" : "table"} · started ${readout.createdAt.slice(0, 16).replace("T", " ")} UTC${readout.createdByEmail ? ` by ${readout.createdByEmail}` : ""}`}
      />
      <ReadoutView labId={labId} initial={readout} canRerun={can(ctx.role, "readout.create")} />
      <div className="mt-8" id="discussion">
        <Discussion labId={labId} targetType="readout" targetId={readout.id} />
      </div>
    </>
  );
}
