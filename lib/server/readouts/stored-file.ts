/**
 * The stored original of a readout, brought to a file in the job's temporary folder: streamed from
 * the object store, its SHA-256 computed on the way, so a 1.8 GB slide scan is never held in
 * memory (issue 13: a readout's peak memory ≤ 1 GiB). The folder (prefix "morphokin-readout-", swept
 * at start-up by jobs/temp-folders.ts if a killed process left it) is the caller's to remove.
 */
import "server-only";
import { createHash } from "node:crypto";
import { createWriteStream } from "node:fs";
import path from "node:path";
import { Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ObjectStore } from "@/storage/object-store";
import { AppError } from "../errors";
import { JobCancelledError } from "../jobs/types";
import { checkRoomFor, gib } from "../uploads/disk-space";

/**
 * Streams the object to `<dir>/input`, checking its SHA-256 against the one recorded at upload.
 * Returns the file's path.
 * @throws AppError conflict (the stored file changed), too_large (no room on disk); JobCancelledError
 */
export async function fetchStoredFile(
  store: ObjectStore,
  key: string,
  dir: string,
  expected: { sha256: string; sizeBytes: number },
  signal: AbortSignal,
): Promise<string> {
  checkRoomFor(
    expected.sizeBytes,
    dir,
    "reading this upload",
    "ask the lab's server administrator to free disk space, then start the readout again",
  );
  const file = path.join(dir, "input");
  const hash = createHash("sha256");
  const { body } = await store.get(key);
  const hashing = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      done(null, chunk);
    },
  });
  try {
    await pipeline(body, hashing, createWriteStream(file), { signal });
  } catch (err) {
    if (signal.aborted) throw new JobCancelledError();
    if ((err as { code?: string }).code === "ENOSPC")
      throw new AppError(
        "too_large",
        `the server's disk filled up while this upload (${gib(expected.sizeBytes)}) was being read; ask the lab's server administrator to free disk space, then start the readout again`,
      );
    throw err;
  }
  const digest = hash.digest("hex");
  if (digest !== expected.sha256)
    throw new AppError(
      "conflict",
      `the stored file's SHA-256 (${digest.slice(0, 12)}…) differs from the one recorded at upload (${expected.sha256.slice(0, 12)}…); the original was changed or damaged`,
    );
  return file;
}
