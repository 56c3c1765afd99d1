/** The shape every command in `lib/cli/commands/` default-exports. */
export interface CliCommand {
  /** The word typed after `cli`, e.g. `dispersion`. */
  name: string;
  /** One line for the command list. */
  summary: string;
  /** Full `--help` text: every option, its unit and default. */
  help: string;
  /**
   * `args` are the words after the command name, without `--json`. `exitCode`: the output is
   * printed and the process still ends non-zero (a folder read in which some files failed).
   */
  run(args: string[], ctx: { json: boolean }): Promise<{ json: unknown; text?: string; exitCode?: number }>;
}

/** An error the user caused (bad option, unreadable file): printed without a stack trace. */
export class CliError extends Error {
  constructor(
    message: string,
    public code = "bad_input",
    public exitCode = 2,
  ) {
    super(message);
  }
}

/**
 * Minimal `--name value` / `--flag` parser shared by the commands.
 * Returns the options and the positional words; an option given twice keeps the last value.
 */
export function parseOptions(
  args: string[],
  flags: string[] = [],
): { options: Record<string, string | true>; positional: string[] } {
  const options: Record<string, string | true> = {};
  const positional: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a.startsWith("--")) {
      const eq = a.indexOf("=");
      if (eq > 0) {
        options[a.slice(2, eq)] = a.slice(eq + 1);
      } else if (flags.includes(a.slice(2)) || i + 1 >= args.length || args[i + 1].startsWith("--")) {
        options[a.slice(2)] = true;
      } else {
        options[a.slice(2)] = args[++i];
      }
    } else positional.push(a);
  }
  return { options, positional };
}
