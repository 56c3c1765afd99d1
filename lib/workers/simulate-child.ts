/**
 * Child-process entry of a verification run: `node --conditions=react-server --import tsx lib/workers/simulate-child.ts
 * --spec RUN.json --out DIR --threads N --progress` runs the command line's `simulate` command
 * (same options, same output files) and prints exactly what `cli simulate … --json` prints: one
 * JSON object on stdout, progress lines on stderr, and on failure one line
 * `{"error": {"code", "message"}}` on stderr with the command's exit code.
 */
import simulate from "../cli/commands/simulate";
import { CliError } from "../cli/command";

async function main(args: string[]): Promise<number> {
  try {
    const result = await simulate.run(args, { json: true });
    process.stdout.write(JSON.stringify(result.json) + "\n");
    return 0;
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    const code = err instanceof CliError ? err.code : "failed";
    process.stderr.write(JSON.stringify({ error: { code, message } }) + "\n");
    return err instanceof CliError ? err.exitCode : 1;
  }
}

main(process.argv.slice(2).filter((a) => a !== "--json")).then((code) => process.exit(code));
