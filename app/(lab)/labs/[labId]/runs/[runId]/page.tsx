import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/access/permissions";
import { getRun } from "@/lib/server/runs/runs";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { RunLineage } from "./run-lineage";
import { RunView } from "./run-view";

export const dynamic = "force-dynamic";

export default async function RunPage({ params }: { params: Promise<{ labId: string; runId: string }> }) {
  const { labId, runId } = await params;
  const ctx = await pageLab(labId);
  const run = await orNotFound(getRun(ctx, runId));
  const k = run.kinetics;
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/runs`} className="hover:underline">
            Runs
          </Link>
        }
        title={run.name}
        subtitle={
          <>
            Verification run of{" "}
            <Link
              className="text-moss hover:underline"
              href={`/labs/${labId}/kinetics/${k.ref}${k.version ? `?version=${k.version}` : ""}`}
            >
              {k.name}
              {k.version ? ` v${k.version}` : ""}
            </Link>{" "}
            · {run.gridLabel} · started {run.createdAt.slice(0, 16).replace("T", " ")} UTC
            {run.createdByEmail ? ` by ${run.createdByEmail}` : ""}
          </>
        }
      />
      <RunLineage labId={labId} run={run} />
      <RunView labId={labId} initial={run} canStart={can(ctx.role, "run.create")} />
    </>
  );
}
