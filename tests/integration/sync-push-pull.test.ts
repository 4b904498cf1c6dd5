import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { and, eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { foreignCampaignWithSite, newSite, pullAll, pushAs, syncClient } from "../helpers/sync";
import { memberships, sites, syncRejections, users } from "../../server/db/schema";
import { protocolVersion } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;
let otherCampaignId: string;
let foreignSiteId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  campaignId = field.memberships[0]?.campaignId ?? "";
  ({ campaignId: otherCampaignId, siteId: foreignSiteId } = await foreignCampaignWithSite(
    ctx.database.db,
    "B",
  ));
});
afterAll(async () => {
  await ctx.close();
});

describe("push", () => {
  it("applies a batch once: a retry after a lost response answers duplicate and writes nothing twice", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const created = [newSite({ name: "Retry A" }), newSite({ name: "Retry B" })];
    const mutations = created.map((s) => client.mutation("site.create", s));
    const first = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations,
    });
    expect(first.status).toBe(200);
    expect(first.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
    const retry = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations,
    });
    expect(retry.body.results.map((r) => r.status)).toEqual(["duplicate", "duplicate"]);
    expect(retry.body.lastMutationId).toBe(2);
    const rows = await ctx.database.db.select().from(sites).where(eq(sites.name, "Retry A"));
    expect(rows).toHaveLength(1);
  });

  it("refuses a gap and mutation ids that do not follow each other", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    client.next = 3;
    const gap = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", newSite())],
    });
    expect(gap.status).toBe(409);
    expect(gap.body.error?.message).toMatch(/Mutations 1 to 2/);
    const jumbled = syncClient();
    const a = jumbled.mutation("site.create", newSite());
    jumbled.next += 1;
    const b = jumbled.mutation("site.create", newSite());
    const res = await pushAs(ctx.app, token, {
      clientId: jumbled.clientId,
      campaignId,
      mutations: [a, b],
    });
    expect(res.status).toBe(400);
  });

  it("rejects a malformed mutation with its reason, keeps it, and goes on with the queue", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const bad = client.mutation("site.create", { ...newSite(), latitudeDeg: 123 });
    const good = client.mutation("site.create", newSite({ name: "After the bad one" }));
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [bad, good],
    });
    expect(res.status).toBe(200);
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/latitudeDeg: Latitude must be between/),
    });
    expect(res.body.results[1]?.status).toBe("applied");
    expect(res.body.lastMutationId).toBe(2);
    const kept = await ctx.database.db
      .select()
      .from(syncRejections)
      .where(eq(syncRejections.clientId, client.clientId));
    expect(kept).toHaveLength(1);
    expect(kept[0]?.args).toMatchObject({ latitudeDeg: 123 });
  });

  it("refuses a NUL in a site's text by name and keeps the change, so the queue never blocks", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const nul = client.mutation("site.create", newSite({ name: "Hut\u0000B" }));
    const broken = client.mutation("site.create", {
      ...newSite({ notes: "\u0000" }),
      latitudeDeg: "north \ud800",
    });
    const good = client.mutation("site.create", newSite({ name: "After the NUL" }));
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [nul, broken, good],
    });
    expect(res.status).toBe(200);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      [
        "rejected",
        "Invalid site.create: name: Name contains a NUL character, which cannot be stored",
      ],
      ["rejected", expect.stringMatching(/^Invalid site\.create: /)],
      ["applied", undefined],
    ]);
    const kept = await ctx.database.db
      .select()
      .from(syncRejections)
      .where(eq(syncRejections.clientId, client.clientId));
    expect(kept.map((k) => k.mutationId)).toEqual([1, 2]);
    // Kept whole for recovery, in a form the database accepts.
    expect(kept[0]?.args).toMatchObject({ name: "Hut\uFFFDB" });
    expect(kept[1]?.args).toMatchObject({ notes: "\uFFFD", latitudeDeg: "north \uFFFD" });
  });

  it("answers an old protocol version with update_required", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", newSite())],
      protocolVersion: protocolVersion - 1,
    });
    expect(res.status).toBe(426);
    expect(res.body.error?.code).toBe("update_required");
    const pull = await request(ctx.app)
      .get("/api/sync/pull")
      .query({ protocolVersion: 0, campaign: campaignId })
      .set("Authorization", `Bearer ${token}`);
    expect(pull.status).toBe(426);
  });

  it("refuses an entity of another campaign without leaking it", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const client = syncClient();
    const mutations = [
      client.mutation("site.update", {
        id: foreignSiteId,
        changes: { name: "Taken" },
        base: { name: "B-only site" },
      }),
      client.mutation("site.delete", { id: foreignSiteId }),
      client.mutation("site.create", newSite({ id: foreignSiteId })),
    ];
    const res = await pushAs(ctx.app, token, { clientId: client.clientId, campaignId, mutations });
    expect(res.body.results.map((r) => r.status)).toEqual(["rejected", "rejected", "rejected"]);
    expect(JSON.stringify(res.body)).not.toContain("B-only site");
    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, foreignSiteId));
    expect(row).toMatchObject({ name: "B-only site", deletedAt: null });
    const intoB = await pushAs(ctx.app, token, {
      clientId: syncClient().clientId,
      campaignId: otherCampaignId,
      mutations: [syncClient().mutation("site.create", newSite())],
    });
    expect(intoB.body.results[0]?.status).toBe("rejected");
    const pullB = await request(ctx.app)
      .get("/api/sync/pull")
      .query({ protocolVersion, campaign: otherCampaignId })
      .set("Authorization", `Bearer ${token}`);
    expect(pullB.status).toBe(404);
    expect(JSON.stringify(pullB.body)).not.toContain("B-only");
  });

  it("refuses a member removed from the campaign and keeps the change for recovery", async () => {
    const { token } = await signInAs(ctx.app, "logistics");
    const [logistics] = await ctx.database.db
      .select()
      .from(users)
      .where(eq(users.email, "logistics@demo.equipot.test"));
    await ctx.database.db
      .delete(memberships)
      .where(
        and(eq(memberships.userId, logistics?.id ?? ""), eq(memberships.campaignId, campaignId)),
      );
    const client = syncClient();
    const site = newSite({ name: "Written after removal" });
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", site)],
    });
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/not a member/),
    });
    expect(await ctx.database.db.select().from(sites).where(eq(sites.id, site.id))).toHaveLength(0);
    const kept = await ctx.database.db
      .select()
      .from(syncRejections)
      .where(eq(syncRejections.clientId, client.clientId));
    expect(kept[0]?.args).toMatchObject({ name: "Written after removal" });
    await ctx.database.db
      .insert(memberships)
      .values({ userId: logistics?.id ?? "", campaignId, role: "logistics" });
  });

  it("refuses a reviewer's edit by role at push time", async () => {
    const { token } = await signInAs(ctx.app, "reviewer");
    const client = syncClient();
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", newSite())],
    });
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/role/),
    });
  });

  it("refuses a device id registered to another user", async () => {
    const field = await signInAs(ctx.app, "field");
    const geodesist = await signInAs(ctx.app, "geodesist");
    const client = syncClient();
    await pushAs(ctx.app, field.token, { clientId: client.clientId, campaignId, mutations: [] });
    const res = await pushAs(ctx.app, geodesist.token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", newSite())],
    });
    expect(res.status).toBe(403);
  });
});

