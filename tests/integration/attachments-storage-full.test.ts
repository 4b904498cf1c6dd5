// The tablet's engine (fake-indexeddb, the real HTTP transport) against the real server and
// PostgreSQL whose file storage is full: the disk driver's writes go to /dev/full, which answers
// every write with the kernel's own ENOSPC (and, for "unavailable", to a folder: EISDIR). The
// photo's record and bytes stay on the tablet, its link and the other changes reach the server,
// the person reads that the server's storage is full, and once there is space the bytes are
// stored exactly once.
import { createWriteStream } from "node:fs";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import type { Server } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { and, eq } from "drizzle-orm";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { pino } from "pino";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { z } from "zod";
import { createApp } from "../../server/app";
import { attachmentLinks, attachments, sites } from "../../server/db/schema";
import { createDiskStorage } from "../../server/storage/disk";
import type { Storage } from "../../server/storage/storage";
import { addAttachmentLocally } from "../../src/db/attachment-store";
import { openDatabase, type EquipotDb } from "../../src/db/database";
import { createSiteLocally } from "../../src/db/site-store";
import {
  ApiError,
  serverStorageFullMessage,
  serverStorageUnavailableMessage,
  type ApiErrorCode,
} from "../../src/lib/api-error";
import { createSyncEngine } from "../../src/sync/engine";
import { createHttpTransport } from "../../src/sync/http-transport";
import type { FileTransport } from "../../src/sync/transport";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";

let ctx: TestContext;
let server: Server;
let base: string;
let storageDir: string;
let token: string;
let campaignId: string;
const disk = { state: "full" as "full" | "unavailable" | "ok" };
const puts = { tried: 0, stored: 0 };

/** The disk driver, except that while full its writes meet a device with no space at all. */
function fillableStorage(dir: string): Storage {
  const real = createDiskStorage(dir);
  return {
    ...real,
    async put(key, body, options) {
      if (disk.state === "ok") return real.put(key, body, options);
      const source = Buffer.isBuffer(body) ? Readable.from([body]) : body;
      const target = disk.state === "full" ? "/dev/full" : dir;
      await pipeline(source, createWriteStream(target, { flags: "a" }));
      throw new Error("the write was expected to fail");
    },
  };
}

const site = {
  name: "Scree depot",
  kind: "mountain" as const,
  latitudeDeg: 46.4,
  longitudeDeg: 9.2,
  approxHeightM: 2630,
  notes: "",
};
// A 1×1 PNG: the server decides the type from these bytes.
const tinyPng = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==",
  "base64",
);

function requester() {
  return async <S extends z.ZodType>(
    path: string,
    options: { method?: "GET" | "POST"; body?: unknown; schema: S },
  ) => {
    const res = await fetch(`${base}/api${path}`, {
      method: options.method ?? "GET",
      headers: { "content-type": "application/json", authorization: `Bearer ${token}` },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
    });
    const body = (await res.json()) as { error?: { code: ApiErrorCode; message: string } };
    if (!res.ok)
      throw new ApiError(res.status, body.error?.code ?? "internal", body.error?.message ?? "");
    return options.schema.parse(body) as z.output<S>;
  };
}

/** As src/lib/file-api.ts: HEAD, then PUT; a failure is an ApiError with the server's body. */
const fileCalls: FileTransport = {
  async exists(campaign, sha) {
    const res = await fetch(`${base}/api/campaigns/${campaign}/attachments/${sha}`, {
      method: "HEAD",
      headers: { authorization: `Bearer ${token}` },
    });
    if (res.status === 404) return false;
    if (!res.ok) throw new ApiError(res.status, "internal", `status ${res.status}`);
    return true;
  },
  async upload(file, onProgress) {
    puts.tried += 1;
    const res = await fetch(`${base}/api/campaigns/${file.campaignId}/attachments/${file.sha256}`, {
      method: "PUT",
      headers: {
        authorization: `Bearer ${token}`,
        "content-type": "application/octet-stream",
        "x-file-name": encodeURIComponent(file.name),
      },
      body: file.bytes,
    });
    const body = (await res.json().catch(() => ({}))) as {
      error?: { code: ApiErrorCode; message: string };
    };
    if (!res.ok)
      throw new ApiError(res.status, body.error?.code ?? "internal", body.error?.message ?? "");
    puts.stored += 1;
    onProgress(file.bytes.byteLength);
  },
};

const failureOf = (p: Promise<unknown>) =>
  p.then(
    () => null,
    (e: unknown) => e as Error,
  );

