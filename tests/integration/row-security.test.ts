// Row-level security, the second layer under the application's membership checks: the application's
// role cannot pass it, every campaign table has it, the application's own queries with its checks
// bypassed see no other campaign, and no scope survives on a pooled connection.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { inject } from "vitest";
import { connect, type Database } from "../../server/db/client";
import { listSites } from "../../server/db/repositories/sites";
import { listCampaignsOfUser } from "../../server/db/repositories/campaigns";
import { campaigns, memberships, sites, users } from "../../server/db/schema";
import { asSystem, withScope } from "../../server/db/scope";
import { scopeTransaction } from "../../server/db/scoped-pool";
import { takenSiteIds } from "../../server/db/repositories/sites";
import { privilegedRoleProblem } from "../../server/db/app-role";
import { startServer } from "../../server/index";
import { createTestDatabase, type TestDatabase } from "../helpers/db";
import { testConfig } from "../helpers/config";
import { seedDemo } from "../../server/seed/demo";

// Tables that hold no campaign's data, with the reason; every other table must be under RLS.
const exempt: Record<string, string> = {
  users: "people, shared by campaigns (names shown only through memberships)",
  refresh_tokens: "a person's sessions, read by token hash",
  auth_throttle: "sign-in failure counters",
  email_outbox: "read only by the mail worker",
  sync_clients: "a device's counter, read by device id and owner",
};

let database: TestDatabase;
let app: Database;
let demoId: string;
let ownId: string;
let outsiderId: string;
let fieldUserId: string;
const own = () => ({ user: outsiderId, campaigns: [ownId] });

/** Every public table with its campaign column ("id" for campaigns; none for the chunks). */
async function campaignTables(): Promise<{ table: string; column: string | undefined }[]> {
  const { rows } = await database.pool.query<{ table_name: string; has: boolean }>(
    `select t.table_name,
            exists (select 1 from information_schema.columns c
                     where c.table_schema = 'public' and c.table_name = t.table_name
                       and c.column_name = 'campaign_id') as has
       from information_schema.tables t
      where t.table_schema = 'public' and t.table_type = 'BASE TABLE'
      order by t.table_name`,
  );
  return rows
    .filter((r) => !(r.table_name in exempt))
    .map((r) => ({
      table: r.table_name,
      column: r.table_name === "campaigns" ? "id" : r.has ? "campaign_id" : undefined,
    }));
}

/** Rows of `table` this connection sees, by campaign (chunks count under their file's campaign). */
async function visibleByCampaign(db: Database, table: string, column: string | undefined) {
  const from = column
    ? `select ${column}::text as campaign from ${table}`
    : `select f.campaign_id::text as campaign from ${table} x join comparison_files f on f.id = x.file_id`;
  const { rows } = await db.pool.query<{ campaign: string | null }>(from);
  return rows.map((r) => r.campaign);
}

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, "test");
  app = connect(database.url, 2);
  const all = await database.db.select().from(campaigns);
  demoId = all.find((c) => !c.name.startsWith("Practice"))?.id ?? "";
  ownId = all.find((c) => c.name.startsWith("Practice"))?.id ?? "";
  const [outsider] = await database.db
    .insert(users)
    .values({ email: "outsider@practice.equipot.test", name: "Outsider" })
    .returning();
  outsiderId = outsider?.id ?? "";
  await database.db
    .insert(memberships)
    .values({ campaignId: ownId, userId: outsiderId, role: "admin" });
  await database.db.insert(sites).values({
    id: crypto.randomUUID(),
    campaignId: ownId,
    name: "Practice hut",
    kind: "other",
    latitudeDeg: 1,
    longitudeDeg: 2,
    approxHeightM: 3,
    changeSeq: 1,
  });
  const field = await database.db
    .select()
    .from(users)
    .where(eq(users.email, "field@demo.equipot.test"));
  fieldUserId = field[0]?.id ?? "";
});

afterAll(async () => {
  await app.close();
  await database.drop();
});

