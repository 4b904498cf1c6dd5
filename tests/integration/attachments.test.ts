import { createHash } from "node:crypto";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { crc32, deflateSync } from "node:zlib";
import { and, eq } from "drizzle-orm";
import type { Express } from "express";
import { pino } from "pino";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { attachments, auditEvents, campaigns } from "../../server/db/schema";
import { createDiskStorage } from "../../server/storage/disk";
import { attachmentKey, type Storage } from "../../server/storage/storage";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";

let ctx: TestContext;
let app: Express;
let storage: Storage;
let storageDir: string;
let puts = 0;
let campaignA: string;
let campaignB: string;
const tokens: Record<string, string> = {};

/** A real PNG: signature, IHDR, one zlib-compressed IDAT of RGB rows, IEND, with CRCs. */
function png(width: number, height: number, seed: number): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const length = Buffer.alloc(4);
    length.writeUInt32BE(data.length);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([length, body, crc]);
  };
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8);
  const rows = Buffer.alloc(height * (1 + width * 3));
  for (let i = 0; i < rows.length; i++) rows[i] = i % (1 + width * 3) === 0 ? 0 : (i * seed) & 255;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", header),
    chunk("IDAT", deflateSync(rows)),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

const sha = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");
const url = (campaignId: string, hash: string) =>
  `/api/campaigns/${campaignId}/attachments/${hash}`;
const bearer = (role: string) => ({ Authorization: `Bearer ${tokens[role]}` });
const asBinary = (test: request.Test) =>
  test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on("data", (c: Buffer) => chunks.push(c));
    res.on("end", () => done(null, Buffer.concat(chunks)));
  });

function upload(role: string, campaignId: string, bytes: Buffer, name?: string) {
  const test = request(app)
    .put(url(campaignId, sha(bytes)))
    .set(bearer(role))
    .set("Content-Type", "application/octet-stream");
  return (name === undefined ? test : test.set("x-file-name", name)).send(bytes);
}

const rowsOf = (campaignId: string, hash: string) =>
  ctx.database.db
    .select()
    .from(attachments)
    .where(and(eq(attachments.campaignId, campaignId), eq(attachments.sha256, hash)));

beforeAll(async () => {
  ctx = await createTestContext();
  storageDir = await mkdtemp(join(tmpdir(), "equipot-attachments-test-"));
  const disk = createDiskStorage(storageDir);
  storage = { ...disk, put: (...args) => ((puts += 1), disk.put(...args)) };
  app = createApp({
    config: ctx.config,
    db: ctx.database.db,
    log: pino({ level: "silent" }),
    storage,
  });
  for (const role of ["field", "reviewer", "admin", "logistics"])
    tokens[role] = (await signInAs(app, role)).token;
  const all = await ctx.database.db.select().from(campaigns);
  campaignA = all.find((c) => c.name.startsWith("Kestrel"))?.id ?? "";
  campaignB = all.find((c) => c.name.startsWith("Practice"))?.id ?? "";
});
afterAll(async () => {
  await ctx.close();
  await rm(storageDir, { recursive: true, force: true });
});