describe("pull", () => {
  it("pages through every change in order, with tombstones and the client's last applied id", async () => {
    const { token } = await signInAs(ctx.app, "geodesist");
    const client = syncClient();
    const made = Array.from({ length: 7 }, (_, i) => newSite({ name: `Paged ${i}` }));
    const mutations = [
      ...made.map((s) => client.mutation("site.create", s)),
      client.mutation("site.delete", { id: made[0]?.id }),
    ];
    await pushAs(ctx.app, token, { clientId: client.clientId, campaignId, mutations });
    const { pages, changes } = await pullAll(ctx.app, token, campaignId, client.clientId, 3);
    expect(pages.length).toBeGreaterThan(2);
    const seqs = changes.map((c) => c.seq);
    expect([...seqs].sort((a, b) => a - b)).toEqual(seqs);
    expect(new Set(seqs).size).toBe(seqs.length);
    const latest = new Map(changes.map((c) => [c.id, c]));
    expect(latest.get(made[0]?.id ?? "")?.data).toMatchObject({ deletedAt: expect.any(String) });
    for (const s of made.slice(1))
      expect(latest.get(s.id)?.data).toMatchObject({ name: s.name, deletedAt: null });
    expect(pages.at(-1)?.lastMutationId).toBe(8);
  });

  it("names a bad query field", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const res = await request(ctx.app)
      .get("/api/sync/pull")
      .query({ protocolVersion, campaign: "nope" })
      .set("Authorization", `Bearer ${token}`);
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe("campaign");
  });
});
