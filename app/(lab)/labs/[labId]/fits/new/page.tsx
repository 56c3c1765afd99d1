import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { Notice } from "@/components/ui/notice";
import { loadNewFitPage } from "@/lib/server/fits/pages";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { FitBuilder } from "./fit-builder";

export const dynamic = "force-dynamic";

export default async function NewFitPage({
  params,
  searchParams,
}: {
  params: Promise<{ labId: string }>;
  searchParams: Promise<{ kinetics?: string; version?: string; from?: string; readout?: string }>;
}) {
  const { labId } = await params;
  const { kinetics, version, from, readout } = await searchParams;
  const ctx = await pageLab(labId, "fit.create");
  const data = await orNotFound(loadNewFitPage(ctx, { kinetics, version, from }));
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/fits`} className="hover:underline">
            Fits
          </Link>
        }
        title={data.prefill ? "Change and re-run" : "New fit"}
        subtitle="Choose measured wavelengths grouped by condition, one kinetics (or several to compare), and which parameters the data should pin down. The server checks everything before the fit starts."
      />
      {data.notice && (
        <div className="mb-4">
          <Notice tone="warning" testId="kinetics-version-notice">
            {data.notice}
          </Notice>
        </div>
      )}
      <FitBuilder
        labId={labId}
        candidates={data.candidates}
        kinetics={data.kinetics}
        initialKinetics={kinetics ?? null}
        prefill={data.prefill}
        initialReadout={readout ?? null}
      />
    </>
  );
}
