// A run of consecutive creates is applied together: the answers, refusals, change positions and
// audit rows must be exactly those of applying the mutations one by one.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, asc, eq, gt, sql } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { newSite, pushAs, syncClient } from "../helpers/sync";
import { auditEvents, campaigns, sites, syncRejections, users } from "../../server/db/schema";

let ctx: TestContext;
let campaignId: string;
let practiceCampaignId: string;

const counterOf = async (id: string) =>
  (await ctx.database.db.select().from(campaigns).where(eq(campaigns.id, id)))[0]?.changeSeq ?? -1;

const userIdOf = async (role: string) =>
  (
    await ctx.database.db
      .select()
      .from(users)
      .where(eq(users.email, `${role}@demo.equipot.test`))
  )[0]?.id ?? "";

const rejectionsOf = (clientId: string) =>
  ctx.database.db
    .select({
      mutationId: syncRejections.mutationId,
      name: syncRejections.name,
      reason: syncRejections.reason,
    })
    .from(syncRejections)
    .where(eq(syncRejections.clientId, clientId))
    .orderBy(asc(syncRejections.id));

const auditOf = (clientId: string) =>
  ctx.database.db
    .select({
      action: auditEvents.action,
      entityId: auditEvents.entityId,
      before: auditEvents.before,
      after: auditEvents.after,
    })
    .from(auditEvents)
    .where(eq(auditEvents.clientId, clientId))
    .orderBy(asc(auditEvents.id));

beforeAll(async () => {
  ctx = await createTestContext();
  const admin = await signInAs(ctx.app, "admin");
  campaignId = (await signInAs(ctx.app, "geodesist")).memberships[0]?.campaignId ?? "";
  practiceCampaignId = admin.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
});
afterAll(async () => {
  await ctx.close();
});