describe("the application's role", () => {
  it("is neither superuser nor owner and lacks BYPASSRLS", async () => {
    expect(await privilegedRoleProblem(app.pool)).toBeUndefined();
    const { rows } = await app.pool.query<{ name: string }>("select current_user as name");
    expect(rows[0]?.name).toBe(inject("pgAppRole").name);
    // The check is real: the fixtures' superuser connection fails it, naming why.
    expect(await privilegedRoleProblem(database.pool)).toMatch(/superuser.*owns the tables/);
  });

  it("stops the server from starting as a privileged role", async () => {
    await expect(startServer(testConfig({ DATABASE_URL: database.ownerUrl }))).rejects.toThrow(
      /row-level security needs a role/,
    );
  });

  it("finds RLS enabled and forced on every table that holds campaign data", async () => {
    const { rows } = await database.pool.query<{ name: string; on: boolean; forced: boolean }>(
      `select c.relname as name, c.relrowsecurity as on, c.relforcerowsecurity as forced
         from pg_class c join pg_namespace n on n.oid = c.relnamespace
        where n.nspname = 'public' and c.relkind = 'r'`,
    );
    const tables = await campaignTables();
    expect(tables.length).toBeGreaterThanOrEqual(29);
    for (const { table } of tables) {
      const row = rows.find((r) => r.name === table);
      expect({ table, on: row?.on, forced: row?.forced }).toEqual({
        table,
        on: true,
        forced: true,
      });
    }
    // The exempt tables exist and none of them has a campaign column.
    const { rows: columns } = await database.pool.query<{ table_name: string }>(
      `select table_name from information_schema.columns
        where table_schema = 'public' and column_name = 'campaign_id'`,
    );
    for (const name of Object.keys(exempt)) {
      expect(rows.some((r) => r.name === name)).toBe(true);
      expect(columns.some((c) => c.table_name === name)).toBe(false);
    }
  });
});

describe("with the application's checks bypassed", () => {
  it("sees only its own campaign in every table, though the demo campaign has rows in many", async () => {
    let foreignTables = 0;
    for (const { table, column } of await campaignTables()) {
      const all = await visibleByCampaign(database, table, column);
      if (all.some((c) => c === demoId)) foreignTables += 1;
      const seen = await withScope(own(), () => visibleByCampaign(app, table, column));
      expect({ table, foreign: seen.filter((c) => c !== ownId && c !== null) }).toEqual({
        table,
        foreign: [],
      });
    }
    // The demo seed fills most tables, so the check above had foreign rows to hide.
    expect(foreignTables).toBeGreaterThanOrEqual(8);
  });

  it("sees nothing when a route sets a campaign whose member the person is not", async () => {
    // As if a handler had skipped campaignMember and scoped by the URL's id.
    const wrong = { user: outsiderId, campaigns: [demoId] };
    for (const { table, column } of await campaignTables()) {
      const seen = await withScope(wrong, () => visibleByCampaign(app, table, column));
      // One's own memberships and campaigns stay readable in any scope.
      expect({ table, seen: seen.filter((c) => c === demoId) }).toEqual({ table, seen: [] });
    }
    expect(await withScope(wrong, () => listSites(app.db, demoId))).toEqual([]);
    const write = withScope(wrong, () =>
      app.db.insert(sites).values({
        id: crypto.randomUUID(),
        campaignId: demoId,
        name: "Smuggled",
        kind: "other",
        latitudeDeg: 0,
        longitudeDeg: 0,
        approxHeightM: 0,
        changeSeq: 999,
      }),
    );
    await expect(write).rejects.toMatchObject({ cause: { code: "42501" } });
    const bump = await withScope(wrong, () =>
      app.db.update(campaigns).set({ name: "Renamed" }).where(eq(campaigns.id, demoId)).returning(),
    );
    expect(bump).toEqual([]);
    const [demo] = await database.db.select().from(campaigns).where(eq(campaigns.id, demoId));
    expect(demo?.name).not.toBe("Renamed");
  });

  it("sees no campaign data at all without a scope, and everything as named system work", async () => {
    expect(await listSites(app.db, demoId)).toEqual([]);
    expect(await app.db.select().from(memberships)).toEqual([]);
    const system = await asSystem("test", () => app.db.select().from(sites));
    expect(system.length).toBe((await database.db.select().from(sites)).length);
  });

  it("lists a person's own campaigns only, outside any campaign", async () => {
    const mine = await withScope({ user: outsiderId, campaigns: "none" }, () =>
      listCampaignsOfUser(app.db, outsiderId),
    );
    expect(mine.map((c) => c.id)).toEqual([ownId]);
    // Asking for another person's list from one's own scope gives nothing.
    const theirs = await withScope({ user: outsiderId, campaigns: "none" }, () =>
      listCampaignsOfUser(app.db, fieldUserId),
    );
    expect(theirs).toEqual([]);
  });

  it("still refuses a client-made id taken in a hidden campaign, telling nothing else", async () => {
    const [demoSite] = await database.db.select().from(sites).where(eq(sites.campaignId, demoId));
    const taken = await withScope(own(), () => takenSiteIds(app.db, [demoSite?.id ?? ""]));
    expect([...taken]).toEqual([demoSite?.id]);
    // The lookup's lifted scope ends with it.
    expect(await withScope(own(), () => listSites(app.db, demoId))).toEqual([]);
  });
});

