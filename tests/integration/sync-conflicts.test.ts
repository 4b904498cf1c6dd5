import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { newSite, pullAll, pushAs, syncClient } from "../helpers/sync";
import { conflicts, sites } from "../../server/db/schema";

let ctx: TestContext;
let campaignId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  campaignId = (await signInAs(ctx.app, "field")).memberships[0]?.campaignId ?? "";
});
afterAll(async () => {
  await ctx.close();
});

describe("two tablets editing one site offline", () => {
  it("merges edits of different fields and keeps both values of the same field as a conflict", async () => {
    const field = await signInAs(ctx.app, "field");
    const geodesist = await signInAs(ctx.app, "geodesist");
    const tabletA = syncClient();
    const tabletB = syncClient();
    const site = newSite({ name: "Col hut", notes: "", approxHeightM: 2400 });
    await pushAs(ctx.app, field.token, {
      clientId: tabletA.clientId,
      campaignId,
      mutations: [tabletA.mutation("site.create", site)],
    });

    // Both tablets saw version 1 and edit offline.
    const fromA = tabletA.mutation("site.update", {
      id: site.id,
      changes: { name: "Col hut (upper)", notes: "Door sticks" },
      base: { name: "Col hut", notes: "" },
    });
    const fromB = tabletB.mutation("site.update", {
      id: site.id,
      changes: { name: "Col refuge", approxHeightM: 2412.5 },
      base: { name: "Col hut", approxHeightM: 2400 },
    });
    const a = await pushAs(ctx.app, field.token, {
      clientId: tabletA.clientId,
      campaignId,
      mutations: [fromA],
    });
    const b = await pushAs(ctx.app, geodesist.token, {
      clientId: tabletB.clientId,
      campaignId,
      mutations: [fromB],
    });
    expect(a.body.results[0]?.status).toBe("applied");
    expect(b.body.results[0]).toMatchObject({
      status: "conflict",
      message: expect.stringContaining("name"),
    });

    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, site.id));
    // Different fields merged; the contested field keeps the value that reached the server first.
    expect(row).toMatchObject({
      name: "Col hut (upper)",
      notes: "Door sticks",
      approxHeightM: 2412.5,
    });
    const open = await ctx.database.db
      .select()
      .from(conflicts)
      .where(eq(conflicts.entityId, site.id));
    expect(open).toHaveLength(1);
    expect(open[0]).toMatchObject({
      field: "name",
      baseValue: "Col hut",
      serverValue: "Col hut (upper)",
      clientValue: "Col refuge",
      resolvedAt: null,
    });

    // Both tablets see the conflict in the pull.
    const pulled = await pullAll(ctx.app, field.token, campaignId);
    const conflictChange = pulled.changes.find(
      (c) => c.entity === "conflict" && c.id === open[0]?.id,
    );
    expect(conflictChange?.data).toMatchObject({
      clientValue: "Col refuge",
      serverValue: "Col hut (upper)",
    });

    // A person resolves it: a new mutation.
    const resolve = tabletA.mutation("conflict.resolve", { id: open[0]?.id, value: "Col refuge" });
    const r = await pushAs(ctx.app, field.token, {
      clientId: tabletA.clientId,
      campaignId,
      mutations: [resolve],
    });
    expect(r.body.results[0]?.status).toBe("applied");
    const [after] = await ctx.database.db.select().from(sites).where(eq(sites.id, site.id));
    expect(after?.name).toBe("Col refuge");
    const [closed] = await ctx.database.db
      .select()
      .from(conflicts)
      .where(eq(conflicts.id, open[0]?.id ?? ""));
    expect(closed).toMatchObject({ resolvedValue: "Col refuge" });
    expect(closed?.resolvedAt).toBeInstanceOf(Date);
  });

  it("refuses a resolution whose value breaks the field's rule", async () => {
    const field = await signInAs(ctx.app, "field");
    const t1 = syncClient();
    const t2 = syncClient();
    const site = newSite({ latitudeDeg: 47 });
    await pushAs(ctx.app, field.token, {
      clientId: t1.clientId,
      campaignId,
      mutations: [t1.mutation("site.create", site)],
    });
    await pushAs(ctx.app, field.token, {
      clientId: t1.clientId,
      campaignId,
      mutations: [
        t1.mutation("site.update", {
          id: site.id,
          changes: { latitudeDeg: 47.1 },
          base: { latitudeDeg: 47 },
        }),
      ],
    });
    await pushAs(ctx.app, field.token, {
      clientId: t2.clientId,
      campaignId,
      mutations: [
        t2.mutation("site.update", {
          id: site.id,
          changes: { latitudeDeg: 47.2 },
          base: { latitudeDeg: 47 },
        }),
      ],
    });
    const [open] = await ctx.database.db
      .select()
      .from(conflicts)
      .where(eq(conflicts.entityId, site.id));
    const res = await pushAs(ctx.app, field.token, {
      clientId: t2.clientId,
      campaignId,
      mutations: [t2.mutation("conflict.resolve", { id: open?.id, value: 200 })],
    });
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/latitudeDeg: Latitude/),
    });
  });

  it("keeps an edit of a site deleted meanwhile for recovery", async () => {
    const field = await signInAs(ctx.app, "field");
    const admin = await signInAs(ctx.app, "admin");
    const t1 = syncClient();
    const t2 = syncClient();
    const site = newSite();
    await pushAs(ctx.app, admin.token, {
      clientId: t1.clientId,
      campaignId,
      mutations: [t1.mutation("site.create", site), t1.mutation("site.delete", { id: site.id })],
    });
    const res = await pushAs(ctx.app, field.token, {
      clientId: t2.clientId,
      campaignId,
      mutations: [
        t2.mutation("site.update", { id: site.id, changes: { notes: "x" }, base: { notes: "" } }),
      ],
    });
    expect(res.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringMatching(/deleted/),
    });
  });
});
