/** A pasted `position,value` table (comma, semicolon or tab; an optional header line) for a gradient profile. */
import "server-only";
import { MAX_GRADIENT_TABLE_ROWS } from "@/lib/contracts/kinetics";
import { AppError } from "../errors";

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

export function parseProfileTable(text: string): { positions: number[]; values: number[] } {
  const positions: number[] = [],
    values: number[] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((raw, i) => {
    const line = raw.trim();
    if (line === "" || line.startsWith("#")) return;
    const cells = line.split(/[,;\t]/).map((c) => c.trim());
    const numeric = cells.length === 2 && NUMBER.test(cells[0]) && NUMBER.test(cells[1]);
    if (!numeric) {
      if (positions.length === 0 && cells.length === 2) return; // a header line such as "position,value"
      throw new AppError(
        "bad_input",
        `profile.text line ${i + 1}: expected two numbers "position,value" (got “${line.slice(0, 60)}”)`,
        { field: "profile.text" },
      );
    }
    positions.push(Number(cells[0]));
    values.push(Number(cells[1]));
  });
  if (positions.length > MAX_GRADIENT_TABLE_ROWS) {
    throw new AppError(
      "too_large",
      `profile.text has ${positions.length} rows; the limit is ${MAX_GRADIENT_TABLE_ROWS}.`,
      { field: "profile.text" },
    );
  }
  if (positions.length < 2)
    throw new AppError("bad_input", "profile.text: give at least two position,value rows", { field: "profile.text" });
  for (let j = 1; j < positions.length; j++) {
    if (!(positions[j] > positions[j - 1])) {
      throw new AppError(
        "bad_input",
        `profile.text: positions must increase from row to row (row ${j + 1} has ${positions[j]} after ${positions[j - 1]})`,
        { field: "profile.text" },
      );
    }
  }
  return { positions, values };
}
