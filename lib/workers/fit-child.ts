/**
 * Child-process entry of one model of a fit: `node --conditions=react-server --import tsx lib/workers/fit-child.ts --spec
 * FILE` prints exactly one JSON object, `{ kinetics, ...result }` like `cli fit --json`.
 * A catalogue kinetics runs the command line's `fit` command itself (its errors as
 * `{"error": {"code", "message"}}` on stderr, as `cli fit --json` prints them); a lab kinetics,
 * whose definition the command line cannot look up, is fitted from the definition stored with
 * the fit (its errors as one plain line on stderr, exit code 2).
 */
import { readFileSync } from "node:fs";
import fitCommands from "../cli/commands/fit";
import { CliError } from "../cli/command";
import { prefixField } from "@/lib/errors/field-message";
import { fitStoredModel } from "../server/fits/model-run";
import type { StoredFitModel, StoredFitSpec } from "../server/fits/spec-types";

function specPath(): string {
  const i = process.argv.indexOf("--spec");
  if (i < 0 || !process.argv[i + 1]) throw new Error("--spec <FIT.json> is required.");
  return process.argv[i + 1];
}

async function fitCatalogueModel(file: string): Promise<number> {
  const fit = fitCommands.find((c) => c.name === "fit")!;
  try {
    const result = await fit.run(["--spec", file], { json: true });
    process.stdout.write(JSON.stringify(result.json) + "\n");
    return 0;
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    const code = err instanceof CliError ? err.code : "failed";
    process.stderr.write(JSON.stringify({ error: { code, message } }) + "\n");
    return err instanceof CliError ? err.exitCode : 1;
  }
}

function fitLabModel(file: StoredFitModel & StoredFitSpec): number {
  try {
    const result = fitStoredModel(file, file);
    process.stdout.write(JSON.stringify({ kinetics: file.kinetics, ...result }) + "\n");
    return 0;
  } catch (err) {
    const e = err as { field?: string; message?: string };
    process.stderr.write(`${prefixField(e.field, e.message ?? String(err))}\n`);
    return 2;
  }
}

async function main(): Promise<number> {
  const file = specPath();
  const spec = JSON.parse(readFileSync(file, "utf8")) as StoredFitModel & StoredFitSpec;
  return spec.definition ? fitLabModel(spec) : fitCatalogueModel(file);
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    process.stderr.write(`${err instanceof Error ? err.message : String(err)}\n`);
    process.exit(2);
  },
);
