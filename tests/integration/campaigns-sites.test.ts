import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { campaigns, memberships, sites, users, auditEvents } from "../../server/db/schema";
import { hashPassword } from "../../server/services/passwords";
import { protocolVersion, type PullResponse } from "../../shared/sync/protocol";
import { pullAll } from "../helpers/sync";

let ctx: TestContext;
let demoCampaignId: string;
let otherCampaignId: string;
let otherSiteId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const { db } = ctx.database;
  const [other] = await db
    .insert(campaigns)
    .values({ name: "Other campaign B", description: "secret-b" })
    .returning();
  const [outsider] = await db
    .insert(users)
    .values({
      email: "outsider@b.equipot.test",
      name: "Outsider",
      passwordHash: await hashPassword("outsider-password"),
    })
    .returning();
  if (!other || !outsider) throw new Error("fixture");
  otherCampaignId = other.id;
  await db.insert(memberships).values({ campaignId: other.id, userId: outsider.id, role: "admin" });
  otherSiteId = crypto.randomUUID();
  await db.insert(sites).values({
    id: otherSiteId,
    campaignId: other.id,
    name: "Hidden B site",
    kind: "depot",
    latitudeDeg: 1,
    longitudeDeg: 2,
    approxHeightM: 3,
    changeSeq: 1,
  });
  const field = await signInAs(ctx.app, "field");
  demoCampaignId = field.memberships[0]?.campaignId ?? "";
});
afterAll(async () => {
  await ctx.close();
});

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });
const validSite = {
  name: "Benchmark shed",
  kind: "mountain",
  latitudeDeg: 47.1,
  longitudeDeg: 11.2,
  approxHeightM: 2100,
};

describe("health", () => {
  it("reports the database", async () => {
    const res = await request(ctx.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: "ok", database: "ok" });
  });
});

describe("campaigns", () => {
  it("lists only the caller's campaigns", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const res = await request(ctx.app).get("/api/campaigns").set(auth(token));
    expect(res.status).toBe(200);
    expect(res.body.campaigns.map((c: { name: string }) => c.name)).toEqual([
      "Kestrel Ridge height link 2027",
    ]);
    expect(JSON.stringify(res.body)).not.toContain("secret-b");
  });

  it("refuses a field user on an admin route with 403", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const res = await request(ctx.app)
      .get(`/api/campaigns/${demoCampaignId}/members`)
      .set(auth(token));
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe("forbidden");
  });

  it("lets the admin list members", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const res = await request(ctx.app)
      .get(`/api/campaigns/${demoCampaignId}/members`)
      .set(auth(token));
    expect(res.status).toBe(200);
    expect(res.body.members).toHaveLength(5);
  });
});

describe("sites", () => {
  it("creates, lists, edits with a version and deletes as a tombstone", async () => {
    const { token } = await signInAs(ctx.app, "geodesist");
    const base = `/api/campaigns/${demoCampaignId}/sites`;
    const created = await request(ctx.app).post(base).set(auth(token)).send(validSite);
    expect(created.status).toBe(201);
    expect(created.body.site).toMatchObject({ ...validSite, version: 1, notes: "" });
    const id = created.body.site.id as string;

    const listed = await request(ctx.app).get(base).set(auth(token));
    expect(listed.body.sites.map((s: { id: string }) => s.id)).toContain(id);

    const edited = await request(ctx.app)
      .patch(`${base}/${id}`)
      .set(auth(token))
      .send({ baseVersion: 1, name: "Benchmark shed east" });
    expect(edited.status).toBe(200);
    expect(edited.body.site).toMatchObject({ name: "Benchmark shed east", version: 2 });

    const stale = await request(ctx.app)
      .patch(`${base}/${id}`)
      .set(auth(token))
      .send({ baseVersion: 1, name: "Lost edit" });
    expect(stale.status).toBe(409);

    const { cursor: cursorBeforeDelete } = await pullAll(ctx.app, token, demoCampaignId);
    expect((await request(ctx.app).delete(`${base}/${id}`).set(auth(token))).status).toBe(204);
    const after = await request(ctx.app).get(base).set(auth(token));
    expect(after.body.sites.map((s: { id: string }) => s.id)).not.toContain(id);
    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, id));
    expect(row?.deletedAt).toBeInstanceOf(Date);
    const audit = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entityId, id));
    expect(audit.map((a) => a.action)).toEqual(["create", "update", "delete"]);
    // The tombstone takes a new change position, so a tablet that pulled before sees it go.
    const since = await request(ctx.app)
      .get("/api/sync/pull")
      .query({ protocolVersion, campaign: demoCampaignId, cursor: cursorBeforeDelete })
      .set(auth(token));
    expect(since.status).toBe(200);
    const tombstone = (since.body as PullResponse).changes.find((c) => c.id === id);
    expect(tombstone?.data).toMatchObject({ deletedAt: expect.any(String), version: 3 });
  });

  it("keeps a client-made id", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const id = crypto.randomUUID();
    const res = await request(ctx.app)
      .post(`/api/campaigns/${demoCampaignId}/sites`)
      .set(auth(token))
      .send({ ...validSite, id });
    expect(res.status).toBe(201);
    expect(res.body.site.id).toBe(id);
  });

  it("refuses a reviewer's write with 403", async () => {
    const { token } = await signInAs(ctx.app, "reviewer");
    const res = await request(ctx.app)
      .post(`/api/campaigns/${demoCampaignId}/sites`)
      .set(auth(token))
      .send(validSite);
    expect(res.status).toBe(403);
  });

  it("names each bad field", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const res = await request(ctx.app)
      .post(`/api/campaigns/${demoCampaignId}/sites`)
      .set(auth(token))
      .send({ ...validSite, latitudeDeg: 123, name: "", campaignId: otherCampaignId });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(["latitudeDeg", "name", "campaignId"]));
    expect(res.body.error.message).toMatch(
      /Latitude must be between|Name is required|Unknown field/,
    );
  });

  it("answers broken JSON with 400 and an oversize body with 413", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const url = `/api/campaigns/${demoCampaignId}/sites`;
    const broken = await request(ctx.app)
      .post(url)
      .set(auth(token))
      .set("Content-Type", "application/json")
      .send('{"name": ');
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe("bad_request");
    const huge = await request(ctx.app)
      .post(url)
      .set(auth(token))
      .send({ ...validSite, notes: "x".repeat(1_100_000) });
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe("payload_too_large");
  });
});

