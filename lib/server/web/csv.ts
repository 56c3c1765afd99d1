/**
 * The one CSV writer of the app: every exported cell goes through {@link csvCell}.
 *
 * Formula injection (OWASP "CSV Injection"): a spreadsheet runs a cell that starts with `=`, `+`,
 * `-` or `@` as a formula, and tab or carriage return can hide such a start. Such a cell gets a
 * leading `'`, which spreadsheets read as "this is text" — unless the whole cell is a plain number
 * (`-1.5`, `+2`, `3e-7`): numbers must stay numbers, and a number cannot call anything. "Plain
 * number" is decided on the written text, by {@link PLAIN_NUMBER}, whatever type the value had.
 */
import "server-only";

export type CsvValue = string | number | boolean | null | undefined;

/** A decimal number, optionally signed, optionally with an exponent; nothing else. */
export const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell: prefixed when it would start a formula, quoted when it holds `"`, `,`, a line break or `#`. */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return "";
  let s = String(value);
  if (FORMULA_START.test(s) && !PLAIN_NUMBER.test(s)) s = `'${s}`;
  return /[",\n\r#]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvRow(values: readonly CsvValue[]): string {
  return values.map(csvCell).join(",");
}

/** A `# …` comment line; line breaks in the text become spaces so nothing escapes onto a line of its own. */
export function csvComment(text: string): string {
  return `# ${text.replace(/[\r\n]+/g, " ")}`;
}
