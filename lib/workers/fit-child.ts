/**
 * Child-process entry for fits of lab kinetics (the command line's `fit` knows only the
 * catalogue): `node --import tsx lib/workers/fit-child.ts --spec FILE` prints exactly one JSON
 * object, `{ kinetics, ...result }` like `cli fit --json`; errors go to stderr with exit code 2.
 */
import { readFileSync } from "node:fs";
import { prefixField } from "../server/web/field-message";
import { fitStoredModel } from "../server/fits/model-run";
import type { StoredFitModel, StoredFitSpec } from "../server/fits/spec-types";

function main() {
  const i = process.argv.indexOf("--spec");
  if (i < 0 || !process.argv[i + 1]) throw new Error("--spec <FIT.json> is required.");
  const file = JSON.parse(readFileSync(process.argv[i + 1], "utf8")) as StoredFitModel & StoredFitSpec;
  const result = fitStoredModel(file, file);
  process.stdout.write(JSON.stringify({ kinetics: file.kinetics, ...result }) + "\n");
}

try {
  main();
} catch (err) {
  const e = err as { field?: string; message?: string };
  process.stderr.write(`${prefixField(e.field, e.message ?? String(err))}\n`);
  process.exit(2);
}
