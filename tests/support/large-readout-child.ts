/**
 * Runs one image readout (runImageReadout, as the readout child process does) on a file and prints
 * the result's headline numbers with the process's peak resident memory, so a test can measure the
 * memory of a readout alone:
 *
 *   node --conditions=react-server --import tsx tests/support/large-readout-child.ts FILE SETTINGS_JSON
 */
import { readFileSync } from "node:fs";
import { runImageReadout } from "@/lib/server/readouts/image";
import type { StoredImageSettings } from "@/lib/server/readouts/settings";

const [file, settingsJson] = process.argv.slice(2);
const settings = JSON.parse(settingsJson) as StoredImageSettings;
async function main() {
  const out = await runImageReadout(readFileSync(file), settings, async () => undefined);
  const w = out.result.wavelength;
  process.stdout.write(
    JSON.stringify({
      wavelengthPx: w.wavelengthPx,
      wavelengthUm: w.wavelengthUm,
      symmetry: w.symmetry,
      periodFound: w.periodFound,
      warnings: w.warnings,
      image: out.result.image,
      preview: out.result.preview,
      // resourceUsage().maxRSS is in KiB (Node.js documentation, process.resourceUsage).
      maxRssBytes: process.resourceUsage().maxRSS * 1024,
    }) + "\n",
  );
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
