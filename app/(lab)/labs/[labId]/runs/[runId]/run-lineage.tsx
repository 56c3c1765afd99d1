import Link from "next/link";
import type { RunDetailDto } from "@/lib/server/runs/types";

/** "Changed from …" and "Changed and run again as …": the runs this one was changed from and into. */
export function RunLineage({ labId, run }: { labId: string; run: RunDetailDto }) {
  if (!run.changedFrom && run.changedInto.length === 0) return null;
  const link = (x: { id: string; name: string }, testId: string) => (
    <Link className="text-moss hover:underline" href={`/labs/${labId}/runs/${x.id}`} data-testid={testId}>
      {x.name}
    </Link>
  );
  return (
    <div className="mb-4 space-y-1 text-sm" data-testid="run-lineage">
      {run.changedFrom && <p>Changed from {link(run.changedFrom, "run-changed-from-link")}</p>}
      {run.changedInto.length > 0 && (
        <p>
          Changed and run again as{" "}
          {run.changedInto.map((x, i) => (
            <span key={x.id}>
              {i > 0 && ", "}
              {link(x, "run-changed-into-link")}
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
