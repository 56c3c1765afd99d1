import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { formatDateTime } from "@/lib/client/format";
import { getBatchSummary } from "@/lib/server/batches/summary";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { BatchView } from "./batch-view";

export const dynamic = "force-dynamic";

const TARGET_WORDS = {
  specimen: "all files are images of one specimen",
  "specimen-per-file": "each file is a different specimen",
  "one-specimen": "all files are one new specimen",
} as const;

export default async function BatchPage({ params }: { params: Promise<{ labId: string; batchId: string }> }) {
  const { labId, batchId } = await params;
  const ctx = await pageLab(labId);
  const summary = await orNotFound(getBatchSummary(ctx, batchId));
  const where =
    summary.specimenId && summary.target !== "specimen-per-file" ? (
      <Link className="hover:underline" href={`/labs/${labId}/specimens/${summary.specimenId}`}>
        specimen {summary.specimenLabel}
      </Link>
    ) : summary.studyId ? (
      <Link className="hover:underline" href={`/labs/${labId}/studies/${summary.studyId}`}>
        study {summary.studyName}
      </Link>
    ) : (
      "a deleted study"
    );
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/batches`} className="hover:underline">
            Batches
          </Link>
        }
        title={summary.name}
        subtitle={
          <>
            Into {where} · {TARGET_WORDS[summary.target]}
            {summary.condition ? ` · ${summary.condition}` : ""} · started {formatDateTime(summary.createdAt)}
            {summary.createdByEmail ? ` by ${summary.createdByEmail}` : ""}
          </>
        }
      />
      <BatchView labId={labId} initial={summary} />
    </>
  );
}
