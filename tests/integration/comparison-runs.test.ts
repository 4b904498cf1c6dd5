// Comparison runs against the real server and PostgreSQL: instruments with history, a run, a
// 10⁶-sample upload whose stored analysis equals the science core's on the same data, a
// malformed file refused by line with nothing stored, an overlap refused, a floor above the target
// reported as not reachable with its blocking term, and the API answering while a worker computes.
import { count, eq } from "drizzle-orm";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analyseSeries, buildSeriesGrid } from "../../shared/comparison";
import type { HeightResultView, SeriesAnalysis } from "../../shared/schemas/comparison";
import { comparisonChunks, comparisonFiles } from "../../server/db/schema";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { seriesCsv, whiteFmSeries } from "../helpers/series";
import { pullAll } from "../helpers/sync";

let ctx: TestContext;
let base: string;
let geodesist: string;
let field: string;
let siteId: string;

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
const start = Date.UTC(2027, 6, 1) / 1000;

beforeAll(async () => {
  ctx = await createTestContext();
  const g = await signInAs(ctx.app, "geodesist");
  geodesist = g.token;
  const campaignId = g.memberships[0]?.campaignId ?? "";
  base = `/api/campaigns/${campaignId}`;
  field = (await signInAs(ctx.app, "field")).token;
  const { changes } = await pullAll(ctx.app, field, campaignId);
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
});
afterAll(async () => {
  await ctx.close();
});

async function instrument(kind: "clock" | "link", name: string, at1s: number, terms: number[]) {
  const id = crypto.randomUUID();
  const res = await request(ctx.app)
    .post(`${base}/instruments`)
    .set(auth(geodesist))
    .send({
      id,
      instrument: {
        kind,
        name,
        instabilityAt1s: at1s,
        systematic: terms.map((value, i) => ({ name: `term ${i + 1}`, value })),
      },
    });
  expect(res.status).toBe(201);
  return id;
}