describe("pooled connections", () => {
  const settingsOf = (db: Database) =>
    db.db.execute<{ campaigns: string; user: string }>(
      sql`select current_setting('equipot.campaigns', true) as campaigns, current_setting('equipot.user', true) as user`,
    );

  it("never carry a scope from one checkout to the next", async () => {
    const single = connect(database.url, 1);
    try {
      const a = await withScope(own(), () => listSites(single.db, ownId));
      expect(a.length).toBe(1);
      // Same connection, next user: no scope.
      expect(await listSites(single.db, ownId)).toEqual([]);
      expect((await settingsOf(single)).rows[0]).toEqual({ campaigns: "none", user: "" });
      const field = { user: fieldUserId, campaigns: [demoId] };
      expect((await withScope(field, () => listSites(single.db, ownId))).length).toBe(0);
      expect((await withScope(field, () => listSites(single.db, demoId))).length).toBeGreaterThan(
        0,
      );
      // A transaction's own narrowing ends with it.
      await withScope({ user: fieldUserId, campaigns: "none" }, () =>
        single.db.transaction(async (tx) => {
          await scopeTransaction(tx, field);
          expect((await listSites(tx, demoId)).length).toBeGreaterThan(0);
        }),
      );
      expect(
        (await withScope({ user: fieldUserId, campaigns: "none" }, () => settingsOf(single)))
          .rows[0],
      ).toEqual({ campaigns: "none", user: fieldUserId });
    } finally {
      await single.close();
    }
  });

  it("give each of many interleaved requests its own campaign only", async () => {
    const people = [
      { scope: own(), campaign: ownId },
      { scope: { user: fieldUserId, campaigns: [demoId] }, campaign: demoId },
      { scope: undefined, campaign: undefined },
    ];
    const runs = Array.from({ length: 40 }, () => people).flat();
    await Promise.all(
      runs.map(async ({ scope, campaign }) => {
        const read = () =>
          app.db.transaction(async (tx) => {
            const rows = await tx.select({ campaignId: sites.campaignId }).from(sites);
            const setting = await tx.execute<{ campaigns: string }>(
              sql`select current_setting('equipot.campaigns', true) as campaigns`,
            );
            return { rows, setting: setting.rows[0]?.campaigns };
          });
        const { rows, setting } = scope ? await withScope(scope, read) : await read();
        expect(setting).toBe(campaign ?? "none");
        expect(rows.every((r) => r.campaignId === campaign)).toBe(true);
        if (campaign) expect(rows.length).toBeGreaterThan(0);
        else expect(rows).toEqual([]);
      }),
    );
  });
});
