import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { can } from "@/lib/access/permissions";
import { PageHeader } from "@/components/ui/panel";
import { loadKineticsEditPage } from "@/lib/server/kinetics/pages";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { draftFromDefinition } from "../../kinetics-draft";
import { KineticsEditor } from "../../kinetics-editor";

export const metadata: Metadata = { title: "Edit kinetics" };
export const dynamic = "force-dynamic";

export default async function EditKineticsPage({ params }: { params: Promise<{ labId: string; kineticsId: string }> }) {
  const { labId, kineticsId } = await params;
  // A kinetics that does not exist is a 404 for everyone; one that exists and may not be edited, a 403.
  const ctx = await pageLab(labId);
  const { kinetics, latest } = await orNotFound(loadKineticsEditPage(ctx, kineticsId));
  if (!can(ctx.role, "kinetics.edit") || !kinetics.canEdit) forbidden();
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
