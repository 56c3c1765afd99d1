/**
 * Multipart uploads streamed through formidable to a temporary folder, with a size limit and the
 * SHA-256 computed while streaming. Returns one file and the text fields.
 */
import { mkdtempSync, openSync, readSync, closeSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Readable } from "node:stream";
import formidable, { errors as formidableErrors } from "formidable";
import { AppError } from "./errors";

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

export async function parseUpload(request: Request, maxBytes: number): Promise<ParsedUpload> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) throw new AppError("bad_input", "send the file as multipart/form-data with the field name `file`");
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes + 64 * 1024) throw new AppError("too_large", `the file is too large: the limit is ${maxBytes} bytes (${(maxBytes / 1048576).toFixed(0)} MiB)`);
  if (!request.body) throw new AppError("bad_input", "the request has no body");
  const dir = mkdtempSync(path.join(tmpdir(), "morphokin-upload-"));
  const cleanup = () => rmSync(dir, { recursive: true, force: true });
  const stream = Readable.fromWeb(request.body as import("node:stream/web").ReadableStream) as Readable & { headers?: Record<string, string> };
  stream.headers = Object.fromEntries(request.headers.entries());
  // formidable skips parsing when it sees no length; a chunked body is still limited by maxFileSize.
  stream.headers["content-length"] ??= String(maxBytes);
  try {
    const [fields, files] = await formidable({
      uploadDir: dir,
      maxFiles: 1,
      maxFileSize: maxBytes,
      maxTotalFileSize: maxBytes,
      maxFields: 20,
      maxFieldsSize: 64 * 1024,
      allowEmptyFiles: false,
      minFileSize: 1,
      hashAlgorithm: "sha256",
    }).parse(stream as never);
    const list = files.file ?? [];
    if (list.length === 0) throw new AppError("bad_input", "no file was sent: use the form field name `file`");
    const f = list[0];
    const flat: Record<string, string> = {};
    for (const [k, v] of Object.entries(fields)) if (v && v.length) flat[k] = String(v[0]);
    return {
      fields: flat,
      file: { path: f.filepath, originalName: (f.originalFilename ?? "upload").slice(0, 255), sizeBytes: f.size, sha256: String(f.hash) },
      head: readHead(f.filepath),
      cleanup,
    };
  } catch (err) {
    cleanup();
    if (err instanceof AppError) throw err;
    const e = err as { code?: number; httpCode?: number; message?: string };
    if (e.code === formidableErrors.biggerThanMaxFileSize || e.code === formidableErrors.biggerThanTotalMaxFileSize || e.httpCode === 413) {
      throw new AppError("too_large", `the file is too large: the limit is ${maxBytes} bytes (${(maxBytes / 1048576).toFixed(0)} MiB)`);
    }
    if (e.code === formidableErrors.smallerThanMinFileSize || e.code === formidableErrors.noEmptyFiles) {
      throw new AppError("bad_input", "the file is empty (0 bytes)");
    }
    if (e.code === formidableErrors.maxFilesExceeded) throw new AppError("bad_input", "send one file per upload");
    throw new AppError("bad_input", `the upload could not be read: ${e.message ?? "malformed multipart body"}`);
  }
}
