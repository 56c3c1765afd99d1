import type { Metadata } from "next";
import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { pageLab } from "@/lib/server/web/page-access";
import { emptyDraft } from "../kinetics-draft";
import { KineticsEditor } from "../kinetics-editor";

export const metadata: Metadata = { title: "New kinetics" };
export const dynamic = "force-dynamic";

export default async function NewKineticsPage({ params }: { params: Promise<{ labId: string }> }) {
  const { labId } = await params;
  await pageLab(labId, "kinetics.edit");
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/kinetics`} className="hover:underline">
            Kinetics
          </Link>
        }
        title="New kinetics"
        subtitle="Reaction terms as expressions for 2–6 species, parameters with ranges, and diffusivities."
      />
      <KineticsEditor labId={labId} initial={emptyDraft()} nextVersion={1} />
    </>
  );
}
