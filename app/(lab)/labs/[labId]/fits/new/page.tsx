import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { listFitCandidates } from "@/lib/server/fits/candidates";
import {
  definitionInfo,
  getLabKineticsVersion,
  listCatalogue,
  listLabKinetics,
  type KineticsInfoDto,
} from "@/lib/server/kinetics/kinetics";
import { pageLab } from "@/lib/server/web/page-access";
import { FitBuilder } from "./fit-builder";

export const dynamic = "force-dynamic";

export default async function NewFitPage({
  params,
  searchParams,
}: {
  params: Promise<{ labId: string }>;
  searchParams: Promise<{ kinetics?: string; version?: string }>;
}) {
  const { labId } = await params;
  const { kinetics, version } = await searchParams;
  const ctx = await pageLab(labId, "fit.create");
  const candidates = await listFitCandidates(ctx);
  const lab = await listLabKinetics(ctx, { page: 1, pageSize: 100, sort: "name", dir: "asc", q: "" });
  const labInfos: KineticsInfoDto[] = [];
  for (const k of lab.items) {
    const v = await getLabKineticsVersion(
      ctx,
      k.id,
      k.id === kinetics && version && /^\d+$/.test(version) ? Number(version) : undefined,
    ).catch(() => null);
    if (v) labInfos.push(definitionInfo(k.id, v.version, v.definition));
  }
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/fits`} className="hover:underline">
            Fits
          </Link>
        }
        title="New fit"
        subtitle="Choose measured wavelengths grouped by condition, one kinetics (or several to compare), and which parameters the data should pin down. The server checks everything before the fit starts."
      />
      <FitBuilder
        labId={labId}
        candidates={candidates}
        kinetics={[...listCatalogue(), ...labInfos]}
        initialKinetics={kinetics ?? null}
      />
    </>
  );
}
