/** Exports of a finished fit: CSV (parameters, predictions, ranking), JSON (everything), methods paragraph. */
import "server-only";
import type { LabContext } from "../access";
import { AppError } from "../errors";
import { getFit } from "./fits";
import { fitToCsv } from "./export-csv";
import { fitToJson } from "./export-json";
import { fitMethodsText } from "./export-methods";

const slug = (s: string) =>
  s
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 60) || "fit";

export async function exportFit(ctx: LabContext, fitId: string, format: "csv" | "json" | "methods") {
  const fit = await getFit(ctx, fitId);
  if (!fit.result)
    throw new AppError("conflict", `the fit has no result to export (${fit.status}); wait for it to finish`);
  const base = slug(fit.name);
  if (format === "csv") return { body: fitToCsv(fit), contentType: "text/csv; charset=utf-8", filename: `${base}.csv` };
  if (format === "json")
    return { body: fitToJson(fit), contentType: "application/json; charset=utf-8", filename: `${base}.json` };
  return { body: fitMethodsText(fit), contentType: "text/plain; charset=utf-8", filename: `${base}-methods.txt` };
}
