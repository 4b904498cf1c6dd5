// Local-disk driver: each object is written to a temporary file, flushed, then renamed into place,
// so the final path either holds the whole object or does not exist.
import { randomBytes } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdir, open, rename, rm, stat } from "node:fs/promises";
import { dirname, join, resolve } from "node:path";
import { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import { assertKey, errnoCode, toStorageError, type PutOptions, type Storage } from "./storage";

/** Counts bytes so that a body shorter or longer than announced is refused. */
function byteCounter(counted: { bytes: number }): Transform {
  return new Transform({
    transform(chunk: Buffer, _encoding, done) {
      counted.bytes += chunk.length;
      done(null, chunk);
    },
  });
}

async function writeFlushed(path: string, body: Readable | Buffer): Promise<number> {
  const counted = { bytes: 0 };
  const source = Buffer.isBuffer(body) ? Readable.from([body]) : body;
  await pipeline(source, byteCounter(counted), createWriteStream(path, { flags: "wx" }));
  const handle = await open(path, "r");
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
  return counted.bytes;
}

export function createDiskStorage(dir: string): Storage {
  const root = resolve(dir);
  const tmpDir = join(root, ".tmp");
  const pathOf = (key: string) => join(root, ...assertKey(key).split("/"));

  async function put(key: string, body: Readable | Buffer, options: PutOptions): Promise<void> {
    const target = pathOf(key);
    const temp = join(tmpDir, `${randomBytes(12).toString("hex")}.part`);
    try {
      await mkdir(tmpDir, { recursive: true });
      await mkdir(dirname(target), { recursive: true });
      const written = await writeFlushed(temp, body);
      if (written !== options.sizeBytes)
        throw new Error(`Expected ${options.sizeBytes} bytes for ${key}, got ${written}`);
      await rename(temp, target);
    } catch (err) {
      await rm(temp, { force: true });
      throw toStorageError(err);
    }
  }

  return {
    put,
    async get(key) {
      const path = pathOf(key);
      try {
        const { size } = await stat(path);
        return { stream: createReadStream(path), sizeBytes: size };
      } catch (err) {
        if (errnoCode(err) === "ENOENT") return undefined;
        throw toStorageError(err);
      }
    },
    async exists(key) {
      try {
        return (await stat(pathOf(key))).isFile();
      } catch (err) {
        if (errnoCode(err) === "ENOENT") return false;
        throw toStorageError(err);
      }
    },
    async delete(key) {
      await rm(pathOf(key), { force: true }).catch((err: unknown) => {
        throw toStorageError(err);
      });
    },
  };
}
