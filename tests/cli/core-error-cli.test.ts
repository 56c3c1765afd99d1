/**
 * The one map from core errors to the command line: every code of every family becomes a
 * CliError with the core's code, the message (field-prefixed for kinetics and fitting, without
 * repeating a field the message already starts with) and exit code 2 (wrong input) or 3 (valid
 * but too large for a readout, or cannot be analysed). The exit codes are those the commands used
 * before (the CLI's own contract, common practice, no source).
 */
import { describe, expect, it } from "vitest";
import { CliError } from "@/lib/cli/command";
import { CORE_ERROR_CLI, toCliError } from "@/lib/cli/core-errors";
import { KineticsInputError } from "@/lib/kinetics";
import { CODE_LISTS, MESSAGE, sampleCoreErrors } from "../lib/errors/core-error-families";

const EXIT_3 = new Set(["readout.too_large", "imaging.too_large", "kinetics.cannot_analyse"]);

describe("core errors → CLI", () => {
  it.each(sampleCoreErrors())("%s.%s maps to a CliError with its code", (family, code, err) => {
    const cli = toCliError(err);
    expect(cli, `${family}.${code} is not mapped`).toBeInstanceOf(CliError);
    const { exitCode, code: cliCode, message } = cli as CliError;
    expect(cliCode).toBe(code);
    expect(exitCode).toBe(EXIT_3.has(`${family}.${code}`) ? 3 : 2);
    expect(message).toBe(family === "kinetics" || family === "fitting" ? `${err.field}: ${MESSAGE}` : MESSAGE);
  });

  it("the table covers exactly the codes each family exports", () => {
    for (const [family, codes] of Object.entries(CODE_LISTS)) {
      const table = CORE_ERROR_CLI[family as keyof typeof CODE_LISTS].exitCode;
      expect(Object.keys(table).sort()).toEqual([...codes].sort());
    }
  });

  it("does not repeat a field the message already starts with", () => {
    const err = new KineticsInputError("parameters.a", "parameters.a must be a finite number (got NaN).");
    expect((toCliError(err) as CliError).message).toBe("parameters.a must be a finite number (got NaN).");
  });

  it("passes a CliError and an unknown error through unchanged", () => {
    const cli = new CliError("Give --spec RUN.json.");
    expect(toCliError(cli)).toBe(cli);
    const boom = new Error("boom");
    expect(toCliError(boom)).toBe(boom);
  });
});