describe("campaign isolation", () => {
  it("hides campaign B from a member of A, for reads and writes", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const base = `/api/campaigns/${otherCampaignId}`;
    const responses = [
      await request(ctx.app).get(`${base}/sites`).set(auth(token)),
      await request(ctx.app).post(`${base}/sites`).set(auth(token)).send(validSite),
      await request(ctx.app)
        .patch(`${base}/sites/${otherSiteId}`)
        .set(auth(token))
        .send({ baseVersion: 1, name: "x" }),
      await request(ctx.app).delete(`${base}/sites/${otherSiteId}`).set(auth(token)),
      await request(ctx.app).get(`${base}/members`).set(auth(token)),
    ];
    for (const res of responses) {
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toMatch(/Hidden B site|secret-b|outsider/);
    }
  });

  it("refuses editing a site of B through campaign A's path", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const res = await request(ctx.app)
      .patch(`/api/campaigns/${demoCampaignId}/sites/${otherSiteId}`)
      .set(auth(token))
      .send({ baseVersion: 1, name: "Taken over" });
    expect(res.status).toBe(404);
    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, otherSiteId));
    expect(row?.name).toBe("Hidden B site");
  });

  it("refuses reusing a site id of B when creating in A", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const res = await request(ctx.app)
      .post(`/api/campaigns/${demoCampaignId}/sites`)
      .set(auth(token))
      .send({ ...validSite, id: otherSiteId });
    expect(res.status).toBe(409);
    expect(JSON.stringify(res.body)).not.toContain("Hidden B site");
  });
});

describe("demo crates and benchmarks", () => {
  it("lists the demo campaign's crates with their limits and benchmarks with their heights", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const crates = await request(ctx.app)
      .get(`/api/campaigns/${demoCampaignId}/crates`)
      .set(auth(token));
    expect(crates.status).toBe(200);
    expect(crates.body.crates.length).toBeGreaterThanOrEqual(3);
    for (const crate of crates.body.crates) {
      expect(crate.maxShockG).toBeGreaterThan(0);
      expect(crate.temperatureMinC).toBeLessThan(crate.temperatureMaxC);
    }
    const marks = await request(ctx.app)
      .get(`/api/campaigns/${demoCampaignId}/benchmarks`)
      .set(auth(token));
    expect(marks.status).toBe(200);
    expect(marks.body.benchmarks.length).toBeGreaterThanOrEqual(3);
    expect(marks.body.benchmarks[0]).toMatchObject({
      heightSigmaM: expect.any(Number),
      heightSystem: expect.any(String),
    });
  });

  it("hides them from a member of another campaign", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    for (const what of ["crates", "benchmarks"]) {
      const res = await request(ctx.app)
        .get(`/api/campaigns/${otherCampaignId}/${what}`)
        .set(auth(token));
      expect(res.status).toBe(404);
    }
  });
});
