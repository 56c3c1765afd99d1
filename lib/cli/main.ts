/**
 * Morphokin command line: `npm run -s cli -- <command> [options] [--json]`.
 *
 * Each command lives in `lib/cli/commands/<name>.ts` and default-exports a {@link CliCommand}.
 * With `--json` a command prints exactly one JSON object on stdout; errors go to stderr with a
 * non-zero exit code.
 */
import { readdirSync } from "node:fs";
import path from "node:path";
import { CliError, type CliCommand } from "./command";
import { toCliError } from "./core-errors";

async function loadCommands(): Promise<Map<string, CliCommand>> {
  const dir = path.join(import.meta.dirname, "commands");
  const commands = new Map<string, CliCommand>();
  for (const file of readdirSync(dir).sort()) {
    if (!file.endsWith(".ts") || file.endsWith(".d.ts")) continue;
    const mod = (await import(path.join(dir, file))) as { default: CliCommand | CliCommand[] };
    const list = Array.isArray(mod.default) ? mod.default : [mod.default];
    for (const c of list) commands.set(c.name, c);
  }
  return commands;
}

function printHelp(commands: Map<string, CliCommand>) {
  const lines = [
    "Morphokin command line",
    "",
    "Usage: npm run -s cli -- <command> [options] [--json]",
    "",
    "Commands:",
  ];
  for (const c of [...commands.values()].sort((a, b) => a.name.localeCompare(b.name))) {
    lines.push(`  ${c.name.padEnd(16)} ${c.summary}`);
  }
  lines.push("", "Run `npm run -s cli -- <command> --help` for the options of one command.");
  process.stdout.write(lines.join("\n") + "\n");
}

async function main(argv: string[]) {
  const commands = await loadCommands();
  const [name, ...rest] = argv;
  if (!name || name === "--help" || name === "-h" || name === "help") {
    printHelp(commands);
    return 0;
  }
  const command = commands.get(name);
  if (!command) {
    process.stderr.write(`error: unknown command "${name}". Run with --help to list the commands.\n`);
    return 2;
  }
  if (rest.includes("--help") || rest.includes("-h")) {
    process.stdout.write(command.help.trimEnd() + "\n");
    return 0;
  }
  const json = rest.includes("--json");
  try {
    const result = await command.run(
      rest.filter((a) => a !== "--json"),
      { json },
    );
    if (json) process.stdout.write(JSON.stringify(result.json) + "\n");
    else process.stdout.write((result.text ?? JSON.stringify(result.json, null, 2)).trimEnd() + "\n");
    return result.exitCode ?? 0;
  } catch (thrown) {
    // A core error a command did not catch still gets its code and exit code, never "failed".
    const err = toCliError(thrown);
    const message = err instanceof Error ? err.message : String(err);
    if (json)
      process.stderr.write(
        JSON.stringify({ error: { code: err instanceof CliError ? err.code : "failed", message } }) + "\n",
      );
    else process.stderr.write(`error: ${message}\n`);
    return err instanceof CliError ? err.exitCode : 1;
  }
}

main(process.argv.slice(2)).then((code) => process.exit(code));