describe("uploading an attachment", () => {
  const photo = png(3, 2, 7);

  it("stores a new PNG (201), then answers a retry with the same record (200)", async () => {
    const first = await upload("field", campaignA, photo, "crate-07 shock.png");
    expect(first.status).toBe(201);
    expect(first.body.attachment).toMatchObject({
      campaignId: campaignA,
      sha256: sha(photo),
      contentType: "image/png",
      sizeBytes: photo.length,
      originalName: "crate-07 shock.png",
    });
    const again = await upload("field", campaignA, photo, "other name.png");
    expect(again.status).toBe(200);
    expect(again.body).toEqual(first.body);
    expect(await rowsOf(campaignA, sha(photo))).toHaveLength(1);
    const audit = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, "attachment"), eq(auditEvents.entityId, sha(photo))));
    expect(audit).toHaveLength(1);
  });

  it("serves the bytes back unchanged with safe, cacheable headers", async () => {
    const res = await asBinary(
      request(app)
        .get(url(campaignA, sha(photo)))
        .set(bearer("reviewer")),
    );
    expect(res.status).toBe(200);
    expect(Buffer.isBuffer(res.body) && res.body.equals(photo)).toBe(true);
    expect(res.headers["content-type"]).toBe("image/png");
    expect(res.headers["content-length"]).toBe(String(photo.length));
    expect(res.headers["content-disposition"]).toMatch(
      /^attachment; filename="crate-07 shock.png"/,
    );
    expect(res.headers["x-content-type-options"]).toBe("nosniff");
    expect(res.headers["cache-control"]).toMatch(/^private, max-age=\d+, immutable$/);
    expect(res.headers["etag"]).toBe(`"${sha(photo)}"`);
  });

  it("tells whether a file is there without sending it (HEAD and meta)", async () => {
    const head = await request(app)
      .head(url(campaignA, sha(photo)))
      .set(bearer("reviewer"));
    expect(head.status).toBe(200);
    expect(head.headers["content-length"]).toBe(String(photo.length));
    const meta = await request(app)
      .get(`${url(campaignA, sha(photo))}/meta`)
      .set(bearer("field"));
    expect(meta.status).toBe(200);
    expect(meta.body.attachment.sha256).toBe(sha(photo));
    const unknown = sha(Buffer.from("never uploaded"));
    expect((await request(app).head(url(campaignA, unknown)).set(bearer("field"))).status).toBe(
      404,
    );
    const missing = await request(app)
      .get(`${url(campaignA, unknown)}/meta`)
      .set(bearer("field"));
    expect(missing.status).toBe(404);
    expect(missing.body.error).toMatchObject({
      code: "not_found",
      message: "Attachment not found",
    });
  });

  it("de-duplicates two parallel uploads of one file into one row", async () => {
    const bytes = png(4, 4, 11);
    const results = await Promise.all([
      upload("field", campaignA, bytes),
      upload("logistics", campaignA, bytes),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 201]);
    expect(await rowsOf(campaignA, sha(bytes))).toHaveLength(1);
  });

  it("reuses an object left without its row by an interrupted attempt", async () => {
    const bytes = png(5, 1, 3);
    const key = attachmentKey(campaignA, sha(bytes));
    await storage.put(key, bytes, { contentType: "image/png", sizeBytes: bytes.length });
    const before = puts;
    const res = await upload("field", campaignA, bytes);
    expect(res.status).toBe(201);
    expect(puts).toBe(before);
    expect(await rowsOf(campaignA, sha(bytes))).toHaveLength(1);
  });

  it("stores a path-like name under the generated key and shows only its last part", async () => {
    const bytes = png(2, 2, 5);
    const res = await upload("field", campaignA, bytes, "../../etc/passwd");
    expect(res.status).toBe(201);
    expect(res.body.attachment.originalName).toBe("passwd");
    const [row] = await rowsOf(campaignA, sha(bytes));
    expect(row?.storageKey).toBe(`c/${campaignA}/${sha(bytes)}`);
    const files = await readdir(storageDir, { recursive: true });
    expect(files).toContain(join("c", campaignA, sha(bytes)));
    expect(files.some((f) => f.includes("passwd") || f.includes(".."))).toBe(false);
    const get = await request(app)
      .get(url(campaignA, sha(bytes)))
      .set(bearer("field"));
    expect(get.headers["content-disposition"]).toMatch(/^attachment; filename="passwd"/);
  });

  it("keeps a non-ASCII name readable and the header safe", async () => {
    const bytes = png(1, 3, 9);
    const name = 'Pegel "Süd"\u202Egnp.exe';
    const res = await upload("field", campaignA, bytes, encodeURIComponent(name));
    expect(res.body.attachment.originalName).toBe('Pegel "Süd"gnp.exe');
    const get = await request(app)
      .get(url(campaignA, sha(bytes)))
      .set(bearer("field"));
    expect(get.headers["content-disposition"]).toBe(
      `attachment; filename="Pegel _S_d_gnp.exe"; filename*=UTF-8''Pegel%20%22S%C3%BCd%22gnp.exe`,
    );
  });
});

describe("who may upload and read", () => {
  const bytes = png(2, 1, 13);

  it("refuses a reviewer's upload with 403 and stores nothing", async () => {
    const res = await upload("reviewer", campaignA, bytes);
    expect(res.status).toBe(403);
    expect(await rowsOf(campaignA, sha(bytes))).toHaveLength(0);
    expect(await storage.exists(attachmentKey(campaignA, sha(bytes)))).toBe(false);
  });

  it("refuses a request without a token with 401", async () => {
    const res = await request(app).get(url(campaignA, sha(bytes)));
    expect(res.status).toBe(401);
  });

  it("never reveals another campaign's file", async () => {
    const secret = png(3, 3, 17);
    expect((await upload("admin", campaignB, secret)).status).toBe(201);
    for (const path of [url(campaignA, sha(secret)), `${url(campaignA, sha(secret))}/meta`]) {
      const res = await request(app).get(path).set(bearer("field"));
      expect(res.status).toBe(404);
      expect(res.body.error.message).toBe("Attachment not found");
    }
    expect(
      (
        await request(app)
          .head(url(campaignA, sha(secret)))
          .set(bearer("field"))
      ).status,
    ).toBe(404);
    const other = await request(app)
      .get(url(campaignB, sha(secret)))
      .set(bearer("field"));
    expect(other.status).toBe(404);
    expect(other.body.error.message).toBe("Campaign not found");
  });

  it("keeps the same file in two campaigns as two records", async () => {
    const shared = png(6, 1, 19);
    expect((await upload("admin", campaignA, shared)).status).toBe(201);
    expect((await upload("admin", campaignB, shared)).status).toBe(201);
    expect(await rowsOf(campaignA, sha(shared))).toHaveLength(1);
    expect(await rowsOf(campaignB, sha(shared))).toHaveLength(1);
  });
});
