// Attachment links through push and pull on the real server and PostgreSQL, and refusals that
// reach the tablet through the pull when the push answer was lost.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { foreignCampaignWithSite, newSite, pullAll, pushAs, syncClient } from "../helpers/sync";
import { attachmentLinks } from "../../server/db/schema";
import { protocolVersion, type PullResponse } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;
let foreignSiteId: string;

const link = (subjectId: string, overrides: Record<string, unknown> = {}) => ({
  id: crypto.randomUUID(),
  sha256: "ab".repeat(32),
  contentType: "image/jpeg",
  sizeBytes: 2048,
  name: "north-door.jpg",
  subject: { kind: "site", id: subjectId },
  caption: "Door seal after unloading",
  takenAt: "2027-06-02T09:15:00.000Z",
  ...overrides,
});

async function pullPage(token: string, query: Record<string, string | number>) {
  const res = await request(ctx.app)
    .get("/api/sync/pull")
    .query({ protocolVersion, campaign: campaignId, ...query })
    .set("Authorization", `Bearer ${token}`);
  return { status: res.status, body: res.body as PullResponse };
}

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  campaignId = field.memberships[0]?.campaignId ?? "";
  ({ siteId: foreignSiteId } = await foreignCampaignWithSite(ctx.database.db, "C"));
});
afterAll(async () => {
  await ctx.close();
});

describe("attachment links", () => {
  it("adds a link to a site, pulls it, removes it as a tombstone, and a second remove is harmless", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const site = newSite({ name: "Photo shed" });
    const photo = link(site.id);
    const added = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", site), client.mutation("attachment.add", photo)],
    });
    expect(added.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
    let { changes } = await pullAll(ctx.app, token, campaignId);
    const pulled = changes.find((c) => c.id === photo.id);
    expect(pulled).toMatchObject({
      entity: "attachment",
      data: {
        campaignId,
        sha256: photo.sha256,
        subject: { kind: "site", id: site.id },
        caption: "Door seal after unloading",
        takenAt: "2027-06-02T09:15:00.000Z",
        removedAt: null,
      },
    });

    const removed = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("attachment.remove", { id: photo.id }),
        client.mutation("attachment.remove", { id: photo.id }),
      ],
    });
    expect(removed.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["applied", "Already removed"],
    ]);
    ({ changes } = await pullAll(ctx.app, token, campaignId));
    const latest = changes.filter((c) => c.id === photo.id).at(-1);
    expect(latest?.data).toMatchObject({ removedAt: expect.any(String) });
    const [row] = await ctx.database.db
      .select()
      .from(attachmentLinks)
      .where(eq(attachmentLinks.id, photo.id));
    expect(row?.removedBy).not.toBeNull();
  });

  it("refuses a link to a site of another campaign and stores nothing", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    const photo = link(foreignSiteId);
    const res = await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("attachment.add", photo)],
    });
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: "The site this file belongs to is not in this campaign",
    });
    expect(JSON.stringify(res.body)).not.toContain("C-only site");
    const rows = await ctx.database.db
      .select()
      .from(attachmentLinks)
      .where(eq(attachmentLinks.id, photo.id));
    expect(rows).toEqual([]);
  });

  it("names the bad field of a malformed link and refuses a reviewer by role", async () => {
    const field = await signInAs(ctx.app, "field");
    const client = syncClient();
    const bad = await pushAs(ctx.app, field.token, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("attachment.add", link(foreignSiteId, { contentType: "image/svg+xml" })),
        client.mutation("attachment.add", link(foreignSiteId, { sizeBytes: 26 * 1024 * 1024 })),
      ],
    });
    expect(bad.body.results.map((r) => r.message)).toEqual([
      expect.stringMatching(/^Invalid attachment\.add: contentType: /),
      expect.stringMatching(/^Invalid attachment\.add: sizeBytes: sizeBytes must be at most/),
    ]);
    const reviewer = await signInAs(ctx.app, "reviewer");
    const other = syncClient();
    const refused = await pushAs(ctx.app, reviewer.token, {
      clientId: other.clientId,
      campaignId,
      mutations: [other.mutation("attachment.add", link(foreignSiteId))],
    });
    expect(refused.body.results[0]?.message).toMatch(/Your role in this campaign does not allow/);
  });
});

describe("refusals in the pull", () => {
  it("names the client's refused mutations from pendingFrom on, on the last page only", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const client = syncClient();
    await pushAs(ctx.app, token, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("site.create", newSite({ name: "Fine one" })),
        client.mutation("site.create", { id: crypto.randomUUID(), name: "" }),
        client.mutation("site.create", newSite({ name: "Fine two" })),
        client.mutation("site.update", { id: crypto.randomUUID(), changes: {}, base: {} }),
      ],
    });
    const all = await pullPage(token, { clientId: client.clientId, pendingFrom: 1, limit: 1000 });
    expect(all.body.hasMore).toBe(false);
    expect(all.body.rejections.map((r) => r.mutationId)).toEqual([2, 4]);
    expect(all.body.rejections[1]?.reason).toBe("Site not found");
    const later = await pullPage(token, { clientId: client.clientId, pendingFrom: 3, limit: 1000 });
    expect(later.body.rejections.map((r) => r.mutationId)).toEqual([4]);
    const first = await pullPage(token, { clientId: client.clientId, pendingFrom: 1, limit: 1 });
    expect(first.body.hasMore).toBe(true);
    expect(first.body.rejections).toEqual([]);
    const without = await pullPage(token, { clientId: client.clientId, limit: 1000 });
    expect(without.body.rejections).toEqual([]);
  });

  it("never names another user's refusals", async () => {
    const field = await signInAs(ctx.app, "field");
    const client = syncClient();
    await pushAs(ctx.app, field.token, {
      clientId: client.clientId,
      campaignId,
      mutations: [client.mutation("site.create", { id: crypto.randomUUID(), name: "" })],
    });
    const geodesist = await signInAs(ctx.app, "geodesist");
    const res = await pullPage(geodesist.token, { clientId: client.clientId, pendingFrom: 1 });
    expect(res.status).toBe(403);
    expect(JSON.stringify(res.body)).not.toContain("rejections");
  });
});
