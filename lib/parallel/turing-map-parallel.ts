/**
 * Turing maps on worker threads: the plan is made here, rows are split into chunks (about
 * four per worker, for balance) and computed by the pool, then assembled. Falls back to
 * this thread when workers are unavailable.
 */
import { KineticsAnalysisError, KineticsInputError, KineticsLimitError } from "../kinetics/errors";
import { resolveKinetics, type KineticsSource } from "../kinetics/resolve-kinetics";
import { planTuringMap, type TuringMapOptions } from "../stability/map-plan";
import { computeMapRows, type MapRows } from "../stability/map-rows";
import { summariseTuringMap, type TuringMapResult } from "../stability/turing-map";
import { createMapWorkerPool, type MapWorkerPool } from "./worker-pool";

export interface ParallelMapOptions {
  /** A running pool to reuse (e.g. a server's); otherwise one is started and closed. */
  pool?: MapWorkerPool;
  /** Workers to start when no pool is given. @default defaultWorkerCount() */
  workers?: number;
}

/** Computes a Turing map, in parallel over rows when workers are available. */
export async function computeTuringMapParallel(
  source: KineticsSource,
  options: TuringMapOptions,
  parallel: ParallelMapOptions = {},
): Promise<TuringMapResult> {
  const t0 = Date.now();
  const kinetics = resolveKinetics(source);
  const plan = planTuringMap(kinetics, options);
  const pool = parallel.pool ?? (await createMapWorkerPool(parallel.workers));
  try {
    if (pool.size === 0) {
      const rows = computeMapRows(kinetics, plan, 0, plan.y.n, t0);
      return summariseTuringMap(kinetics, plan, [rows], Date.now() - t0, 0);
    }
    const chunks = Math.min(plan.y.n, pool.size * 4);
    const step = Math.ceil(plan.y.n / chunks);
    const jobs: Promise<MapRows>[] = [];
    for (let y0 = 0; y0 < plan.y.n; y0 += step) {
      const y1 = Math.min(plan.y.n, y0 + step);
      jobs.push(
        pool.run({ source, plan, y0, y1, startedAtMs: t0 }).then((reply) => {
          if (reply.ok) return reply;
          throw rebuildError(reply.error);
        }),
      );
    }
    const blocks = await Promise.all(jobs);
    return summariseTuringMap(kinetics, plan, blocks, Date.now() - t0, pool.size);
  } finally {
    if (!parallel.pool) await pool.close();
  }
}

function rebuildError(e: { name: string; field: string; message: string }): Error {
  if (e.name === "KineticsAnalysisError") return new KineticsAnalysisError(e.field, e.message);
  if (e.name === "KineticsLimitError") return new KineticsLimitError(e.field, e.message);
  if (e.name === "KineticsInputError") return new KineticsInputError(e.field, e.message);
  return new Error(e.message);
}
