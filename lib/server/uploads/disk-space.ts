/**
 * Room on the server's disk for a file that must sit there for a while (an upload being received,
 * the original of a readout being read): a file that does not fit is refused before a byte is
 * written, with the sizes in the user's words, instead of failing half-way with a full disk.
 */
import "server-only";
import { statfsSync } from "node:fs";
import { AppError } from "../errors";

/** Free space kept on the temporary disk besides the file (design choice: the child's derived products and the system). */
export const TEMP_SPARE_BYTES = 256 * 1024 * 1024;

/** A size as a person reads it: MiB below 1 GiB, else GiB with one decimal. */
export const gib = (bytes: number) =>
  bytes < 2 ** 30 ? `${Math.max(1, Math.round(bytes / 2 ** 20))} MiB` : `${(bytes / 2 ** 30).toFixed(1)} GiB`;

/** Free bytes for an unprivileged process on the disk of `dir`, or null when the system cannot tell. */
export function freeBytesAt(dir: string): number | null {
  try {
    const s = statfsSync(dir);
    return Number(s.bavail) * Number(s.bsize);
  } catch {
    return null;
  }
}

/**
 * Refuses, in the user's words, a file that does not fit on the disk that must hold it for a while.
 * @param what the subject of the sentence, e.g. "reading this upload" or "this upload"
 * @param then what the user can do about it
 * @param free free bytes on that disk (measured when not given)
 * @throws AppError too_large (HTTP 413)
 */
export function checkRoomFor(
  sizeBytes: number,
  dir: string,
  what: string,
  then: string,
  free: number | null = freeBytesAt(dir),
): void {
  if (free === null || sizeBytes + TEMP_SPARE_BYTES <= free) return;
  throw new AppError(
    "too_large",
    `${what} needs ${gib(sizeBytes + TEMP_SPARE_BYTES)} of free disk space on the server (the file is ${gib(sizeBytes)}, plus ${gib(TEMP_SPARE_BYTES)} to work in), but only ${gib(free)} is free now; ${then}`,
  );
}
