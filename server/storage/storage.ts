// File storage behind one interface: local disk by default, any S3-compatible service when configured.
import type { Readable } from "node:stream";

export interface PutOptions {
  contentType: string;
  sizeBytes: number;
}

export interface StoredObject {
  stream: Readable;
  sizeBytes: number;
}

export interface Storage {
  /** Stores the whole body under key or nothing: a reader never sees a partial object. */
  put(key: string, body: Readable | Buffer, options: PutOptions): Promise<void>;
  /** The object's bytes, or undefined when there is none. */
  get(key: string): Promise<StoredObject | undefined>;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
}

/** "full": no space left (answer 507); "unavailable": anything else the storage refused (503). */
export class StorageError extends Error {
  constructor(
    readonly kind: "full" | "unavailable",
    message: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }
}

const keyPattern =
  /^c\/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\/[0-9a-f]{64}$/;

/** The only form of key the drivers accept: never built from a name the user supplied. */
export function attachmentKey(campaignId: string, sha256: string): string {
  return assertKey(`c/${campaignId.toLowerCase()}/${sha256}`);
}

export function assertKey(key: string): string {
  if (!keyPattern.test(key)) throw new Error(`Refusing a storage key of unexpected form: ${key}`);
  return key;
}

const fullCodes = new Set(["ENOSPC", "EDQUOT", "EFBIG"]);

export function errnoCode(err: unknown): string | undefined {
  const code: unknown = err instanceof Error && "code" in err ? err.code : undefined;
  return typeof code === "string" ? code : undefined;
}

/** File-system failures become StorageErrors; anything else is passed through unchanged. */
export function toStorageError(err: unknown): unknown {
  const code = errnoCode(err);
  if (code && fullCodes.has(code))
    return new StorageError("full", "The file storage is full", { cause: err });
  if (code && /^E[A-Z]+$/.test(code))
    return new StorageError("unavailable", `The file storage failed (${code})`, { cause: err });
  return err;
}
