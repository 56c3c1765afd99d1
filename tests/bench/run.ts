/**
 * `npm run bench`: runs every `tests/bench/*.bench.ts` (or the ones named on the command line)
 * and prints a table of figures. Each bench file default-exports an async function returning rows.
 * Benchmarks measure; they never fail a build. Targets are printed beside the figures.
 * `file:part` runs one part of a file that has parts (`npm run bench -- side-by-side:readout`).
 */
import { readdirSync } from "node:fs";
import path from "node:path";

export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  target?: string;
  note?: string;
}

async function main() {
  const dir = import.meta.dirname;
  const only = process.argv.slice(2).map((a) => a.split(":")[0]);
  const partsOf = (f: string) =>
    process.argv
      .slice(2)
      .filter((a) => a.includes(":") && f.includes(a.split(":")[0]))
      .map((a) => a.split(":")[1]);
  const files = readdirSync(dir)
    .filter((f) => f.endsWith(".bench.ts"))
    .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
    .sort();
  const rows: BenchRow[] = [];
  for (const f of files) {
    const mod = (await import(path.join(dir, f))) as { default: (parts?: string[]) => Promise<BenchRow[]> };
    process.stderr.write(`running ${f} …\n`);
    rows.push(...(await mod.default(partsOf(f))));
  }
  const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toPrecision(3));
  console.log(["benchmark".padEnd(58), "value".padStart(12), "unit".padEnd(12), "target"].join(" "));
  for (const r of rows) {
    console.log(
      [
        r.name.padEnd(58),
        fmt(r.value).padStart(12),
        r.unit.padEnd(12),
        r.target ?? "",
        r.note ? `(${r.note})` : "",
      ].join(" "),
    );
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
