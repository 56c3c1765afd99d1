/**
 * A run started from a chosen initial field: the final fields of an earlier finished run of the
 * same lab. Checked before the job (same cells, same species count); the job copies the stored
 * fields next to RUN.json, checks them against the SHA-256 the earlier run recorded, and keeps a
 * copy as this run's own `initial-<s>.f64`, so the run stays reproducible on its own.
 */
import "server-only";
import { createHash } from "node:crypto";
import type { Grid } from "@/lib/simulation";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { database } from "../services";
import type { RunPlan, RunResult, RunSpec } from "./types";

const refuse = (message: string) =>
  new AppError("unprocessable", `startFrom.runId: ${message}`, { field: "startFrom.runId" });

export interface RunStart {
  fromRun: { runId: string; name: string; finalSha256: string[] };
  plan: NonNullable<RunPlan["startFrom"]>;
  warnings: string[];
}

export const initialFieldFile = (s: number) => `initial-${s}.f64`;

export async function readRunStart(
  ctx: LabContext,
  runId: string,
  species: readonly string[],
  grid: Grid,
): Promise<RunStart> {
  const m = await database();
  const row = await m.SimulationRun.findOne({ where: { id: runId, labId: ctx.labId } });
  if (!row) throw refuse("there is no run with this id in this lab.");
  const result = row.result as unknown as RunResult | null;
  const spec = row.spec as unknown as RunSpec,
    plan = row.plan as unknown as RunPlan;
  const keys = row.fileKeys ?? {};
  if (row.status !== "succeeded" || !result || !plan.species.every((_, s) => keys[`final-${s}.f64`])) {
    throw refuse(
      `the run “${row.name}” has not finished (it is ${row.status}); only a finished run's final fields can start another.`,
    );
  }
  const n = species.length;
  if (plan.species.length !== n) {
    throw refuse(
      `the run “${row.name}” has ${plan.species.length} species (${plan.species.join(", ")}); this kinetics has ${n} (${species.join(", ")}).`,
    );
  }
  const cells = grid.dimensions === 2 ? [grid.nx, grid.ny] : [grid.nx];
  if (spec.grid.cells.join("×") !== cells.join("×")) {
    throw refuse(
      `the run “${row.name}” has ${spec.grid.cells.join(" × ")} cells; this run asks for ${cells.join(" × ")}. A chosen initial field needs the same cells: choose the same grid.`,
    );
  }
  const warnings: string[] = [];
  if (plan.species.some((s, i) => s !== species[i])) {
    warnings.push(`Species are matched by position: ${plan.species.map((s, i) => `${s} → ${species[i]}`).join(", ")}.`);
  }
  const lengths = grid.dimensions === 2 ? [grid.lengthXUm, grid.lengthYUm] : [grid.lengthXUm];
  if (spec.grid.lengthUm.some((l, i) => Math.abs(l / lengths[i] - 1) > 1e-12)) {
    warnings.push(
      `The earlier run's domain was ${spec.grid.lengthUm.join(" × ")}; this run's is ${lengths.join(" × ")}, so its pattern is stretched to the new size.`,
    );
  }
  if (spec.grid.boundary !== grid.boundary)
    warnings.push(`The earlier run had ${spec.grid.boundary} boundaries; this one has ${grid.boundary}.`);
  if (result.stopReason === "blow-up")
    warnings.push(`The earlier run stopped by blow-up; its last good state (t = ${result.timeS}) is used.`);
  return {
    fromRun: { runId: row.id, name: row.name, finalSha256: [...result.finalSha256] },
    plan: {
      runId: row.id,
      name: row.name,
      kineticsName: row.kineticsName,
      timeS: result.timeS,
      grid: `${spec.grid.cells.join(" × ")} cells on ${spec.grid.lengthUm.join(" × ")}`,
      speciesMeans: result.fields.map((f) => f.mean),
    },
    warnings,
  };
}

/**
 * The earlier run's final fields as bytes, one per species, checked against its recorded SHA-256.
 * Throws a clear AppError when the run or a field is gone or differs.
 */
export async function loadRunStartFields(
  labId: string,
  fromRun: RunStart["fromRun"],
  species: number,
  getBuffer: (key: string) => Promise<Buffer>,
): Promise<Buffer[]> {
  const m = await database();
  const row = await m.SimulationRun.findOne({ where: { id: fromRun.runId, labId } });
  const keys = row?.fileKeys ?? {};
  const out: Buffer[] = [];
  for (let s = 0; s < species; s++) {
    const key = keys[`final-${s}.f64`];
    if (!row || !key)
      throw new AppError(
        "unprocessable",
        `the earlier run “${fromRun.name}” that this run starts from, or its final fields, no longer exist`,
      );
    const bytes = await getBuffer(key);
    const sha = createHash("sha256").update(bytes).digest("hex");
    if (sha !== fromRun.finalSha256[s]) {
      throw new AppError(
        "unprocessable",
        `the final field ${s} of the earlier run “${fromRun.name}” does not match the SHA-256 recorded when it finished (${fromRun.finalSha256[s].slice(0, 12)}…); it was changed in storage`,
      );
    }
    out.push(bytes);
  }
  return out;
}

/** A finished run whose final fields can start another (for the new-run form). */
export interface RunStartOption {
  id: string;
  name: string;
  kineticsName: string;
  species: string[];
  cells: number[];
  lengthUm: number[];
  boundary: "zero-flux" | "periodic";
  timeS: number;
}

/** The lab's latest finished runs (at most `limit`), newest first. */
export async function listRunStartOptions(ctx: LabContext, limit = 50): Promise<RunStartOption[]> {
  const m = await database();
  const rows = await m.SimulationRun.findAll({
    where: { labId: ctx.labId, status: "succeeded" },
    order: [
      ["createdAt", "desc"],
      ["id", "asc"],
    ],
    limit,
  });
  return rows.map((r) => {
    const spec = r.spec as unknown as RunSpec,
      plan = r.plan as unknown as RunPlan,
      result = r.result as unknown as RunResult | null;
    return {
      id: r.id,
      name: r.name,
      kineticsName: r.kineticsName,
      species: plan.species,
      cells: spec.grid.cells,
      lengthUm: spec.grid.lengthUm,
      boundary: spec.grid.boundary,
      timeS: result?.timeS ?? spec.endTimeS,
    };
  });
}
