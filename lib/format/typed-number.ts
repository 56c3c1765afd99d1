/**
 * A number as a person types it into a form field. Many labs write decimals with a comma
 * ("0,65"); that is read as 0.65 where it cannot mean anything else — one comma, no point,
 * digits on both sides, and not three digits after a non-zero whole part ("1,000" could be a
 * thousand written the English way). Anything else with a comma is refused with a message that
 * says to use a point, never guessed. Pure: used by the forms in the browser and by the API's
 * form fields (uploads, batches).
 */

export type TypedNumber = { ok: true; value: number } | { ok: false; message: string };

const PLAIN = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^([+-]?)(\d+),(\d+)((?:[eE][+-]?\d+)?)$/;

export const USE_A_POINT = "use a point for decimals (e.g. 0.65)";

/** Reads `text` ("0.65", "0,65", " 1e-3 ", "−2") as a finite number, or says what is wrong. */
export function parseTypedNumber(text: string): TypedNumber {
  // A typographic minus (U+2212) is what a copied value from a paper often carries.
  const s = text.trim().replace(/^\u2212/, "-");
  if (s === "") return { ok: false, message: "enter a number" };
  const comma = DECIMAL_COMMA.exec(s);
  if (comma) {
    const [, sign, whole, fraction, exponent] = comma;
    if (fraction.length === 3 && Number(whole) !== 0) {
      return {
        ok: false,
        message: `“${text.trim()}” could be a thousands separator or a decimal comma; ${USE_A_POINT}`,
      };
    }
    return { ok: true, value: Number(`${sign}${whole}.${fraction}${exponent}`) };
  }
  if (s.includes(",")) return { ok: false, message: `“${text.trim()}” is not one number; ${USE_A_POINT}` };
  if (!PLAIN.test(s)) return { ok: false, message: `“${text.trim()}” is not a number` };
  const value = Number(s);
  if (!Number.isFinite(value)) return { ok: false, message: `“${text.trim()}” is too large` };
  return { ok: true, value };
}

/**
 * A value of a form field as a number for a JSON body: typed text is read by
 * {@link parseTypedNumber}; what cannot be read is passed on as the text itself, so the server
 * refuses it naming the field (it never becomes a silent NaN or null).
 */
export function typedNumberOrText(text: string): number | string {
  const r = parseTypedNumber(text);
  return r.ok ? r.value : text;
}

/** Like {@link typedNumberOrText}, but an empty field is left out (undefined). */
export function optionalTypedNumber(text: string): number | string | undefined {
  return text.trim() === "" ? undefined : typedNumberOrText(text);
}