describe("a push with runs of creates", () => {
  it("answers, refuses, positions and audits exactly as one by one, and a retry writes nothing", async () => {
    const admin = await signInAs(ctx.app, "admin");
    const { token } = await signInAs(ctx.app, "geodesist");
    const geodesistId = await userIdOf("geodesist");

    // A site of another campaign, whose id a create below reuses.
    const practiceTablet = syncClient();
    const foreign = newSite({ name: "Practice hut" });
    await pushAs(ctx.app, admin.token, {
      clientId: practiceTablet.clientId,
      campaignId: practiceCampaignId,
      mutations: [practiceTablet.mutation("site.create", foreign)],
    });

    // Two sites the mixed push edits and deletes.
    const tablet = syncClient();
    const edited = newSite({ name: "Weir house" });
    const removed = newSite({ name: "Old depot", kind: "depot" });
    const setup = await pushAs(ctx.app, token, {
      clientId: tablet.clientId,
      campaignId,
      mutations: [tablet.mutation("site.create", edited), tablet.mutation("site.create", removed)],
    });
    expect(setup.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
    const base = await counterOf(campaignId);

    const a = newSite({ name: "Site A" });
    const d = newSite({ name: "Site D" });
    const e = newSite({ name: "Site E" });
    const f = newSite({ name: "Site F" });
    const h = newSite({ name: "Site H" });
    const mutations = [
      tablet.mutation("site.create", a), // 3
      tablet.mutation("site.create", newSite({ name: "Site B", latitudeDeg: 95 })), // 4
      tablet.mutation("site.create", newSite({ id: foreign.id, name: "Site C" })), // 5
      tablet.mutation("site.create", d), // 6
      tablet.mutation("site.create", { ...d, name: "Site D again" }), // 7
      tablet.mutation("site.update", {
        id: edited.id,
        changes: { name: "Weir house (lower)" },
        base: { name: "Weir house" },
      }), // 8
      tablet.mutation("site.create", e), // 9
      tablet.mutation("site.delete", { id: removed.id }), // 10
      tablet.mutation("site.create", f), // 11
      // PostgreSQL's uuids ignore case: this is F's id again.
      tablet.mutation("site.create", newSite({ id: f.id.toUpperCase(), name: "Site G" })), // 12
      tablet.mutation("site.create", h), // 13
    ];
    const body = { clientId: tablet.clientId, campaignId, mutations };
    const pushed = await pushAs(ctx.app, token, body);

    const taken = "A site with this id already exists";
    expect(pushed.status).toBe(200);
    expect(pushed.body).toEqual({
      lastMutationId: 13,
      results: [
        { mutationId: 3, status: "applied" },
        {
          mutationId: 4,
          status: "rejected",
          message: "Invalid site.create: latitudeDeg: Latitude must be between −90° and 90°",
        },
        { mutationId: 5, status: "rejected", message: taken },
        { mutationId: 6, status: "applied" },
        { mutationId: 7, status: "rejected", message: taken },
        { mutationId: 8, status: "applied" },
        { mutationId: 9, status: "applied" },
        { mutationId: 10, status: "applied" },
        { mutationId: 11, status: "applied" },
        { mutationId: 12, status: "rejected", message: taken },
        { mutationId: 13, status: "applied" },
      ],
    });
    expect(await rejectionsOf(tablet.clientId)).toEqual([
      {
        mutationId: 4,
        name: "site.create",
        reason: "Invalid site.create: latitudeDeg: Latitude must be between −90° and 90°",
      },
      { mutationId: 5, name: "site.create", reason: taken },
      { mutationId: 7, name: "site.create", reason: taken },
      { mutationId: 12, name: "site.create", reason: taken },
    ]);

    // Seven changes, one position each, in mutation order and without a gap.
    expect(await counterOf(campaignId)).toBe(base + 7);
    const changed = await ctx.database.db
      .select()
      .from(sites)
      .where(and(eq(sites.campaignId, campaignId), gt(sites.changeSeq, base)))
      .orderBy(asc(sites.changeSeq));
    expect(changed.map((s) => [s.name, s.changeSeq - base])).toEqual([
      ["Site A", 1],
      ["Site D", 2],
      ["Weir house (lower)", 3],
      ["Site E", 4],
      ["Old depot", 5],
      ["Site F", 6],
      ["Site H", 7],
    ]);
    const [foreignRow] = await ctx.database.db.select().from(sites).where(eq(sites.id, foreign.id));
    expect(foreignRow).toMatchObject({ campaignId: practiceCampaignId, name: "Practice hut" });

    const view = (site: ReturnType<typeof newSite>) => {
      const row = changed.find((s) => s.id === site.id);
      return {
        id: site.id,
        campaignId,
        name: site.name,
        kind: site.kind,
        latitudeDeg: site.latitudeDeg,
        longitudeDeg: site.longitudeDeg,
        approxHeightM: site.approxHeightM,
        notes: "",
        version: 1,
        updatedAt: row?.updatedAt.toISOString(),
        updatedBy: geodesistId,
        deletedAt: null,
      };
    };
    const audit = await auditOf(tablet.clientId);
    expect(audit.slice(0, 2).map((r) => [r.action, r.entityId])).toEqual([
      ["create", edited.id],
      ["create", removed.id],
    ]);
    expect(audit.slice(2).map((r) => [r.action, r.entityId])).toEqual([
      ["create", a.id],
      ["create", d.id],
      ["update", edited.id],
      ["create", e.id],
      ["delete", removed.id],
      ["create", f.id],
      ["create", h.id],
    ]);
    for (const site of [a, d, e, f, h]) {
      const row = audit.find((r) => r.action === "create" && r.entityId === site.id);
      expect(row).toEqual({ action: "create", entityId: site.id, before: null, after: view(site) });
    }

    // "before" of a create is SQL NULL, as recordAudit writes it, not a JSON null.
    const nulls = await ctx.database.db.execute<{ n: number }>(
      sql`select count(*)::int as n from audit_events
        where client_id = ${tablet.clientId} and action = 'create' and before is null`,
    );
    expect(nulls.rows[0]?.n).toBe(7);

    // The same push again: all duplicates, nothing written.
    const counts = async () => ({
      counter: await counterOf(campaignId),
      sites: (await ctx.database.db.select().from(sites)).length,
      rejections: (await rejectionsOf(tablet.clientId)).length,
      audit: (await auditOf(tablet.clientId)).length,
    });
    const before = await counts();
    const retry = await pushAs(ctx.app, token, body);
    expect(retry.body).toEqual({
      lastMutationId: 13,
      results: mutations.map((m) => ({ mutationId: m.mutationId, status: "duplicate" })),
    });
    expect(await counts()).toEqual(before);
  });

  it("sees a site created earlier in the same push", async () => {
    const { token } = await signInAs(ctx.app, "geodesist");
    const tablet = syncClient();
    const site = newSite({ name: "Fresh" });
    const pushed = await pushAs(ctx.app, token, {
      clientId: tablet.clientId,
      campaignId,
      mutations: [
        tablet.mutation("site.create", site),
        tablet.mutation("site.update", {
          id: site.id,
          changes: { notes: "Key under the stone" },
          base: { notes: "" },
        }),
        tablet.mutation("site.create", { ...site, name: "Fresh again" }),
      ],
    });
    expect(pushed.body.results).toEqual([
      { mutationId: 1, status: "applied" },
      { mutationId: 2, status: "applied" },
      { mutationId: 3, status: "rejected", message: "A site with this id already exists" },
    ]);
    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, site.id));
    expect(row).toMatchObject({ name: "Fresh", notes: "Key under the stone", version: 2 });
  });

  it("stores a lone surrogate as U+FFFD, as a text parameter does, rather than failing the push", async () => {
    const { token } = await signInAs(ctx.app, "geodesist");
    const tablet = syncClient();
    const broken = newSite({ name: "Hut \ud800 east", notes: "ends \udc00" });
    const pushed = await pushAs(ctx.app, token, {
      clientId: tablet.clientId,
      campaignId,
      mutations: [
        tablet.mutation("site.create", broken),
        tablet.mutation("site.create", newSite()),
      ],
    });
    expect(pushed.body.results.map((r) => r.status)).toEqual(["applied", "applied"]);
    const [row] = await ctx.database.db.select().from(sites).where(eq(sites.id, broken.id));
    expect(row).toMatchObject({ name: "Hut \ufffd east", notes: "ends \ufffd" });
    const [created] = await auditOf(tablet.clientId);
    expect(created?.after).toMatchObject({ name: "Hut \ufffd east", notes: "ends \ufffd" });
  });

  it("refuses every create of a run with the role's reason, taking no position", async () => {
    const reviewer = await signInAs(ctx.app, "reviewer");
    const geodesist = await signInAs(ctx.app, "geodesist");
    const base = await counterOf(campaignId);
    const tablet = syncClient();
    const denied = await pushAs(ctx.app, reviewer.token, {
      clientId: tablet.clientId,
      campaignId,
      mutations: [newSite(), newSite()].map((s) => tablet.mutation("site.create", s)),
    });
    const role = "Your role in this campaign does not allow this change; it is kept for recovery";
    expect(denied.body.results).toEqual([
      { mutationId: 1, status: "rejected", message: role },
      { mutationId: 2, status: "rejected", message: role },
    ]);
    expect((await rejectionsOf(tablet.clientId)).map((r) => r.reason)).toEqual([role, role]);

    const outsider = syncClient();
    const notMember = await pushAs(ctx.app, geodesist.token, {
      clientId: outsider.clientId,
      campaignId: practiceCampaignId,
      mutations: [outsider.mutation("site.create", newSite())],
    });
    expect(notMember.body.results).toEqual([
      {
        mutationId: 1,
        status: "rejected",
        message:
          "You are not a member of this campaign (any more); the change is kept for recovery",
      },
    ]);
    expect(await counterOf(campaignId)).toBe(base);
  });
});
