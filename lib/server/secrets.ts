/** Random secrets and their hashes (API tokens, invitation links). Only hashes are stored. */
import "server-only";
import { createHash, randomBytes } from "node:crypto";

export function newSecret(prefix: string, bytes = 24): string {
  return `${prefix}_${randomBytes(bytes).toString("base64url")}`;
}

export function sha256Hex(value: string | Buffer): string {
  return createHash("sha256").update(value).digest("hex");
}
