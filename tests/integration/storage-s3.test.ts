import { createHash, randomUUID } from "node:crypto";
import { text } from "node:stream/consumers";
import { Readable } from "node:stream";
import { pino } from "pino";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app";
import { parseConfig } from "../../server/config";
import { createStorage } from "../../server/storage/create-storage";
import { createS3Storage } from "../../server/storage/s3";
import { attachmentKey, StorageError, type Storage } from "../../server/storage/storage";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { testConfig } from "../helpers/config";
import { startFakeS3, type FakeS3 } from "../helpers/s3";

let s3: FakeS3;
let storage: Storage;

beforeAll(async () => {
  s3 = await startFakeS3();
  storage = await createStorage(testConfig(s3.env));
});
afterAll(async () => {
  await s3?.close();
});

const sha = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");
const keyFor = (bytes: Buffer) => attachmentKey(randomUUID(), sha(bytes));

describe("S3 storage driver", () => {
  it("stores, reads back, reports and deletes an object", async () => {
    const bytes = Buffer.from("station,height_m\nKR-1,2101.4\n");
    const key = keyFor(bytes);
    expect(await storage.exists(key)).toBe(false);
    await storage.put(key, bytes, { contentType: "text/csv", sizeBytes: bytes.length });
    expect(await storage.exists(key)).toBe(true);
    const object = await storage.get(key);
    expect(object?.sizeBytes).toBe(bytes.length);
    expect(object ? await text(object.stream) : "").toBe(bytes.toString());
    await storage.delete(key);
    expect(await storage.exists(key)).toBe(false);
    expect(await storage.get(key)).toBeUndefined();
  });

  it("stores a stream of known length", async () => {
    const bytes = Buffer.alloc(300_000, 7);
    const key = keyFor(bytes);
    const body = Readable.from([bytes.subarray(0, 100_000), bytes.subarray(100_000)]);
    await storage.put(key, body, { contentType: "text/csv", sizeBytes: bytes.length });
    const object = await storage.get(key);
    const chunks: Buffer[] = [];
    for await (const chunk of object?.stream ?? []) chunks.push(Buffer.from(chunk));
    expect(Buffer.concat(chunks).equals(bytes)).toBe(true);
  });

  it("refuses keys that are not the generated form", async () => {
    const options = { contentType: "text/csv", sizeBytes: 1 };
    await expect(storage.put("../escape", Buffer.from("x"), options)).rejects.toThrow(/key/);
    await expect(storage.exists("c/x/y")).rejects.toThrow(/key/);
  });

  it("reports an unreachable service as unavailable", async () => {
    const down = createS3Storage({
      endpoint: "http://127.0.0.1:1",
      region: "us-east-1",
      bucket: "none",
      accessKeyId: "S3RVER",
      secretAccessKey: "S3RVER",
      forcePathStyle: true,
    });
    const error: unknown = await down.exists(keyFor(Buffer.from("x"))).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(StorageError);
    expect(error instanceof StorageError && error.kind).toBe("unavailable");
  });
});

describe("S3 configuration", () => {
  it("names the missing variable when STORAGE_DRIVER=s3", () => {
    const { S3_BUCKET: _bucket, ...withoutBucket } = s3.env;
    const env = { ...withoutBucket, DATABASE_URL: "postgres://x/y", JWT_SECRET: "x".repeat(40) };
    expect(() => parseConfig(env)).toThrow(
      /S3_BUCKET: S3_BUCKET is required when STORAGE_DRIVER=s3/,
    );
    expect(() => parseConfig({ ...env, S3_BUCKET: "b" })).not.toThrow();
  });
});

describe("an upload through the app on S3", () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext(s3.env);
  });
  afterAll(async () => {
    await ctx?.close();
  });

  it("stores the object in the bucket and serves it back", async () => {
    const app = createApp({
      config: ctx.config,
      db: ctx.database.db,
      log: pino({ level: "silent" }),
      storage: await createStorage(ctx.config),
    });
    const { token, memberships } = await signInAs(app, "field");
    const campaignId = memberships[0]?.campaignId ?? "";
    const pdf = Buffer.from(
      "%PDF-1.4\n% crate shock report\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n",
    );
    const url = `/api/campaigns/${campaignId}/attachments/${sha(pdf)}`;
    const put = await request(app)
      .put(url)
      .set("Authorization", `Bearer ${token}`)
      .set("Content-Type", "application/octet-stream")
      .set("x-file-name", "shock-report.pdf")
      .send(pdf);
    expect(put.status).toBe(201);
    expect(put.body.attachment).toMatchObject({
      contentType: "application/pdf",
      sizeBytes: pdf.length,
    });
    expect(await storage.exists(attachmentKey(campaignId, sha(pdf)))).toBe(true);
    const get = await request(app)
      .get(url)
      .set("Authorization", `Bearer ${token}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => done(null, Buffer.concat(chunks)));
      });
    expect(get.status).toBe(200);
    expect(get.headers["content-type"]).toBe("application/pdf");
    expect(Buffer.isBuffer(get.body) && get.body.equals(pdf)).toBe(true);
  });
});
