// The series upload through the real server and PostgreSQL, checked against the shared reader
// (the browser's preview path) on the same text: a file mixing the fast row with rows only the
// shared parser reads (offsets, flags, CRLF, BOM, comments, blank lines, a gap) is stored bit
// for bit as that reader's samples, in full chunks; a file with bad rows in the middle and a
// truncated last line is refused with the same lines and leaves nothing behind; a body that fails
// while chunks are on their way rolls back everything and leaves the pool's connections clean.
import { Readable } from "node:stream";
import { asc, count, eq, sql } from "drizzle-orm";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSeriesReader, type SeriesFileSummary } from "../../shared/comparison";
import { comparisonChunks, comparisonFiles } from "../../server/db/schema";
import { CHUNK_SAMPLES } from "../../server/services/comparison/chunk-writer";
import { uploadSeries } from "../../server/services/comparison/upload";
import { createTestContext, type TestContext } from "../helpers/app";
import { createComparisonRun, geodesistWithSite } from "../helpers/comparison-run";

let ctx: TestContext;
let base: string;
let token: string;
let siteId: string;
let campaignId: string;

const auth = () => ({ Authorization: `Bearer ${token}` });
const t0 = Date.UTC(2027, 8, 1) / 1000;
const iso = (t: number) => new Date(t * 1000).toISOString().replace(".000Z", "Z");

beforeAll(async () => {
  ctx = await createTestContext();
  ({ token, campaignId, base, siteId } = await geodesistWithSite(ctx));
});
afterAll(async () => {
  await ctx.close();
});

const makeRun = () => createComparisonRun(ctx.app, base, token, siteId, "Upload");

const upload = (runId: string, text: string, fileName: string) =>
  request(ctx.app)
    .post(`${base}/comparison-runs/${runId}/files?fileName=${fileName}`)
    .set(auth())
    .set("Content-Type", "text/csv")
    .send(text);

/** The independent path: the shared reader on lines split by a regular expression. */
function sharedRead(text: string): { times: number[]; values: number[]; s: SeriesFileSummary } {
  const times: number[] = [];
  const values: number[] = [];
  const reader = createSeriesReader({
    valueKind: "fractional",
    onSample: (t, y) => {
      times.push(t);
      values.push(y);
    },
  });
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/);
  if (lines.at(-1) === "") lines.pop();
  lines.forEach((line, i) => reader.line(line, i + 1));
  return { times, values, s: reader.finish() };
}

const storedCounts = async () => {
  const db = ctx.database.db;
  const [files] = await db.select({ n: count() }).from(comparisonFiles);
  const [chunks] = await db.select({ n: count() }).from(comparisonChunks);
  return { files: files?.n ?? -1, chunks: chunks?.n ?? -1 };
};

describe("series upload", () => {
  it("stores a mixed file as the shared reader reads it, bit for bit, in full chunks", async () => {
    const runId = await makeRun();
    const lines = ["# remote − reference, EQ-T1", "time,value,valid"];
    let t = t0;
    for (let i = 0; i < 150_000; i++) {
      t += i === 80_000 ? 600 : 1; // a 10-minute outage
      const y = Math.sin(i) * 3.7e-16;
      if (i % 5000 === 0) lines.push(`${iso(t).replace("Z", "+00:00")},${y},1`);
      else if (i % 7001 === 0) lines.push(`${iso(t)},${y},0`);
      else if (i % 9001 === 0) lines.push("");
      else lines.push(`${iso(t)},${i % 2 === 0 ? y.toExponential(6) : y}`);
    }
    const text = "\uFEFF" + lines.join("\r\n") + "\r\n";
    const expected = sharedRead(text);
    expect(expected.s.badRows).toBe(0);

    const res = await upload(runId, text, "mixed.csv");
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    expect(res.body.file).toMatchObject({
      rowCount: expected.s.rows,
      validCount: expected.s.validRows,
      tau0S: expected.s.tau0S,
      gaps: expected.s.gaps,
    });
    const chunks = await ctx.database.db
      .select()
      .from(comparisonChunks)
      .where(eq(comparisonChunks.fileId, res.body.file.id))
      .orderBy(asc(comparisonChunks.chunkNo));
    const n = expected.times.length;
    expect(chunks.map((c) => c.times.length)).toEqual([
      CHUNK_SAMPLES,
      CHUNK_SAMPLES,
      n - 2 * CHUNK_SAMPLES,
    ]);
    expect(chunks.flatMap((c) => c.times)).toEqual(expected.times);
    expect(chunks.flatMap((c) => c.values)).toEqual(expected.values);
    expect(chunks.flatMap((c) => c.values).filter(Number.isNaN).length).toBe(
      n - expected.s.validRows,
    );
  });

  it("refuses bad rows past the first chunk and a truncated last line, storing nothing", async () => {
    const runId = await makeRun();
    const lines = ["time,value"];
    for (let i = 0; i < 100_000; i++) lines.push(`${iso(t0 + i)},${(i % 9) * 1e-17}`);
    lines[70_000] = `${iso(t0 + 69_999)},1e-1x`; // a bad number
    lines[90_000] = `${iso(t0 + 89_998)},1e-16`; // not after the previous row
    const text = lines.join("\r\n") + "\r\n2027-09-02T03:4";
    const expected = sharedRead(text);
    const before = await storedCounts();
    const res = await upload(runId, text, "broken.csv");
    expect(res.status).toBe(422);
    expect(res.body.error.badRows).toBe(expected.s.badRows);
    expect(res.body.error.rows).toEqual(expected.s.errors);
    expect(res.body.error.rows.map((r: { line: number }) => r.line)).toEqual([
      70_001, 90_001, 100_002,
    ]);
    expect(await storedCounts()).toEqual(before);
  });

  it("rolls back a body that fails mid-file after chunks were written, leaving the pool clean", async () => {
    const runId = await makeRun();
    const before = await storedCounts();
    const [user] = (
      await ctx.database.db.execute<{ id: string }>(
        sql`select id from users where email = 'geodesist@demo.equipot.test'`,
      )
    ).rows;
    async function* failing() {
      yield "time,value\n";
      for (let i = 0; i < 200_000; i += 10_000) {
        yield Array.from({ length: 10_000 }, (_, k) => `${iso(t0 + i + k)},1e-16\n`).join("");
      }
      throw new Error("connection dropped");
    }
    await expect(
      uploadSeries(
        ctx.database.db,
        { campaignId, userId: user?.id ?? "" },
        runId,
        { fileName: "dropped.csv", valueKind: "fractional" },
        Readable.from(failing()),
      ),
    ).rejects.toThrow("connection dropped");
    // Every connection of the pool is used once more: none carries a late insert or an aborted
    // transaction.
    await Promise.all(
      Array.from({ length: 10 }, () =>
        ctx.database.db.transaction((tx) => tx.execute(sql`select 1`)),
      ),
    );
    await new Promise((r) => setTimeout(r, 200));
    expect(await storedCounts()).toEqual(before);
  });
});
