/** ObjectStore on any S3-compatible service through @aws-sdk/client-s3. */
import { Readable } from "node:stream";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { StorageUnavailableError, type ObjectStore } from "./object-store";

export interface S3Settings {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
}

function isNetworkError(err: unknown): boolean {
  const e = err as { code?: string; name?: string; cause?: { code?: string }; $metadata?: { httpStatusCode?: number } };
  const code = e?.code ?? e?.cause?.code;
  return (
    code === "ECONNREFUSED" ||
    code === "ECONNRESET" ||
    code === "ETIMEDOUT" ||
    code === "EHOSTUNREACH" ||
    e?.name === "TimeoutError" ||
    (e?.$metadata?.httpStatusCode ?? 0) >= 500
  );
}

export function createS3ObjectStore(settings: S3Settings): ObjectStore {
  const client = new S3Client({
    region: settings.region,
    endpoint: settings.endpoint || undefined,
    forcePathStyle: settings.forcePathStyle,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    maxAttempts: 2,
  });
  const Bucket = settings.bucket;
  const wrap = async <T>(what: string, fn: () => Promise<T>): Promise<T> => {
    try {
      return await fn();
    } catch (err) {
      if (isNetworkError(err))
        throw new StorageUnavailableError(`object storage is unreachable (${what})`, { cause: err });
      throw err;
    }
  };
  return {
    async put(key, body, options) {
      await wrap("put", () =>
        client.send(
          new PutObjectCommand({
            Bucket,
            Key: key,
            Body: body as Buffer,
            ContentType: options.contentType,
            ContentLength: options.contentLength,
            Metadata: options.sha256Hex ? { sha256: options.sha256Hex } : undefined,
          }),
        ),
      );
    },
    async get(key) {
      const out = await wrap("get", () => client.send(new GetObjectCommand({ Bucket, Key: key })));
      return { body: out.Body as Readable, contentLength: out.ContentLength, contentType: out.ContentType };
    },
    async getBuffer(key) {
      const out = await wrap("get", () => client.send(new GetObjectCommand({ Bucket, Key: key })));
      return Buffer.from(await out.Body!.transformToByteArray());
    },
    async delete(key) {
      await wrap("delete", () => client.send(new DeleteObjectCommand({ Bucket, Key: key })));
    },
    async exists(key) {
      try {
        await wrap("head", () => client.send(new HeadObjectCommand({ Bucket, Key: key })));
        return true;
      } catch (err) {
        if ((err as { name?: string }).name === "NotFound") return false;
        throw err;
      }
    },
    async list(prefix) {
      const found: { key: string; lastModified: Date }[] = [];
      let ContinuationToken: string | undefined;
      do {
        const out = await wrap("list", () =>
          client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix, ContinuationToken })),
        );
        for (const o of out.Contents ?? [])
          if (o.Key) found.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) });
        ContinuationToken = out.IsTruncated ? out.NextContinuationToken : undefined;
      } while (ContinuationToken);
      return found;
    },
    async check() {
      await wrap("head bucket", () => client.send(new HeadBucketCommand({ Bucket })));
    },
  };
}
