// Benchmarks over REST: create, edit with a version, tombstone, unique codes; imports store the
// whole file or nothing, with every bad row named by line and column.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";

let ctx: TestContext;
let base: string;
let geodesist: string;
let field: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const g = await signInAs(ctx.app, "geodesist");
  geodesist = g.token;
  base = `/api/campaigns/${g.memberships[0]?.campaignId ?? ""}/benchmarks`;
  field = (await signInAs(ctx.app, "field")).token;
});
afterAll(async () => {
  await ctx.close();
});

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
const fields = (code: string) => ({
  code,
  latitudeDeg: 47.1,
  longitudeDeg: 9.2,
  heightM: 1234.567,
  heightSigmaM: 0.002,
  heightSystem: "Normal heights",
});
const codes = async () =>
  ((await request(ctx.app).get(base).set(auth(geodesist))).body.benchmarks as { code: string }[])
    .map((b) => b.code)
    .sort();

describe("benchmarks", () => {
  it("creates, edits, refuses stale and duplicate writes, deletes", async () => {
    const id = crypto.randomUUID();
    const created = await request(ctx.app)
      .post(base)
      .set(auth(geodesist))
      .send({ id, benchmark: fields("TST-1") });
    expect(created.status).toBe(201);
    expect(created.body.benchmark).toMatchObject({ id, code: "TST-1", version: 1, datum: "" });
    const dup = await request(ctx.app)
      .post(base)
      .set(auth(geodesist))
      .send({ id: crypto.randomUUID(), benchmark: fields("tst-1") });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toContain("TST-1");
    const edited = await request(ctx.app)
      .put(`${base}/${id}`)
      .set(auth(geodesist))
      .send({ baseVersion: 1, benchmark: { ...fields("TST-1"), heightM: 1234.5 } });
    expect(edited.status).toBe(200);
    expect(edited.body.benchmark).toMatchObject({ heightM: 1234.5, version: 2 });
    const stale = await request(ctx.app)
      .put(`${base}/${id}`)
      .set(auth(geodesist))
      .send({ baseVersion: 1, benchmark: fields("TST-1") });
    expect(stale.status).toBe(409);
    const denied = await request(ctx.app).delete(`${base}/${id}`).set(auth(field));
    expect(denied.status).toBe(403);
    expect((await request(ctx.app).delete(`${base}/${id}`).set(auth(geodesist))).status).toBe(204);
    expect(await codes()).not.toContain("TST-1");
  });

  it("imports a good CSV; refuses a file with two bad rows and stores nothing", async () => {
    const before = await codes();
    const bad = [
      "code;latitude_deg;longitude_deg;height_m;height_sigma_mm;height_system",
      "IMP-1;47,5;9.1;500.1;2;Normal heights",
      "IMP-2;95;9.1;500.1;2;Normal heights",
      "IMP-3;47.5;9.1;;2;Normal heights",
    ].join("\n");
    const refused = await request(ctx.app)
      .post(`${base}/import`)
      .set(auth(geodesist))
      .send({ format: "csv", content: bad });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe("invalid_file");
    expect(refused.body.error.rows).toEqual([
      { row: 3, field: "latitude_deg", message: "Latitude must be between -90 and 90 °" },
      { row: 4, field: "height_m", message: "Height must be a number" },
    ]);
    expect(await codes()).toEqual(before);
    const good = bad.split("\n").slice(0, 2).join("\n");
    const done = await request(ctx.app)
      .post(`${base}/import`)
      .set(auth(geodesist))
      .send({ format: "csv", content: good });
    expect(done.status).toBe(201);
    expect(done.body).toMatchObject({ created: 1, updated: 0 });
    // 47,5 with a semicolon separator is a decimal comma; 2 mm is 0.002 m.
    expect(done.body.benchmarks[0]).toMatchObject({
      code: "IMP-1",
      latitudeDeg: 47.5,
      heightSigmaM: 0.002,
    });
    const again = await request(ctx.app)
      .post(`${base}/import`)
      .set(auth(geodesist))
      .send({ format: "csv", content: good });
    expect(again.status).toBe(422);
    const update = await request(ctx.app)
      .post(`${base}/import`)
      .set(auth(geodesist))
      .send({ format: "csv", content: good, onExisting: "update" });
    expect(update.body).toMatchObject({ created: 0, updated: 1 });
  });

  it("imports a GeoJSON FeatureCollection", async () => {
    const content = JSON.stringify({
      type: "FeatureCollection",
      features: [
        {
          type: "Feature",
          geometry: { type: "Point", coordinates: [9.25, 47.25, 900] },
          properties: {
            code: "GJ-1",
            height_m: 612.25,
            height_sigma_m: 0.003,
            height_system: "Normal heights",
          },
        },
      ],
    });
    const res = await request(ctx.app)
      .post(`${base}/import`)
      .set(auth(geodesist))
      .send({ format: "geojson", content });
    expect(res.status).toBe(201);
    expect(res.body.benchmarks[0]).toMatchObject({
      code: "GJ-1",
      latitudeDeg: 47.25,
      longitudeDeg: 9.25,
      heightM: 612.25,
    });
  });
});
