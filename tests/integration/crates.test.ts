// Logistics edits crates over REST: each write advances the version and the campaign's change
// position (so tablets pull it, a deletion as a tombstone) and leaves an audit event with before and
// after; stale edits and taken ids are 409, other roles 403, strangers 404, bad bodies 400 by field.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { and, eq } from "drizzle-orm";
import { createTestContext, outsiderToken, signInAs, type TestContext } from "../helpers/app";
import { pullAll } from "../helpers/sync";
import { auditEvents, crates, users } from "../../server/db/schema";
import type { CrateView } from "../../shared/schemas/crates";

let ctx: TestContext;
let campaignId: string;
let practiceId: string;
let logisticsToken: string;
let adminToken: string;
let fieldToken: string;
let outsider: string;
let base: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const logistics = await signInAs(ctx.app, "logistics");
  logisticsToken = logistics.token;
  campaignId = logistics.memberships[0]?.campaignId ?? "";
  base = `/api/campaigns/${campaignId}/crates`;
  const admin = await signInAs(ctx.app, "admin");
  adminToken = admin.token;
  practiceId = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
  fieldToken = (await signInAs(ctx.app, "field")).token;
  // Logistics of the other demo campaign only: a stranger to this one.
  if (!practiceId) throw new Error("no second demo campaign");
  outsider = await outsiderToken(ctx, practiceId, "logistics");
});
afterAll(async () => {
  await ctx.close();
});

const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

const fields = (overrides: Record<string, unknown> = {}) => ({
  label: "KR-06",
  contents: "Spare vacuum pump and gauges",
  instrument: "Transportable clock EQ-T1: spares",
  weightKg: 28.5,
  maxShockG: 35,
  temperatureMinC: 5,
  temperatureMaxC: 35,
  maxTiltDeg: 30,
  notes: "",
  ...overrides,
});
const newCrate = (overrides: Record<string, unknown> = {}) => ({
  id: crypto.randomUUID(),
  crate: fields(overrides),
});

const crateRow = async (id: string) =>
  (await ctx.database.db.select().from(crates).where(eq(crates.id, id)))[0];

const pulledCrate = async (id: string) => {
  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  return changes.filter((c) => c.entity === "crate" && c.id === id);
};

const userId = async (email: string) =>
  (await ctx.database.db.select({ id: users.id }).from(users).where(eq(users.email, email)))[0]?.id;

