/** The object-storage port the app uses for originals and derived products. */
export interface ObjectStore {
  put(
    key: string,
    body: Buffer | NodeJS.ReadableStream,
    options: { contentType: string; contentLength?: number; sha256Hex?: string },
  ): Promise<void>;
  get(key: string): Promise<{ body: NodeJS.ReadableStream; contentLength?: number; contentType?: string }>;
  getBuffer(key: string): Promise<Buffer>;
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /** Every object whose key starts with `prefix`, with its last-modified time (the sweep's input). */
  list(prefix: string): Promise<{ key: string; lastModified: Date }[]>;
  /** Throws when the store cannot be reached or the bucket is missing. */
  check(): Promise<void>;
}

export class StorageUnavailableError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "StorageUnavailableError";
  }
}
