/**
 * Multipart uploads streamed through formidable to a temporary folder, with a size limit and the
 * SHA-256 computed while streaming. Returns one file and the text fields.
 *
 * Temporary folders live under `<data dir>/tmp/uploads/<pid>-<random>`, not the system temp
 * folder, so the sweep (upload-recovery.ts) knows which are ours and whose: a folder of a process
 * that no longer runs (killed mid-upload) is removed at the next start.
 */
import "server-only";
import { mkdirSync, mkdtempSync, openSync, readSync, closeSync, rmSync } from "node:fs";
import path from "node:path";
import { Readable } from "node:stream";
import formidable, { errors as formidableErrors } from "formidable";
import { AppError } from "../errors";
import { checkRoomFor, gib } from "./disk-space";

export interface ParsedUpload {
  fields: Record<string, string>;
  file: { path: string; originalName: string; sizeBytes: number; sha256: string };
  head: Uint8Array;
  cleanup: () => void;
}

function readHead(file: string, bytes = 8192): Uint8Array {
  const fd = openSync(file, "r");
  try {
    const buf = Buffer.alloc(bytes);
    const n = readSync(fd, buf, 0, bytes, 0);
    return buf.subarray(0, n);
  } finally {
    closeSync(fd);
  }
}

/** The folder every temporary upload folder of this data dir sits in. */
export function uploadTempRoot(dataDir: string): string {
  return path.join(dataDir, "tmp", "uploads");
}

const g = globalThis as unknown as { __morphokinUploadTemps?: Set<string> };
/** This process's temporary upload folders in use now; the sweep never touches them. */
export function activeUploadTemps(): ReadonlySet<string> {
  return (g.__morphokinUploadTemps ??= new Set());
}

/** The most files one request may carry before formidable stops reading (only to name the count). */
const MAX_FILES_COUNTED = 10;

export async function parseUpload(request: Request, maxBytes: number, tempRoot: string): Promise<ParsedUpload> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data"))
    throw new AppError("bad_input", "send the file as multipart/form-data with the field name `file`");
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes + 64 * 1024)
    throw new AppError(
      "too_large",
      `the file is too large: the limit is ${maxBytes} bytes (${(maxBytes / 1048576).toFixed(0)} MiB)`,
    );
  if (!request.body) throw new AppError("bad_input", "the request has no body");
  mkdirSync(tempRoot, { recursive: true });
  // The file is streamed to disk (never held whole in memory): it must fit there first.
  if (declared > 0)
    checkRoomFor(
      declared,
      tempRoot,
      `this upload (${gib(declared)})`,
      "try again later, or ask the lab's server administrator to free disk space",
    );
  const dir = mkdtempSync(path.join(tempRoot, `${process.pid}-`));
  const active = activeUploadTemps() as Set<string>;
  active.add(dir);
  const cleanup = () => {
    rmSync(dir, { recursive: true, force: true });
    active.delete(dir);
  };
  const stream = Readable.fromWeb(request.body as import("node:stream/web").ReadableStream) as Readable & {
    headers?: Record<string, string>;
  };
  stream.headers = Object.fromEntries(request.headers.entries());
  // formidable skips parsing when it sees no length; a chunked body is still limited by maxFileSize.
  stream.headers["content-length"] ??= String(maxBytes);
  try {
    const [fields, files] = await formidable({
      uploadDir: dir,
      // More than one file is refused below with its count; the total size limit still holds.
      maxFiles: MAX_FILES_COUNTED,
      maxFileSize: maxBytes,
      maxTotalFileSize: maxBytes,
      maxFields: 20,
      maxFieldsSize: 64 * 1024,
      allowEmptyFiles: false,
      minFileSize: 1,
      hashAlgorithm: "sha256",
    }).parse(stream as never);
    const sent = Object.values(files).reduce((n, l) => n + (l?.length ?? 0), 0);
    if (sent > 1) throw new AppError("bad_input", `send one file per upload; this request had ${sent} files`);
    const list = files.file ?? [];
    if (list.length === 0) throw new AppError("bad_input", "no file was sent: use the form field name `file`");
    const f = list[0];
    const flat: Record<string, string> = {};
    for (const [k, v] of Object.entries(fields)) if (v && v.length) flat[k] = String(v[0]);
    return {
      fields: flat,
      file: {
        path: f.filepath,
        originalName: (f.originalFilename ?? "upload").slice(0, 255),
        sizeBytes: f.size,
        sha256: String(f.hash),
      },
      head: readHead(f.filepath),
      cleanup,
    };
  } catch (err) {
    cleanup();
    if (err instanceof AppError) throw err;
    const e = err as { code?: number; httpCode?: number; message?: string };
    // Before the size check: formidable gives "too many files" the HTTP code 413 too.
    if (e.code === formidableErrors.maxFilesExceeded)
      throw new AppError(
        "bad_input",
        `send one file per upload; this request had more than ${MAX_FILES_COUNTED} files`,
      );
    if (
      e.code === formidableErrors.biggerThanMaxFileSize ||
      e.code === formidableErrors.biggerThanTotalMaxFileSize ||
      e.httpCode === 413
    ) {
      throw new AppError(
        "too_large",
        `the file is too large: the limit is ${maxBytes} bytes (${(maxBytes / 1048576).toFixed(0)} MiB)`,
      );
    }
    if ((e as { code?: unknown }).code === "ENOSPC")
      throw new AppError(
        "too_large",
        "the server's disk filled up while the file was being received, so it was not saved; try again later, or ask the lab's server administrator to free disk space",
      );
    if (e.code === formidableErrors.smallerThanMinFileSize || e.code === formidableErrors.noEmptyFiles) {
      throw new AppError("bad_input", "the file is empty (0 bytes)");
    }
    throw new AppError("bad_input", `the upload could not be read: ${e.message ?? "malformed multipart body"}`);
  }
}
