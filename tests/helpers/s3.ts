// A local S3-compatible fake (s3rver) on 127.0.0.1 with a throwaway folder, for storage tests.
import { mkdtemp, rm } from "node:fs/promises";
import { createRequire } from "node:module";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

interface S3rverOptions {
  address: string;
  port: number;
  silent: boolean;
  directory: string;
  configureBuckets: { name: string }[];
}
interface S3rverInstance {
  run(): Promise<AddressInfo>;
  close(): Promise<void>;
}
type S3rverClass = new (options: S3rverOptions) => S3rverInstance;

// s3rver ships no type declarations: load it through require and give it the shape used here.
const S3rver: S3rverClass = createRequire(import.meta.url)("s3rver");

export interface FakeS3 {
  endpoint: string;
  bucket: string;
  /** The environment variables that point Equipot at this fake. */
  env: Record<string, string>;
  close: () => Promise<void>;
}

export async function startFakeS3(bucket = "equipot-test"): Promise<FakeS3> {
  const directory = await mkdtemp(join(tmpdir(), "equipot-s3rver-"));
  const server = new S3rver({
    address: "127.0.0.1",
    port: 0,
    silent: true,
    directory,
    configureBuckets: [{ name: bucket }],
  });
  const address = await server.run();
  const endpoint = `http://127.0.0.1:${address.port}`;
  return {
    endpoint,
    bucket,
    env: {
      STORAGE_DRIVER: "s3",
      S3_ENDPOINT: endpoint,
      S3_REGION: "us-east-1",
      S3_BUCKET: bucket,
      // s3rver's fixed credentials.
      S3_ACCESS_KEY_ID: "S3RVER",
      S3_SECRET_ACCESS_KEY: "S3RVER",
      S3_FORCE_PATH_STYLE: "true",
    },
    close: async () => {
      await server.close();
      await rm(directory, { recursive: true, force: true });
    },
  };
}
