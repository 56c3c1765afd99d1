/**
 * Child-process entry of a readout, so decoding and FFTs of a large image, or parsing and
 * statistics of a large table, never hold the server's event loop: `node --conditions=react-server --import tsx
 * lib/workers/readout-child.ts --input FILE --settings FILE --out DIR` runs
 * {@link runImageReadout} (settings of kind "image"; writes the derived products into DIR) or
 * {@link runTableReadout} (kind "table"; no derived products),
 * prints the result as one JSON object on stdout and reports progress on stderr as lines
 * `progress {"fraction", "note"}`. A readout error is printed as `error {"code", "message", "details"}`
 * (exit code 2) so the parent can rebuild the same AppError; anything else exits 1 with its stack.
 */
import "server-only";
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { setSpectrumExecutor } from "../fft";
import { startSpectrumThreadsOnDemand } from "../parallel/spectrum-threads";
import { toAppError } from "../server/core-errors";
import { withImageInput } from "./image-file";
import { runImageReadout } from "../server/readouts/image";
import type { StoredImageSettings, StoredReadoutSettings, StoredTableSettings } from "../server/readouts/settings";
import { runTableReadout } from "../server/readouts/table";

function arg(name: string): string {
  const i = process.argv.indexOf(name);
  if (i < 0 || !process.argv[i + 1]) throw new Error(`${name} is required.`);
  return process.argv[i + 1];
}

/**
 * The readout's 2-D FFT and its whole-frame pass on two threads when the parent gives `--threads 2`
 * (the server's default, READOUT_THREADS; bit-identical to one). The thread starts with the first
 * job large enough to be split, so a small image costs none.
 */
function installSpectrumThreads(): void {
  const i = process.argv.indexOf("--threads");
  if (i < 0 || process.argv[i + 1] !== "2") return;
  setSpectrumExecutor(startSpectrumThreadsOnDemand());
}

async function main() {
  installSpectrumThreads();
  const input = arg("--input");
  const settings = JSON.parse(readFileSync(arg("--settings"), "utf8")) as StoredReadoutSettings;
  if (settings.kind === "table") {
    const result = await runTableReadout(readFileSync(input), settings as StoredTableSettings);
    process.stdout.write(JSON.stringify(result) + "\n");
    return;
  }
  const out = arg("--out");
  // A large image is read by ranges from its file, never whole (lib/workers/image-file.ts).
  const r = await withImageInput(input, (image) =>
    runImageReadout(image, settings as StoredImageSettings, async (fraction, note) => {
      process.stderr.write(`progress ${JSON.stringify({ fraction, note })}\n`);
    }),
  );
  for (const [name, body] of Object.entries(r.derived)) writeFileSync(path.join(out, name), body);
  process.stdout.write(JSON.stringify(r.result) + "\n");
}

main().catch((err: unknown) => {
  const app = toAppError(err);
  if (app) {
    process.stderr.write(
      `error ${JSON.stringify({ code: app.code, message: app.message, details: app.details ?? null })}\n`,
    );
    process.exit(2);
  }
  console.error(err);
  process.exit(1);
});
