// S3 driver over the AWS SDK; works with AWS and S3-compatible services (path-style when asked).
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { Readable } from "node:stream";
import { assertKey, StorageError, type Storage } from "./storage";

export interface S3StorageOptions {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
}

function statusOf(err: unknown): number | undefined {
  if (!(err instanceof Error) || !("$metadata" in err)) return undefined;
  const metadata: unknown = err.$metadata;
  if (typeof metadata !== "object" || metadata === null || !("httpStatusCode" in metadata))
    return undefined;
  return typeof metadata.httpStatusCode === "number" ? metadata.httpStatusCode : undefined;
}

const isMissing = (err: unknown) =>
  statusOf(err) === 404 ||
  (err instanceof Error && (err.name === "NotFound" || err.name === "NoSuchKey"));

function unavailable(err: unknown): StorageError {
  const reason = err instanceof Error ? err.name : "unknown error";
  return new StorageError("unavailable", `The S3 storage failed (${reason})`, { cause: err });
}

export function createS3Storage(options: S3StorageOptions): Storage {
  const client = new S3Client({
    endpoint: options.endpoint,
    region: options.region,
    forcePathStyle: options.forcePathStyle,
    credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
    // Many S3-compatible services do not accept the SDK's default trailing checksums.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  const Bucket = options.bucket;

  return {
    async put(key, body, { contentType, sizeBytes }) {
      const command = new PutObjectCommand({
        Bucket,
        Key: assertKey(key),
        Body: body,
        ContentType: contentType,
        ContentLength: sizeBytes,
      });
      await client.send(command).catch((err: unknown) => {
        throw unavailable(err);
      });
    },
    async get(key) {
      const Key = assertKey(key);
      try {
        const out = await client.send(new GetObjectCommand({ Bucket, Key }));
        if (!(out.Body instanceof Readable)) throw new Error("S3 returned no readable body");
        return { stream: out.Body, sizeBytes: out.ContentLength ?? 0 };
      } catch (err) {
        if (isMissing(err)) return undefined;
        throw unavailable(err);
      }
    },
    async exists(key) {
      const Key = assertKey(key);
      try {
        await client.send(new HeadObjectCommand({ Bucket, Key }));
        return true;
      } catch (err) {
        if (isMissing(err)) return false;
        throw unavailable(err);
      }
    },
    async delete(key) {
      await client
        .send(new DeleteObjectCommand({ Bucket, Key: assertKey(key) }))
        .catch((err: unknown) => {
          throw unavailable(err);
        });
    },
  };
}
