/**
 * Judge a file's type by its first bytes, never by its name: images by their magic numbers
 * (PNG, JPEG, TIFF incl. BigTIFF), tables as UTF-8 text with commas or tabs.
 */
export type FileKind = "png" | "jpeg" | "tiff" | "csv" | "tsv";

export const CONTENT_TYPES: Record<FileKind, string> = {
  png: "image/png",
  jpeg: "image/jpeg",
  tiff: "image/tiff",
  csv: "text/csv",
  tsv: "text/tab-separated-values",
};

export function isImageKind(kind: FileKind): boolean {
  return kind === "png" || kind === "jpeg" || kind === "tiff";
}

const startsWith = (b: Uint8Array, sig: number[]) => sig.every((v, i) => b[i] === v);

/** `head` is the first bytes of the file (8 KiB is plenty). Returns null for anything else. */
export function sniffFileKind(head: Uint8Array): FileKind | null {
  if (head.length === 0) return null;
  if (startsWith(head, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "png";
  if (startsWith(head, [0xff, 0xd8, 0xff])) return "jpeg";
  if (startsWith(head, [0x49, 0x49, 0x2a, 0x00]) || startsWith(head, [0x4d, 0x4d, 0x00, 0x2a])) return "tiff";
  if (startsWith(head, [0x49, 0x49, 0x2b, 0x00]) || startsWith(head, [0x4d, 0x4d, 0x00, 0x2b])) return "tiff";
  return sniffTable(head);
}

function sniffTable(head: Uint8Array): FileKind | null {
  if (head.includes(0)) return null;
  let text: string;
  try {
    // A multi-byte character may be cut at the end of the head: drop up to 3 trailing bytes.
    text = new TextDecoder("utf-8", { fatal: true }).decode(trimPartialUtf8(head));
  } catch {
    return null;
  }
  const lines = text.replace(/^\uFEFF/, "").split(/\r?\n/).filter((l) => l.trim() !== "");
  if (lines.length === 0) return null;
  const sample = lines.slice(0, 20);
  const tabs = sample.filter((l) => l.includes("\t")).length;
  const commas = sample.filter((l) => l.includes(",") || l.includes(";")).length;
  if (tabs > 0 && tabs >= commas) return "tsv";
  if (commas > 0) return "csv";
  // A single column of numbers (a plain list of spacings) is a valid CSV too.
  return sample.every((l) => /^[\s\w.+\-eE"µ()/]*$/.test(l)) ? "csv" : null;
}

function trimPartialUtf8(b: Uint8Array): Uint8Array {
  let end = b.length;
  for (let i = 1; i <= 3 && end - i >= 0; i++) {
    const byte = b[end - i];
    if ((byte & 0xc0) === 0x80) continue; // continuation byte
    if (byte >= 0xc0) {
      const need = byte >= 0xf0 ? 4 : byte >= 0xe0 ? 3 : 2;
      if (i < need) end -= i;
    }
    break;
  }
  return b.subarray(0, end);
}
