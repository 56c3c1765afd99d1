import type { RunDetailDto } from "@/lib/server/runs/types";

/** The new-run form prefilled with this run's kinetics, parameters and grid, starting from its final fields. */
export function continueHref(labId: string, r: RunDetailDto): string {
  const q = new URLSearchParams({ from: r.id, kinetics: r.kinetics.ref });
  if (r.kinetics.version) q.set("version", String(r.kinetics.version));
  for (const [k, v] of Object.entries(r.spec.parameters)) q.set(`p.${k}`, String(v));
  if (r.spec.scales?.lengthScaleUm) q.set("lengthScaleUm", String(r.spec.scales.lengthScaleUm));
  if (r.spec.scales?.timeScaleS) q.set("timeScaleS", String(r.spec.scales.timeScaleS));
  return `/labs/${labId}/runs/new?${q.toString()}`;
}
