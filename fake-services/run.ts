/**
 * Starts the local stand-ins on 127.0.0.1 and keeps them running until stopped:
 * S3-compatible storage (default port 4569) and SMTP capture (2525, listing on HTTP 2526).
 * Ports and folders come from the same environment variables the app reads (README).
 */
import path from "node:path";
import { startFakeS3 } from "./fake-s3";
import { startFakeSmtp } from "./fake-smtp";

function port(url: string | undefined, fallback: number): number {
  if (!url) return fallback;
  const p = new URL(url).port;
  return p ? Number(p) : fallback;
}

async function main() {
  const dataDir = path.resolve(process.env.MORPHOKIN_DATA_DIR ?? "storage/data");
  const s3 = await startFakeS3({
    port: port(process.env.S3_ENDPOINT, 4569),
    directory: path.join(dataDir, "s3"),
    bucket: process.env.S3_BUCKET ?? "morphokin-dev",
  });
  const mail = await startFakeSmtp({
    smtpPort: port(process.env.SMTP_URL, 2525),
    httpPort: port(process.env.DEV_MAILBOX_URL, 2526),
    directory: path.join(dataDir, "mail"),
  });
  process.stdout.write(`fake services ready (storage in ${dataDir})\n`);
  const stop = async () => {
    await Promise.allSettled([s3.close(), mail.close()]);
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  process.stderr.write(`fake services failed to start: ${err instanceof Error ? err.message : err}\n`);
  process.exit(1);
});
