/**
 * The one map from a core error to what the command line prints: a CliError with the core's code,
 * the message, and an exit code (2: the input is wrong; 3: the input is valid but too large or
 * cannot be analysed). Every command's catch and `main.ts` go through `toCliError`.
 *
 * Typed over every code each family exports, like the HTTP table (`lib/server/core-errors.ts`),
 * so a new code without an exit code fails the type check and `tests/cli/core-error-cli.test.ts`.
 */
import { isCoreError, prefixField, type CoreError, type CoreErrorFamily } from "../errors";
import { CliError } from "./command";
import type { CodesByFamily } from "../errors/codes-by-family";

type ExitCode = 2 | 3;

interface CliMapping<C extends string> {
  exitCode: Record<C, ExitCode>;
  /**
   * Put "field: " before the message. Kinetics and fitting messages are often fragments that
   * need their field ("must be positive"); the other families write whole sentences.
   */
  namesField: boolean;
}

export const CORE_ERROR_CLI: { [F in CoreErrorFamily]: CliMapping<CodesByFamily[F]> } = {
  readout: {
    exitCode: { zero_area_roi: 2, missing_pixel_size: 2, no_variation: 2, too_large: 3, bad_option: 2, too_small: 2 },
    namesField: false,
  },
  imaging: { exitCode: { too_large: 3, corrupt: 2, unsupported: 2, bad_option: 2 }, namesField: false },
  spacing: { exitCode: { bad_table: 2 }, namesField: false },
  kinetics: { exitCode: { bad_input: 2, too_large: 2, cannot_analyse: 3 }, namesField: true },
  fitting: { exitCode: { bad_option: 2, bad_data: 2, no_turing_region: 2 }, namesField: true },
  simulation: { exitCode: { bad_option: 2 }, namesField: false },
  synthetic: { exitCode: { bad_option: 2 }, namesField: false },
};

function mapCoreError(err: CoreError): CliError | null {
  const mapping = CORE_ERROR_CLI[err.family] as CliMapping<string> | undefined;
  const exitCode = mapping?.exitCode[err.code];
  if (!mapping || !exitCode) return null;
  const message = mapping.namesField ? prefixField(err.field, err.message) : err.message;
  return new CliError(message, err.code, exitCode);
}

/** The CliError for `err` (a CliError as it is, a core error by the table); anything else passes through unchanged. */
export function toCliError(err: unknown): unknown {
  if (err instanceof CliError) return err;
  return (isCoreError(err) && mapCoreError(err)) || err;
}
