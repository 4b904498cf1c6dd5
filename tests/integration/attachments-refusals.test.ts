import { createHash } from "node:crypto";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import { request as httpRequest, type Server } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { crc32, deflateSync } from "node:zlib";
import { and, eq } from "drizzle-orm";
import type { Express } from "express";
import { pino } from "pino";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { attachments, campaigns } from "../../server/db/schema";
import { createDiskStorage } from "../../server/storage/disk";
import { StorageError, type Storage } from "../../server/storage/storage";
import { attachmentLimits } from "../../shared/schemas/attachments";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";

let ctx: TestContext;
let app: Express;
let server: Server;
let storageDir: string;
let campaignId: string;
let token: string;

const sha = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");
const url = (hash: string) => `/api/campaigns/${campaignId}/attachments/${hash}`;
const makeApp = (storage: Storage) =>
  createApp({ config: ctx.config, db: ctx.database.db, log: pino({ level: "silent" }), storage });

function put(bytes: Buffer, headers: Record<string, string> = {}, target = app) {
  return request(target)
    .put(url(sha(bytes)))
    .set("Authorization", `Bearer ${token}`)
    .set({ "Content-Type": "application/octet-stream", ...headers })
    .send(bytes);
}

const rowCount = async (bytes?: Buffer) =>
  (
    await ctx.database.db
      .select()
      .from(attachments)
      .where(
        and(
          eq(attachments.campaignId, campaignId),
          bytes ? eq(attachments.sha256, sha(bytes)) : undefined,
        ),
      )
  ).length;
const storedFiles = async () =>
  (await readdir(storageDir, { recursive: true, withFileTypes: true })).filter((e) => e.isFile());

beforeAll(async () => {
  ctx = await createTestContext();
  storageDir = await mkdtemp(join(tmpdir(), "equipot-refusals-test-"));
  app = makeApp(createDiskStorage(storageDir));
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, "127.0.0.1", () => resolve(s));
  });
  token = (await signInAs(app, "field")).token;
  const [kestrel] = await ctx.database.db
    .select()
    .from(campaigns)
    .where(eq(campaigns.name, "Kestrel Ridge height link 2027"));
  campaignId = kestrel?.id ?? "";
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await ctx.close();
  await rm(storageDir, { recursive: true, force: true });
});

const pdf = Buffer.from("%PDF-1.7\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");

// PNG chunks as the PNG specification (W3C, 2003) lays them out: length, type, data, CRC-32.
function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}
/** An RGB PNG of width × height whose pixel data is only the first row (the header is the test). */
function png(width: number, height: number, extra: Buffer[] = []): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter, no interlace
  const row = deflateSync(Buffer.alloc(1 + 3 * Math.min(width, 1024)));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    ...extra,
    chunk("IDAT", row),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}
/** A baseline JPEG header (ITU-T T.81: SOI, APP0 JFIF, SOF0) claiming height × width. */
function jpegHeader(width: number, height: number): Buffer {
  const sof = Buffer.from([0xff, 0xc0, 0, 11, 8, 0, 0, 0, 0, 1, 1, 0x11, 0]);
  sof.writeUInt16BE(height, 5);
  sof.writeUInt16BE(width, 7);
  const app0 = Buffer.from([
    0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0,
  ]);
  return Buffer.concat([Buffer.from([0xff, 0xd8]), app0, sof, Buffer.from([0xff, 0xd9])]);
}

describe("refused uploads store nothing", () => {
  it("answers a checksum mismatch with 400 and keeps neither row nor object", async () => {
    const res = await request(app)
      .put(url(sha(Buffer.from("what the tablet meant to send"))))
      .set("Authorization", `Bearer ${token}`)
      .set("Content-Type", "application/octet-stream")
      .send(pdf);
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: {
        code: "bad_request",
        message: "The file arrived damaged (checksum differs); it will be sent again",
      },
    });
    expect(await rowCount()).toBe(0);
    expect(await storedFiles()).toEqual([]);
  });

  it.each([
    [
      "text named .png",
      Buffer.from("not an image at all\n"),
      { "x-file-name": "photo.png" },
      /plain text/,
    ],
    [
      "HTML declared as CSV",
      Buffer.from("<!doctype html><p>hi</p>"),
      { "Content-Type": "text/csv" },
      /HTML, SVG or a script/,
    ],
    [
      "SVG with a script",
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      { "x-file-name": "map.svg" },
      /HTML, SVG or a script/,
    ],
    [
      "a shell script named .csv",
      Buffer.from("#!/bin/sh\nrm -rf /\n"),
      { "x-file-name": "x.csv" },
      /script/,
    ],
    [
      "a CSV with a NUL byte",
      Buffer.from("a,b\n1,\u0000\n"),
      { "Content-Type": "text/csv" },
      /could not be recognised/,
    ],
    [
      "invalid UTF-8",
      Buffer.from([0x61, 0x2c, 0xc3, 0x28, 0x0a]),
      { "Content-Type": "text/csv" },
      /could not be recognised/,
    ],
    [
      "a GIF",
      Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "latin1"),
      {},
      /image\/gif, which is not accepted/,
    ],
    [
      "a Content-Type of text/html",
      pdf,
      { "Content-Type": "text/html" },
      /Content-Type text\/html is not accepted/,
    ],
  ])("refuses %s with 415", async (_label, bytes, headers, message) => {
    const res = await put(bytes, headers);
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(message);
    expect(res.body.error.message).toMatch(
      /Accepted: JPEG, PNG or WebP images, PDF documents and CSV text/,
    );
    expect(await rowCount()).toBe(0);
    expect(await storedFiles()).toEqual([]);
  });

  it.each([
    ["a PNG claiming 100,000 × 100,000 pixels", png(100_000, 100_000), /100000 × 100000 pixels/],
    ["a JPEG claiming 65,535 × 65,535 pixels", jpegHeader(65_535, 65_535), /65535 × 65535/],
    ["a PNG one pixel over the limit", png(8_000, 8_001), /8000 × 8001 pixels/],
  ])("refuses %s (a pixel flood) with 413", async (_label, bytes, message) => {
    const res = await put(bytes, { "x-file-name": "photo.png" });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(message);
    expect(res.body.error.message).toMatch(/at most 64 megapixels/);
    expect(await rowCount(bytes)).toBe(0);
    expect(await storedFiles()).toEqual([]);
  });

  it("refuses an empty file with 400", async () => {
    const res = await put(Buffer.alloc(0), { "Content-Type": "text/csv" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toBe("The file is empty; nothing was stored");
    expect(await rowCount()).toBe(0);
  });

  it("refuses a hash that is not 64 lowercase hex digits, naming the field", async () => {
    const res = await request(app)
      .put(url(sha(pdf).toUpperCase()))
      .set("Authorization", `Bearer ${token}`)
      .send(pdf);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({
      code: "validation_failed",
      details: [{ path: "sha256", message: "sha256 must be 64 lowercase hexadecimal characters" }],
    });
  });
});

