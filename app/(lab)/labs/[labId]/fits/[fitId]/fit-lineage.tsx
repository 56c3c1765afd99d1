import Link from "next/link";
import type { FitDetailDto } from "@/lib/server/fits/fits";

/** "Changed from …" and "Changed and re-run as …": the fits this one was changed from and into. */
export function FitLineage({ labId, fit }: { labId: string; fit: FitDetailDto }) {
  if (!fit.changedFrom && fit.changedInto.length === 0) return null;
  const link = (x: { id: string; name: string }, testId: string) => (
    <Link key={x.id} className="text-moss hover:underline" href={`/labs/${labId}/fits/${x.id}`} data-testid={testId}>
      {x.name}
    </Link>
  );
  return (
    <div className="mb-4 space-y-1 text-sm" data-testid="fit-lineage">
      {fit.changedFrom && <p>Changed from {link(fit.changedFrom, "fit-changed-from-link")}</p>}
      {fit.changedInto.length > 0 && (
        <p>
          Changed and re-run as{" "}
          {fit.changedInto.map((x, i) => (
            <span key={x.id}>
              {i > 0 && ", "}
              {link(x, "fit-changed-into-link")}
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
