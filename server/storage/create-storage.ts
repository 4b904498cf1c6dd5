// Chooses the storage driver from the configuration (STORAGE_DRIVER).
import type { Config } from "../config";
import { createDiskStorage } from "./disk";
import type { Storage } from "./storage";

function required(config: Config, name: keyof Config): string {
  const value = config[name];
  // parseConfig already refuses this; kept so a hand-built Config fails just as clearly.
  if (typeof value !== "string" || !value) throw new Error(`${name} is required for S3 storage`);
  return value;
}

/** The AWS SDK is loaded only when the S3 driver is chosen: it adds about half a second to start-up. */
export async function createStorage(config: Config): Promise<Storage> {
  if (config.STORAGE_DRIVER === "disk") return createDiskStorage(config.STORAGE_DIR);
  const { createS3Storage } = await import("./s3");
  return createS3Storage({
    endpoint: config.S3_ENDPOINT,
    region: required(config, "S3_REGION"),
    bucket: required(config, "S3_BUCKET"),
    accessKeyId: required(config, "S3_ACCESS_KEY_ID"),
    secretAccessKey: required(config, "S3_SECRET_ACCESS_KEY"),
    forcePathStyle: config.S3_FORCE_PATH_STYLE === "true",
  });
}
