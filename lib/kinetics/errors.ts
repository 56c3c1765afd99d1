/**
 * Error classes of the kinetics and stability core. Each carries the input `field` it is about
 * and a `code` the API maps to an HTTP status (bad_input → 400, too_large → 413,
 * cannot_analyse → 422).
 */
import { CoreError } from "../errors/core-error";

export const KINETICS_ERROR_CODES = ["bad_input", "too_large", "cannot_analyse"] as const;
export type KineticsErrorCode = (typeof KINETICS_ERROR_CODES)[number];

/** Bad input: a parameter out of range, NaN/∞, an expression that does not parse, … */
export class KineticsInputError extends CoreError<KineticsErrorCode> {
  readonly family = "kinetics";
  declare readonly field: string;
  constructor(field: string, message: string, code: KineticsErrorCode = "bad_input") {
    super(code, message, field);
    this.name = "KineticsInputError";
  }
}

/** A request larger than a documented limit (e.g. a Turing map with too many cells). */
export class KineticsLimitError extends KineticsInputError {
  constructor(field: string, message: string) {
    super(field, message, "too_large");
    this.name = "KineticsLimitError";
  }
}

/** Valid input the model cannot answer: no steady state, a singular matrix, a time limit hit. */
export class KineticsAnalysisError extends CoreError<KineticsErrorCode> {
  readonly family = "kinetics";
  declare readonly field: string;
  constructor(field: string, message: string) {
    super("cannot_analyse", message, field);
    this.name = "KineticsAnalysisError";
  }
}

/** Throws a {@link KineticsInputError} unless `value` is a finite number. */
export function assertFinite(field: string, value: unknown): asserts value is number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new KineticsInputError(field, `${field} must be a finite number (got ${String(value)}).`);
  }
}
