import { randomUUID } from "node:crypto";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Readable } from "node:stream";
import { text } from "node:stream/consumers";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { createDiskStorage } from "../../server/storage/disk";
import { attachmentKey, type Storage } from "../../server/storage/storage";

let dir: string;
let storage: Storage;
const key = () => attachmentKey(randomUUID(), "ab".repeat(32));
const files = async () =>
  (await readdir(dir, { recursive: true, withFileTypes: true })).filter((e) => e.isFile());

beforeEach(async () => {
  dir = await mkdtemp(join(tmpdir(), "equipot-disk-test-"));
  storage = createDiskStorage(dir);
});
afterEach(async () => {
  await rm(dir, { recursive: true, force: true });
});

/** Sends some bytes, then fails as a dropped connection would. */
function failingMidway(): Readable {
  let sent = false;
  return new Readable({
    read() {
      if (!sent) {
        sent = true;
        this.push(Buffer.alloc(64 * 1024, 1));
      } else this.destroy(new Error("connection lost"));
    },
  });
}

describe("disk storage driver", () => {
  it("stores, reads back, reports and deletes an object", async () => {
    const k = key();
    const bytes = Buffer.from("levelling line L4,setup 12\n");
    expect(await storage.exists(k)).toBe(false);
    await storage.put(k, Readable.from([bytes]), {
      contentType: "text/csv",
      sizeBytes: bytes.length,
    });
    expect(await storage.exists(k)).toBe(true);
    const object = await storage.get(k);
    expect(object?.sizeBytes).toBe(bytes.length);
    expect(object ? await text(object.stream) : "").toBe(bytes.toString());
    await storage.delete(k);
    expect(await storage.get(k)).toBeUndefined();
    expect(await files()).toEqual([]);
  });

  it("leaves no partial file when the stream fails midway", async () => {
    const k = key();
    await expect(
      storage.put(k, failingMidway(), { contentType: "image/png", sizeBytes: 200_000 }),
    ).rejects.toThrow(/connection lost/);
    expect(await storage.exists(k)).toBe(false);
    expect(await files()).toEqual([]);
  });

  it("refuses a body shorter than announced, leaving nothing", async () => {
    const k = key();
    const options = { contentType: "text/csv", sizeBytes: 10 };
    await expect(storage.put(k, Buffer.from("short"), options)).rejects.toThrow(
      /Expected 10 bytes/,
    );
    expect(await files()).toEqual([]);
  });

  it("replaces nothing partially when the same key is written twice", async () => {
    const k = key();
    const bytes = Buffer.alloc(1000, 3);
    const options = { contentType: "text/csv", sizeBytes: bytes.length };
    await Promise.all([storage.put(k, bytes, options), storage.put(k, bytes, options)]);
    const object = await storage.get(k);
    expect(object?.sizeBytes).toBe(bytes.length);
    expect((await files()).map((f) => f.name)).toEqual(["ab".repeat(32)]);
  });

  it.each(["../../etc/passwd", "c/not-a-uuid/abc", `c/${randomUUID()}/${"AB".repeat(32)}`, "/abs"])(
    "refuses the key %s",
    async (bad) => {
      const options = { contentType: "text/csv", sizeBytes: 1 };
      await expect(storage.put(bad, Buffer.from("x"), options)).rejects.toThrow(/storage key/);
      await expect(storage.get(bad)).rejects.toThrow(/storage key/);
      expect(await files()).toEqual([]);
    },
  );
});
