/** A local S3-compatible server (s3rver) on 127.0.0.1, storing objects in a folder. */
// @ts-expect-error s3rver ships no types
import S3rver from "s3rver";

export async function startFakeS3(options: { port: number; directory: string; bucket: string }) {
  const server = new S3rver({
    address: "127.0.0.1",
    port: options.port,
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket }],
  });
  await server.run();
  return { close: () => server.close() as Promise<void> };
}