describe("crates by logistics", () => {
  it("creates, updates and deletes a crate; tablets pull each version and the tombstone", async () => {
    const input = newCrate();
    const created = await request(ctx.app).post(base).set(auth(logisticsToken)).send(input);
    expect(created.status).toBe(201);
    expect(created.body.crate).toMatchObject({
      id: input.id,
      campaignId,
      label: "KR-06",
      state: "ready",
      maxTiltDeg: 30,
      version: 1,
      deletedAt: null,
    });
    const first = await crateRow(input.id);
    const logisticsId = await userId("logistics@demo.equipot.test");
    expect(first?.updatedBy).toBe(logisticsId);
    expect((await pulledCrate(input.id))[0]?.seq).toBe(first?.changeSeq);

    const updated = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 1, crate: fields({ maxShockG: 20, state: "held", maxTiltDeg: null }) });
    expect(updated.status).toBe(200);
    expect(updated.body.crate).toMatchObject({
      version: 2,
      maxShockG: 20,
      state: "held",
      maxTiltDeg: null,
    });
    const second = await crateRow(input.id);
    expect(second?.changeSeq).toBeGreaterThan(first?.changeSeq ?? Infinity);
    const pulled = await pulledCrate(input.id);
    expect(pulled).toHaveLength(1);
    expect(pulled[0]?.seq).toBe(second?.changeSeq);
    expect(pulled[0]?.data).toMatchObject({ version: 2, maxShockG: 20, state: "held" });

    const [audit] = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, input.id), eq(auditEvents.action, "update")));
    expect(audit).toMatchObject({ entity: "crate", campaignId, userId: logisticsId });
    expect(audit?.before).toMatchObject({ version: 1, maxShockG: 35 });
    expect(audit?.after).toMatchObject({ version: 2, maxShockG: 20 });

    const removed = await request(ctx.app).delete(`${base}/${input.id}`).set(auth(logisticsToken));
    expect(removed.status).toBe(204);
    const third = await crateRow(input.id);
    expect(third?.deletedAt).toBeInstanceOf(Date);
    expect(third?.version).toBe(3);
    expect(third?.changeSeq).toBeGreaterThan(second?.changeSeq ?? Infinity);
    const listed = await request(ctx.app).get(base).set(auth(fieldToken));
    expect(listed.body.crates.map((c: CrateView) => c.id)).not.toContain(input.id);
    const tombstone = await pulledCrate(input.id);
    expect(tombstone[0]?.seq).toBe(third?.changeSeq);
    expect((tombstone[0]?.data as CrateView).deletedAt).not.toBeNull();
    const [deleteAudit] = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, input.id), eq(auditEvents.action, "delete")));
    expect(deleteAudit?.before).toMatchObject({ version: 2, deletedAt: null });
    expect(deleteAudit?.after).toMatchObject({ version: 3 });

    expect(
      (await request(ctx.app).delete(`${base}/${input.id}`).set(auth(logisticsToken))).status,
    ).toBe(404);
    const afterDelete = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 3, crate: fields() });
    expect(afterDelete.status).toBe(404);
  });

  it("lets an administrator manage crates too", async () => {
    const res = await request(ctx.app).post(base).set(auth(adminToken)).send(newCrate());
    expect(res.status).toBe(201);
  });

  it("refuses a stale baseVersion with 409 naming the current version", async () => {
    const input = newCrate();
    await request(ctx.app).post(base).set(auth(logisticsToken)).send(input).expect(201);
    await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 1, crate: fields({ weightKg: 30 }) })
      .expect(200);
    const stale = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 1, crate: fields({ weightKg: 99 }) });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("conflict");
    expect(stale.body.error.message).toContain("now version 2");
    expect(await crateRow(input.id)).toMatchObject({ weightKg: 30, version: 2 });
  });

  it("refuses a crate id that is already taken, in this campaign or another", async () => {
    const input = newCrate();
    await request(ctx.app).post(base).set(auth(logisticsToken)).send(input).expect(201);
    const again = await request(ctx.app).post(base).set(auth(logisticsToken)).send(input);
    expect(again.status).toBe(409);
    const elsewhere = await request(ctx.app)
      .post(`/api/campaigns/${practiceId}/crates`)
      .set(auth(adminToken))
      .send({ ...input, crate: fields({ label: "Taken" }) });
    expect(elsewhere.status).toBe(409);
    expect(JSON.stringify(elsewhere.body)).not.toContain("Spare vacuum");
    expect(await crateRow(input.id)).toMatchObject({ campaignId, label: "KR-06", version: 1 });
  });
});