const rowsOf = (sha: string) =>
  ctx.database.db
    .select()
    .from(attachments)
    .where(and(eq(attachments.campaignId, campaignId), eq(attachments.sha256, sha)));
const linkOf = (id: string) =>
  ctx.database.db.select().from(attachmentLinks).where(eq(attachmentLinks.id, id));
const siteRow = (id: string) => ctx.database.db.select().from(sites).where(eq(sites.id, id));
const storedFiles = async () =>
  (await readdir(storageDir, { recursive: true, withFileTypes: true })).filter(
    (e) => e.isFile() && !e.parentPath.endsWith(".tmp"),
  );

beforeAll(async () => {
  ctx = await createTestContext();
  storageDir = await mkdtemp(join(tmpdir(), "equipot-storage-full-test-"));
  const app = createApp({
    config: ctx.config,
    db: ctx.database.db,
    log: pino({ level: "silent" }),
    storage: fillableStorage(storageDir),
  });
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, "127.0.0.1", () => resolve(s));
  });
  const address = server.address();
  base = `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`;
  const field = await signInAs(app, "field");
  token = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
  await rm(storageDir, { recursive: true, force: true });
});

describe("the server's file storage is full while a tablet sends a photo", () => {
  let db: EquipotDb;
  let engine: ReturnType<typeof createSyncEngine>;
  let siteId: string;
  let linkId: string;
  let before: unknown;
  let sha: string;

  it("keeps the photo on the tablet, sends the other changes and says the storage is full", async () => {
    db = openDatabase(`t-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });
    engine = createSyncEngine({
      db,
      transport: createHttpTransport(requester(), fileCalls),
      campaignIds: () => [campaignId],
    });
    siteId = await createSiteLocally(db, campaignId, site);
    linkId = await addAttachmentLocally(db, campaignId, {
      subject: { kind: "site", id: siteId },
      bytes: tinyPng.buffer.slice(
        tinyPng.byteOffset,
        tinyPng.byteOffset + tinyPng.byteLength,
      ) as ArrayBuffer,
      contentType: "image/png",
      name: "scree-depot.png",
    });
    const [file] = await db.files.toArray();
    before = file;
    sha = file?.sha256 ?? "";

    const failure = await failureOf(engine.sync());
    expect(failure?.message).toBe(serverStorageFullMessage);
    expect(puts).toEqual({ tried: 1, stored: 0 });
    // On the tablet: the record and its bytes exactly as before.
    expect(await db.files.toArray()).toEqual([before]);
    // On the server: the site and the link, but no file row and no stored object.
    expect(await siteRow(siteId)).toHaveLength(1);
    expect(await linkOf(linkId)).toHaveLength(1);
    expect(await rowsOf(sha)).toEqual([]);
    expect(await storedFiles()).toEqual([]);
    expect(engine.getStatus()).toMatchObject({
      pending: 0,
      pendingFiles: 1,
      error: { kind: "server", message: serverStorageFullMessage },
    });
  });

  it("still sends later changes while full, and names a storage out of reach (503)", async () => {
    const later = await createSiteLocally(db, campaignId, { ...site, name: "Scree depot 2" });
    expect((await failureOf(engine.sync()))?.message).toBe(serverStorageFullMessage);
    expect(await siteRow(later)).toHaveLength(1);

    disk.state = "unavailable";
    expect((await failureOf(engine.sync()))?.message).toBe(serverStorageUnavailableMessage);
    expect(puts).toEqual({ tried: 3, stored: 0 });
    expect(await db.files.toArray()).toEqual([before]);
    expect(await rowsOf(sha)).toEqual([]);
  });

  it("stores the bytes exactly once when the server has space again", async () => {
    disk.state = "ok";
    await engine.sync();
    expect(puts).toEqual({ tried: 4, stored: 1 });
    const [row] = await rowsOf(sha);
    expect(row).toMatchObject({ sizeBytes: tinyPng.length, contentType: "image/png" });
    expect(await storedFiles()).toHaveLength(1);
    const res = await fetch(`${base}/api/campaigns/${campaignId}/attachments/${sha}`, {
      headers: { authorization: `Bearer ${token}` },
    });
    expect(Buffer.from(await res.arrayBuffer())).toEqual(tinyPng);
    expect(engine.getStatus()).toMatchObject({ pendingFiles: 0, error: null });
    expect((await db.files.toArray())[0]).toMatchObject({ state: "sent", refusal: null });

    // A further sync sends nothing again.
    await engine.sync();
    expect(puts).toEqual({ tried: 4, stored: 1 });
    expect(await rowsOf(sha)).toHaveLength(1);
  });
});
