import Link from "next/link";
import { PageHeader } from "@/components/ui/panel";
import { SIMULATION_LIMITS } from "@/lib/simulation";
import { estimateSolverS, RUN_WORK_LIMIT } from "@/lib/server/runs/plan";
import { Notice } from "@/components/ui/notice";
import { loadNewRunPage } from "@/lib/server/runs/pages";
import { orNotFound, pageLab } from "@/lib/server/web/page-access";
import { RunForm, type RunPrefill } from "./run-form";

export const dynamic = "force-dynamic";

type Search = Record<string, string | string[] | undefined>;

/** 8 measured wavelengths, in model lengths when there is a length scale (µm), to 3 significant figures. */
function sideHolding8Periods(measuredMeanUm: number, lengthScaleUm: number | undefined): string | undefined {
  const side = (8 * measuredMeanUm) / (lengthScaleUm ?? 1);
  return Number.isFinite(side) && side > 0 ? String(Number(side.toPrecision(3))) : undefined;
}

export default async function NewRunPage({
  params,
  searchParams,
}: {
  params: Promise<{ labId: string }>;
  searchParams: Promise<Search>;
}) {
  const { labId } = await params;
  const q = await searchParams;
  const ctx = await pageLab(labId, "run.create");
  const one = (k: string) => (typeof q[k] === "string" ? (q[k] as string) : undefined);
  const parameters: Record<string, string> = {};
  for (const [k, v] of Object.entries(q)) if (k.startsWith("p.") && typeof v === "string") parameters[k.slice(2)] = v;
  const from = one("from");
  const fitId = one("fit"),
    condition = one("condition");
  const {
    kinetics,
    earlierRuns,
    fitStart: f,
    fitNotice,
    change,
  } = await orNotFound(
    loadNewRunPage(ctx, fitId && condition ? { fitId, condition, model: one("model") } : null, one("change")),
  );
  const startFrom = change ? change.startFrom : from;
  const prefill: RunPrefill =
    f && (change?.fit ?? (fitId && condition))
      ? {
          kinetics: f.kinetics,
          version: f.version ? String(f.version) : undefined,
          parameters: Object.fromEntries(Object.entries(f.parameters).map(([k, v]) => [k, String(v)])),
          lengthScaleUm: f.lengthScaleUm !== undefined ? String(f.lengthScaleUm) : undefined,
          timeScaleS: f.timeScaleS !== undefined ? String(f.timeScaleS) : undefined,
          startFrom: change && earlierRuns.some((r) => r.id === startFrom) ? startFrom : undefined,
          sideLength: sideHolding8Periods(f.fromFit.measuredMeanUm, f.lengthScaleUm),
          fit: {
            fitId: f.fromFit.fitId,
            condition: f.fromFit.condition,
            model: f.fromFit.model,
            label: `${f.fromFit.fitName} (${f.fromFit.model}), condition “${f.fromFit.condition}”: measured ${Number(f.fromFit.measuredMeanUm.toPrecision(4))} ± ${Number(f.fromFit.measuredSeUm.toPrecision(2))} µm, n = ${f.fromFit.n}`,
          },
          change: change ?? undefined,
        }
      : {
          kinetics: change?.kinetics ?? one("kinetics"),
          version: change ? change.version : one("version"),
          parameters: change?.parameters ?? parameters,
          lengthScaleUm: change ? change.lengthScaleUm : one("lengthScaleUm"),
          timeScaleS: change ? change.timeScaleS : one("timeScaleS"),
          startFrom: earlierRuns.some((r) => r.id === startFrom) ? startFrom : undefined,
          change: change ?? undefined,
        };
  const limits = [
    `cells per axis: a power of two, ${SIMULATION_LIMITS.minCellsPerAxis} … ${SIMULATION_LIMITS.maxCellsPerAxis2D} on a rectangle, up to ${SIMULATION_LIMITS.maxCells1D} on an interval`,
    `at most ${SIMULATION_LIMITS.maxSteps.toLocaleString("en")} time steps (the step is the smaller of your cap and 0.1/ρ, ρ the spectral radius of the reaction Jacobian)`,
    `at most ${RUN_WORK_LIMIT.toLocaleString("en")} cell-species-steps per run (256² cells × 2 species × 20 000 steps, about ${Math.round(estimateSolverS(RUN_WORK_LIMIT))} s on this server)`,
  ];
  return (
    <>
      <PageHeader
        crumbs={
          <Link href={`/labs/${labId}/runs`} className="hover:underline">
            Runs
          </Link>
        }
        title={change ? "Change and run again" : "New verification run"}
        subtitle="Simulate a kinetics from its homogeneous steady state plus seeded noise, or from an earlier run's final pattern; the final pattern is read like a tissue image and compared with 2π/k*."
      />
      {change && (
        <div className="mb-4">
          <Notice testId="run-changed-from">
            Filled in from the run “{change.changedFrom.name}”: change what you want and start a new run. The original
            stays as it is; the new run links back to it.
            {change.notes.map((n) => (
              <span key={n} className="mt-1 block text-xs">
                {n}
              </span>
            ))}
          </Notice>
        </div>
      )}
      {fitNotice && (
        <div className="mb-4">
          <Notice tone="warning">{fitNotice}</Notice>
        </div>
      )}
      <RunForm labId={labId} kinetics={kinetics} prefill={prefill} limits={limits} earlierRuns={earlierRuns} />
    </>
  );
}