describe("who may edit crates", () => {
  it.each(["field", "reviewer", "geodesist"])("lets %s read but not write (403)", async (role) => {
    const { token } = await signInAs(ctx.app, role);
    expect((await request(ctx.app).get(base).set(auth(token))).status).toBe(200);
    const input = newCrate();
    expect((await request(ctx.app).post(base).set(auth(token)).send(input)).status).toBe(403);
    expect(await crateRow(input.id)).toBeUndefined();
    const [demo] = await ctx.database.db.select().from(crates).where(eq(crates.label, "KR-03"));
    const put = await request(ctx.app)
      .put(`${base}/${demo?.id}`)
      .set(auth(token))
      .send({ baseVersion: 1, crate: fields() });
    expect(put.status).toBe(403);
    expect((await request(ctx.app).delete(`${base}/${demo?.id}`).set(auth(token))).status).toBe(
      403,
    );
    expect(await crateRow(demo?.id ?? "")).toMatchObject({ version: 1, deletedAt: null });
  });

  it("answers 404 to someone outside the campaign, revealing nothing", async () => {
    const [demo] = await ctx.database.db.select().from(crates).where(eq(crates.label, "KR-03"));
    const list = await request(ctx.app).get(base).set(auth(outsider));
    expect(list.status).toBe(404);
    expect(JSON.stringify(list.body)).not.toContain("KR-03");
    const post = await request(ctx.app).post(base).set(auth(outsider)).send(newCrate());
    expect(post.status).toBe(404);
    const put = await request(ctx.app)
      .put(`${base}/${demo?.id}`)
      .set(auth(outsider))
      .send({ baseVersion: 1, crate: fields() });
    expect(put.status).toBe(404);
    expect((await request(ctx.app).delete(`${base}/${demo?.id}`).set(auth(outsider))).status).toBe(
      404,
    );
  });

  it("does not reach another campaign's crate through one's own campaign", async () => {
    const [demo] = await ctx.database.db.select().from(crates).where(eq(crates.label, "KR-03"));
    const path = `/api/campaigns/${practiceId}/crates/${demo?.id}`;
    const put = await request(ctx.app)
      .put(path)
      .set(auth(adminToken))
      .send({ baseVersion: 1, crate: fields() });
    expect(put.status).toBe(404);
    expect((await request(ctx.app).delete(path).set(auth(adminToken))).status).toBe(404);
    expect(await crateRow(demo?.id ?? "")).toMatchObject({ campaignId, version: 1 });
  });
});

describe("bad crate bodies", () => {
  const cases: [string, Record<string, unknown>, string, RegExp][] = [
    [
      "a lowest temperature not below the highest",
      newCrate({ temperatureMinC: 20, temperatureMaxC: 20 }),
      "crate.temperatureMaxC",
      /lowest temperature must be below the highest/,
    ],
    [
      "a weight out of range",
      newCrate({ weightKg: 2500 }),
      "crate.weightKg",
      /between 0 and 2000 kg/,
    ],
    ["a negative weight", newCrate({ weightKg: -1 }), "crate.weightKg", /between 0 and 2000 kg/],
    ["a NUL in the contents", newCrate({ contents: "Optics\u0000" }), "crate.contents", /Contents/],
    ["an unknown crate field", newCrate({ colour: "red" }), "crate.colour", /Unknown field/],
    ["an unknown top-level field", { ...newCrate(), version: 7 }, "version", /Unknown field/],
    ["an empty label", newCrate({ label: "  " }), "crate.label", /Label is required/],
    ["an unknown state", newCrate({ state: "lost" }), "crate.state", /./],
  ];

  it.each(cases)("refuses %s on create", async (_name, body, path, message) => {
    const res = await request(ctx.app).post(base).set(auth(logisticsToken)).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("validation_failed");
    const issue = (res.body.error.details as { path: string; message: string }[]).find(
      (d) => d.path === path,
    );
    expect(issue?.message).toMatch(message);
    expect(await crateRow(String(body.id))).toBeUndefined();
  });

  it("refuses a bad update, and one without a baseVersion, leaving the crate as it was", async () => {
    const input = newCrate();
    await request(ctx.app).post(base).set(auth(logisticsToken)).send(input).expect(201);
    const hot = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 1, crate: fields({ temperatureMaxC: 90 }) });
    expect(hot.status).toBe(400);
    expect(hot.body.error.details[0].path).toBe("crate.temperatureMaxC");
    expect(hot.body.error.details[0].message).toMatch(/between -50 and 85 °C/);
    const unversioned = await request(ctx.app)
      .put(`${base}/${input.id}`)
      .set(auth(logisticsToken))
      .send({ crate: fields() });
    expect(unversioned.status).toBe(400);
    expect(unversioned.body.error.details[0].path).toBe("baseVersion");
    const badId = await request(ctx.app)
      .put(`${base}/not-a-uuid`)
      .set(auth(logisticsToken))
      .send({ baseVersion: 1, crate: fields() });
    expect(badId.status).toBe(400);
    expect(badId.body.error.details[0].path).toBe("crateId");
    expect((await crateRow(input.id))?.version).toBe(1);
  });
});
