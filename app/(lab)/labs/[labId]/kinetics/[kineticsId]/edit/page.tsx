import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageHeader } from "@/components/ui/panel";
import { getLabKinetics, getLabKineticsVersion } from "@/lib/server/kinetics/kinetics";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { draftFromDefinition } from "../../kinetics-draft";
import { KineticsEditor } from "../../kinetics-editor";

export const metadata: Metadata = { title: "Edit kinetics" };
export const dynamic = "force-dynamic";

export default async function EditKineticsPage({ params }: { params: Promise<{ labId: string; kineticsId: string }> }) {
  const { labId, kineticsId } = await params;
  const ctx = await pageLab(labId, "kinetics.edit");
  const kinetics = await orNotFound(getLabKinetics(ctx, kineticsId));
  if (!kinetics.canEdit) notFound();
  const latest = await orNotFound(getLabKineticsVersion(ctx, kineticsId));
  return (
    <>
      <PageHeader
        crumbs={
          <>
            <Link href={`/labs/${labId}/kinetics`} className="hover:underline">
              Kinetics
            </Link>{" "}
            /{" "}
            <Link href={`/labs/${labId}/kinetics/${kineticsId}`} className="hover:underline">
              {kinetics.name}
            </Link>
          </>
        }
        title={`Edit ${kinetics.name}`}
        subtitle={`Starts from version ${latest.version}; saving adds version ${latest.version + 1} and keeps every earlier one unchanged.`}
      />
      <KineticsEditor
        labId={labId}
        kineticsId={kineticsId}
        initial={draftFromDefinition(latest.definition, kinetics.description)}
        nextVersion={latest.version + 1}
      />
    </>
  );
}
