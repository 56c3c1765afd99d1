"use client";
/** For a run started from a fit: how its pattern compares with the fit's measurement, and where that came from. */
import Link from "next/link";
import type { RunDetailDto } from "@/lib/server/runs/types";
import { withUnit } from "../run-format";

export function RunFitComparison({
  labId,
  fromFit,
  result,
}: {
  labId: string;
  fromFit: NonNullable<RunDetailDto["plan"]["fromFit"]>;
  result: NonNullable<RunDetailDto["result"]>;
}) {
  return (
    <div className="mb-3 text-sm" data-testid="fit-comparison">
      <p className="text-base">
        {result.measurementComparison?.sentence ??
          "The fit's measurement is in µm; this run has no length scale, so the two cannot be compared."}
      </p>
      <p className="mt-1 text-ink-soft">
        From the fit{" "}
        <Link className="text-moss hover:underline" href={`/labs/${labId}/fits/${fromFit.fitId}`}>
          {fromFit.fitName}
        </Link>{" "}
        ({fromFit.model}), condition “{fromFit.condition}”: measured{" "}
        <span className="num text-moss">{withUnit(fromFit.measuredMeanUm, "µm", fromFit.measuredSeUm)}</span> (n ={" "}
        <span className="num">{fromFit.n}</span>)
        {fromFit.readouts.length > 0 && (
          <>
            {" "}
            from{" "}
            {fromFit.readouts.map((x, i) => (
              <span key={x.readoutId}>
                {i > 0 ? ", " : " "}
                <Link className="text-moss hover:underline" href={`/labs/${labId}/readouts/${x.readoutId}`}>
                  {x.filename ?? "readout"}
                </Link>
              </span>
            ))}
          </>
        )}
      </p>
    </div>
  );
}
