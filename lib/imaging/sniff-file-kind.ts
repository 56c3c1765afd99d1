import { isXlsxEntries, isZip, zipEntries } from "../spacing/zip-entries";

/** What a file is, judged from its bytes (never its name). */
export type FileKind = "png" | "jpeg" | "tiff" | "csv" | "tsv" | "xlsx";

/** A number with a decimal point or a decimal comma ("12.5", "12,5"), as one-column lists hold. */
const LIST_NUMBER = /^[-+]?(\d+[.,]?\d*|[.,]\d+)([eE][-+]?\d+)?$/;

/**
 * Magic bytes (PNG signature, JPEG SOI + marker, TIFF II*\0 / MM\0* incl. BigTIFF) or, for text,
 * valid UTF-8 without NUL bytes whose first lines split consistently on tabs (TSV) or commas /
 * semicolons (CSV); text that is not UTF-8 is read as Windows-1252, as spreadsheet programs save
 * "CSV" in Western European locales. An XLSX workbook is a ZIP holding "[Content_Types].xml" and
 * parts under "xl/" (its central directory when the bytes reach the end, else the local headers
 * in the bytes given). Returns null for anything else.
 */
export function sniffFileKind(bytes: Uint8Array): FileKind | null {
  const b = bytes;
  if (
    b.length >= 8 &&
    b[0] === 0x89 &&
    b[1] === 0x50 &&
    b[2] === 0x4e &&
    b[3] === 0x47 &&
    b[4] === 0x0d &&
    b[5] === 0x0a &&
    b[6] === 0x1a &&
    b[7] === 0x0a
  )
    return "png";
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return "jpeg";
  if (
    b.length >= 4 &&
    ((b[0] === 0x49 && b[1] === 0x49 && (b[2] === 0x2a || b[2] === 0x2b) && b[3] === 0) ||
      (b[0] === 0x4d && b[1] === 0x4d && b[2] === 0 && (b[3] === 0x2a || b[3] === 0x2b)))
  )
    return "tiff";
  if (isZip(b)) return isXlsxEntries(zipEntries(b)) ? "xlsx" : null;
  const head = b.subarray(0, 8192);
  if (head.length === 0 || head.includes(0)) return null;
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(head);
  } catch {
    // a multi-byte character cut at the 8 KiB boundary is still text
    try {
      text = new TextDecoder("utf-8", { fatal: true }).decode(head.subarray(0, head.length - 3));
    } catch {
      text = new TextDecoder("windows-1252").decode(head);
    }
  }
  if (/[\x01-\x08\x0e-\x1f]/.test(text)) return null;
  const lines = text
    .replace(/^\uFEFF/, "")
    .split(/\r\n|\n|\r/)
    .filter((l) => l.trim() !== "")
    .slice(0, 20);
  if (b.length > head.length && lines.length > 1) lines.pop(); // the last line may be cut
  if (lines.length === 0) return null;
  const consistent = (sep: string) => {
    const counts = lines.map((l) => l.split(sep).length - 1);
    return counts[0] > 0 && counts.every((c) => c === counts[0]);
  };
  if (consistent("\t")) return "tsv";
  if (consistent(",") || consistent(";")) return "csv";
  // one column of numbers (a plain spacing list) is a CSV with one field
  if (
    lines.every((l) => /^\s*[-+]?[\p{L}\p{N}_.,µ ()[\]/%-]*\s*$/u.test(l)) &&
    lines.slice(1).every((l) => LIST_NUMBER.test(l.trim()))
  )
    return "csv";
  return null;
}