describe("size limit", () => {
  const oversize = Buffer.alloc(attachmentLimits.maxBytes + 1, 0x41);

  it("answers 413 to a body announced larger than the limit, then keeps serving", async () => {
    const res = await put(oversize, { "Content-Type": "text/csv" });
    expect(res.status).toBe(413);
    expect(res.body.error).toEqual({
      code: "payload_too_large",
      message: "The file is larger than 25 MB",
    });
    expect((await request(app).get("/api/health")).status).toBe(200);
    expect(await rowCount()).toBe(0);
  });

  it("answers 413 to a chunked body that grows past the limit, and stores nothing", async () => {
    const address = server.address();
    const port = typeof address === "object" && address ? address.port : 0;
    const status = await new Promise<number>((resolve, reject) => {
      const req = httpRequest(
        {
          host: "127.0.0.1",
          port,
          method: "PUT",
          path: url(sha(oversize)),
          headers: { Authorization: `Bearer ${token}`, "Content-Type": "text/csv" },
        },
        (res) => {
          res.resume();
          res.on("end", () => resolve(res.statusCode ?? 0));
        },
      );
      req.on("error", reject);
      const step = 1024 * 1024;
      for (let at = 0; at < oversize.length; at += step)
        req.write(oversize.subarray(at, at + step));
      req.end();
    });
    expect(status).toBe(413);
    expect(await rowCount()).toBe(0);
    expect(await storedFiles()).toEqual([]);
    expect((await put(pdf)).status).toBe(201);
  });
});

describe("storage failures", () => {
  const failing = (kind: "full" | "unavailable"): Storage => ({
    ...createDiskStorage(storageDir),
    put: () => Promise.reject(new StorageError(kind, "refused by the test")),
  });
  const csv = Buffer.from("crate,peak_g\nK-3,4.2\n");

  it("answers 507 when the storage is full, and writes no row", async () => {
    const res = await put(csv, { "Content-Type": "text/csv" }, makeApp(failing("full")));
    expect(res.status).toBe(507);
    expect(res.body.error.code).toBe("storage_full");
    expect(await rowCount(csv)).toBe(0);
  });

  it("answers 503 when the storage is unavailable, and writes no row", async () => {
    const res = await put(csv, { "Content-Type": "text/csv" }, makeApp(failing("unavailable")));
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe("unavailable");
    expect(await rowCount(csv)).toBe(0);
    // The tablet's retry once storage is back succeeds.
    expect((await put(csv, { "Content-Type": "text/csv" })).status).toBe(201);
    expect(await rowCount(csv)).toBe(1);
  });
});

// Last: these store files, and the refusal tests above count the campaign's rows.
describe("accepted, and made harmless", () => {
  it("accepts an image at the pixel limit (8,000 × 8,000)", async () => {
    const bytes = png(8_000, 8_000);
    const res = await put(bytes, { "x-file-name": "panorama.png" });
    expect(res.status).toBe(201);
    expect(await rowCount(bytes)).toBe(1);
  });

  it("neutralises an image/script polyglot: stored as a PNG, served only as a download", async () => {
    const script = Buffer.from(
      "<script>alert(document.cookie)</script><html><body>hi</body></html>",
    );
    const polyglot = Buffer.concat([
      png(1, 1, [chunk("tEXt", Buffer.concat([Buffer.from("Comment\0"), script]))]),
      script,
    ]);
    const res = await put(polyglot, { "x-file-name": "../../etc/evil.html" });
    expect(res.status).toBe(201);
    expect(res.body.attachment).toMatchObject({
      contentType: "image/png",
      originalName: "evil.html",
    });
    const served = await request(app)
      .get(url(sha(polyglot)))
      .set("Authorization", `Bearer ${token}`)
      .buffer(true)
      .parse((r, done) => {
        const parts: Buffer[] = [];
        r.on("data", (c: Buffer) => parts.push(c));
        r.on("end", () => done(null, Buffer.concat(parts)));
      });
    expect(served.status).toBe(200);
    expect(served.headers["content-type"]).toBe("image/png");
    expect(served.headers["x-content-type-options"]).toBe("nosniff");
    expect(served.headers["content-disposition"]).toMatch(/^attachment; filename="evil.html"/);
    expect(served.headers["content-security-policy"]).toMatch(/default-src 'self'|sandbox/);
    // Stored under its generated key, not under the name it was sent with.
    const names = (await storedFiles()).map((f) => f.name);
    expect(names.some((n) => n.includes("evil"))).toBe(false);
  });
});