async function makeRun(remote: string, reference: string, extra: Record<string, unknown> = {}) {
  const id = crypto.randomUUID();
  const res = await request(ctx.app)
    .post(`${base}/comparison-runs`)
    .set(auth(geodesist))
    .send({
      id,
      run: {
        name: `Run ${id.slice(0, 4)}`,
        remoteSiteId: siteId,
        remoteClockId: remote,
        referenceClockId: reference,
        linkName: "fibre link",
        targetHeightUncertaintyM: 0.01,
        ...extra,
      },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return id;
}

const upload = (runId: string, csv: string, fileName = "series.csv", token = geodesist) =>
  request(ctx.app)
    .post(`${base}/comparison-runs/${runId}/files?fileName=${fileName}`)
    .set(auth(token))
    .set("Content-Type", "text/csv")
    .send(csv);

async function analysisDone(runId: string): Promise<SeriesAnalysis> {
  for (let i = 0; i < 600; i++) {
    const res = await request(ctx.app)
      .get(`${base}/comparison-runs/${runId}/analysis`)
      .set(auth(field));
    const body = res.body as { state: string; analysis: SeriesAnalysis | null };
    if (body.state === "done" && body.analysis !== null) return body.analysis;
    if (body.state === "failed") throw new Error(`analysis failed: ${JSON.stringify(body)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error("the analysis did not finish in 60 s");
}

const storedCounts = async () => {
  const db = ctx.database.db;
  const [files] = await db.select({ n: count() }).from(comparisonFiles);
  const [chunks] = await db.select({ n: count() }).from(comparisonChunks);
  return { files: files?.n ?? -1, chunks: chunks?.n ?? -1 };
};

describe("instruments", () => {
  it("keeps clocks with history, refuses stale edits and deleting one in use", async () => {
    const id = await instrument("clock", "Ytterbium clock Y7", 2e-15, [3e-18, 4e-18]);
    const got = await request(ctx.app).get(`${base}/instruments/${id}`).set(auth(field));
    // By hand: √(3² + 4²) = 5, so 5e-18 in quadrature.
    expect(got.body.instrument.systematicTotal).toBeCloseTo(5e-18, 30);
    const edit = (baseVersion: number, at1s: number) =>
      request(ctx.app)
        .put(`${base}/instruments/${id}`)
        .set(auth(geodesist))
        .send({
          baseVersion,
          instrument: { kind: "clock", name: "Ytterbium clock Y7", instabilityAt1s: at1s },
        });
    expect((await edit(1, 1.5e-15)).status).toBe(200);
    const stale = await edit(1, 1e-15);
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/version 2/);
    const history = await request(ctx.app)
      .get(`${base}/instruments/${id}/history`)
      .set(auth(field));
    expect(history.body.revisions.map((r: { version: number }) => r.version)).toEqual([1, 2]);
    expect(history.body.revisions[1].changed).toEqual(["instabilityAt1s", "systematic"]);
    expect(history.body.revisions[1].byName).toBe("Ines Varodi");
    const refused = await request(ctx.app)
      .post(`${base}/instruments`)
      .set(auth(field))
      .send({
        id: crypto.randomUUID(),
        instrument: { kind: "clock", name: "x", instabilityAt1s: 1e-15 },
      });
    expect(refused.status).toBe(403);
    const other = await instrument("clock", "Strontium clock S7", 1e-15, []);
    const runId = await makeRun(id, other);
    const inUse = await request(ctx.app).delete(`${base}/instruments/${id}`).set(auth(geodesist));
    expect(inUse.status).toBe(409);
    expect(inUse.body.error.message).toContain("comparison run");
    expect(
      (await request(ctx.app).delete(`${base}/comparison-runs/${runId}`).set(auth(geodesist)))
        .status,
    ).toBe(204);
    expect(
      (await request(ctx.app).delete(`${base}/instruments/${id}`).set(auth(geodesist))).status,
    ).toBe(204);
  });

  it("refuses a link where a clock belongs, naming the field", async () => {
    const clock = await instrument("clock", "Clock A", 1e-15, []);
    const link = await instrument("link", "Fibre link L1", 1e-16, []);
    const res = await request(ctx.app)
      .post(`${base}/comparison-runs`)
      .set(auth(geodesist))
      .send({
        id: crypto.randomUUID(),
        run: {
          name: "Wrong",
          remoteSiteId: siteId,
          remoteClockId: clock,
          referenceClockId: link,
          linkName: "fibre",
          targetHeightUncertaintyM: 0.01,
        },
      });
    expect(res.status).toBe(400);
    expect(res.body.error.details[0]).toMatchObject({ path: "run.referenceClockId" });
    expect(res.body.error.message).toMatch(/must be a clock/);
  });
});

describe("comparison series", () => {
  it("stores 10⁶ samples and the analysis equals the science core's on the same data", async () => {
    const remote = await instrument("clock", "Remote clock R1", 1e-15, [2e-18]);
    const reference = await instrument("clock", "Reference clock F1", 1e-15, [2e-18]);
    const runId = await makeRun(remote, reference);
    // A 600 s outage in the middle: a gap the analysis must see.
    const series = whiteFmSeries({
      startUnixS: start,
      count: 1_000_000,
      seed: 3,
      skip: (i) => i >= 500_000 && i < 500_600,
    });
    const res = await upload(runId, seriesCsv(series), "week1.csv");
    expect(res.status, JSON.stringify(res.body).slice(0, 500)).toBe(201);
    expect(res.body.file).toMatchObject({ rowCount: 999_400, validCount: 999_400, tau0S: 1 });
    expect(res.body.file.gaps).toMatchObject({ count: 1, missingSamples: 600 });
    // While the worker computes, the API answers.
    const health = await request(ctx.app).get("/api/health");
    expect(health.status).toBe(200);
    const stored = await analysisDone(runId);
    // Independent path: the same numbers straight into the core, no CSV, no PostgreSQL.
    const expected = analyseSeries(buildSeriesGrid([series], 1));
    expect({ ...stored, computeMs: 0 }).toEqual({
      ...expected,
      dataRevision: 1,
      computeMs: 0,
    });
    expect(stored.validSamples).toBe(999_400);
    expect(stored.samples).toBe(1_000_000);
    // Sanity against the generator: white FM of 1e-15 at 1 s (within 1 % at 10⁶ samples).
    expect(stored.adev[0]?.deviation).toBeGreaterThan(0.99e-15);
    expect(stored.adev[0]?.deviation).toBeLessThan(1.01e-15);
  }, 120_000);

  it("refuses a malformed file by line and stores nothing", async () => {
    const a = await instrument("clock", "Clock M1", 1e-15, []);
    const b = await instrument("clock", "Clock M2", 1e-15, []);
    const runId = await makeRun(a, b);
    const before = await storedCounts();
    const good = seriesCsv(whiteFmSeries({ startUnixS: start, count: 70_000, seed: 5 }));
    // Bad rows after the first chunk was written: the transaction must take it back.
    const csv = good + "2027-07-02T00:00:00Z,abc\nnot a time,1e-16\n";
    const res = await upload(runId, csv, "broken.csv");
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe("invalid_file");
    expect(res.body.error.badRows).toBe(2);
    expect(res.body.error.rows.map((r: { line: number }) => r.line)).toEqual([70_002, 70_003]);
    expect(await storedCounts()).toEqual(before);
    const run = await request(ctx.app).get(`${base}/comparison-runs/${runId}`).set(auth(field));
    expect(run.body.run.dataRevision).toBe(0);
    expect(run.body.files).toEqual([]);
  });

  it("refuses an overlapping file and the field crew's upload", async () => {
    const a = await instrument("clock", "Clock O1", 1e-15, []);
    const b = await instrument("clock", "Clock O2", 1e-15, []);
    const runId = await makeRun(a, b);
    const csv = seriesCsv(whiteFmSeries({ startUnixS: start, count: 1000, seed: 9 }));
    expect((await upload(runId, csv)).status).toBe(201);
    const again = await upload(runId, csv, "again.csv");
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/overlap series\.csv/);
    expect((await upload(runId, csv, "x.csv", field)).status).toBe(403);
  });

  it("reports not reachable when a systematic floor is above the target, naming the term", async () => {
    // 1e-16 systematic ≈ 0.9 m of height: far above a 1 cm target.
    const a = await instrument("clock", "Clock with a large shift", 1e-15, [1e-16]);
    const b = await instrument("clock", "Clock N2", 1e-15, [1e-18]);
    const runId = await makeRun(a, b);
    expect(
      (await upload(runId, seriesCsv(whiteFmSeries({ startUnixS: start, count: 5000, seed: 1 }))))
        .status,
    ).toBe(201);
    await analysisDone(runId);
    const res = await request(ctx.app)
      .get(`${base}/comparison-runs/${runId}/result`)
      .set(auth(field));
    expect(res.status).toBe(200);
    const result = res.body as HeightResultView;
    expect(result.timeToTarget.reachable).toBe(false);
    expect(result.timeToTarget.dominant).toBe("Clock with a large shift systematic");
    expect(result.timeToTarget.reason).toContain("Clock with a large shift systematic");
    expect(result.timeToTarget.improve).toMatch(/would have to be below/);
    expect(result.timeToTarget.eta).toBeNull();
    expect(result.caution).toMatch(/not official heights/);
    expect(result.levelledMissing).toMatch(/remote mark/);
    const kinds = result.budget.map((r) => r.kind);
    expect(kinds).toContain("statistical");
    expect(kinds.filter((k) => k === "systematic")).toHaveLength(2);
  });

  it("deleting the only file leaves no analysis", async () => {
    const a = await instrument("clock", "Clock D1", 1e-15, []);
    const b = await instrument("clock", "Clock D2", 1e-15, []);
    const runId = await makeRun(a, b);
    const up = await upload(
      runId,
      seriesCsv(whiteFmSeries({ startUnixS: start, count: 500, seed: 2 })),
    );
    await analysisDone(runId);
    const del = await request(ctx.app)
      .delete(`${base}/comparison-runs/${runId}/files/${up.body.file.id as string}`)
      .set(auth(geodesist));
    expect(del.status).toBe(204);
    const [left] = await ctx.database.db
      .select({ n: count() })
      .from(comparisonFiles)
      .where(eq(comparisonFiles.runId, runId));
    expect(left?.n).toBe(0);
    await expect
      .poll(
        async () =>
          (await request(ctx.app).get(`${base}/comparison-runs/${runId}/analysis`).set(auth(field)))
            .body.state,
      )
      .toBe("none");
  });
});
