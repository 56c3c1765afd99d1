/**
 * The names and unpacked sizes of the files in a ZIP archive (PKWARE APPNOTE 6.3.x, §4.3), read
 * from its central directory when the bytes reach the end of the archive, else from the local
 * file headers found in the bytes given (the first kilobytes of an upload). No data is unpacked.
 */

export interface ZipEntry {
  name: string;
  /** 0 when a local header defers its sizes to a data descriptor. */
  uncompressedBytes: number;
}

const LOCAL = 0x04034b50,
  CENTRAL = 0x02014b50,
  END = 0x06054b50;

/** True when the bytes start like a ZIP archive ("PK\x03\x04"). */
export function isZip(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 3 && bytes[3] === 4;
}

function fromCentralDirectory(view: DataView, bytes: Uint8Array): ZipEntry[] | null {
  const stop = Math.max(0, bytes.length - 22 - 65535);
  for (let p = bytes.length - 22; p >= stop; p--) {
    if (view.getUint32(p, true) !== END) continue;
    const count = view.getUint16(p + 10, true);
    let q = view.getUint32(p + 16, true);
    if (count === 0xffff || q === 0xffffffff) return null; // ZIP64: left to the local headers
    const out: ZipEntry[] = [];
    for (let i = 0; i < count; i++) {
      if (q + 46 > bytes.length || view.getUint32(q, true) !== CENTRAL) return null;
      const nameLength = view.getUint16(q + 28, true);
      const name = new TextDecoder().decode(bytes.subarray(q + 46, q + 46 + nameLength));
      out.push({ name, uncompressedBytes: view.getUint32(q + 24, true) });
      q += 46 + nameLength + view.getUint16(q + 30, true) + view.getUint16(q + 32, true);
    }
    return out;
  }
  return null;
}

/** The entries of the archive the bytes start (all of them when the bytes hold its end). */
export function zipEntries(bytes: Uint8Array): ZipEntry[] {
  if (!isZip(bytes)) return [];
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const central = bytes.length >= 22 ? fromCentralDirectory(view, bytes) : null;
  if (central) return central;
  // Local headers may defer their sizes, so they cannot be walked from one to the next: look for
  // each header's signature instead (a false match inside packed data would only add a name).
  const out: ZipEntry[] = [];
  for (let p = 0; p + 30 <= bytes.length; p++) {
    if (bytes[p] !== 0x50 || view.getUint32(p, true) !== LOCAL) continue;
    const nameLength = view.getUint16(p + 26, true);
    if (p + 30 + nameLength > bytes.length) break;
    out.push({
      name: new TextDecoder().decode(bytes.subarray(p + 30, p + 30 + nameLength)),
      uncompressedBytes: view.getUint32(p + 22, true),
    });
    p += 29 + nameLength;
  }
  return out;
}

/** An Office Open XML workbook: a ZIP with "[Content_Types].xml" and a workbook part under "xl/". */
export function isXlsxEntries(entries: ZipEntry[]): boolean {
  return (
    entries.some((e) => e.name === "[Content_Types].xml") &&
    entries.some((e) => e.name === "xl/workbook.xml" || e.name.startsWith("xl/"))
  );
}
