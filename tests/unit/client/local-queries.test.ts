// The working-copy reads and exports on fake-indexeddb: sorting, tombstones, first-pull state,
// open conflicts, refused changes, and the "value seen" sent as the base of an edit.
import { describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { SiteView } from "../../../shared/schemas/sites";
import type { ConflictView } from "../../../shared/sync/protocol";
import { localSchemaVersion, openDatabase } from "../../../src/db/database";
import { exportOutbox, exportRecovery } from "../../../src/db/export";
import { ensureClientId } from "../../../src/db/meta";
import {
  findSite,
  hasPulled,
  listOpenConflicts,
  listRecovery,
  listSites,
  siteNames,
} from "../../../src/db/queries";
import {
  createSiteLocally,
  deleteSiteLocally,
  resolveConflictLocally,
  updateSiteLocally,
} from "../../../src/db/site-store";
import { applyPulledPage } from "../../../src/sync/apply-pull";

const campaignId = crypto.randomUUID();
const otherCampaign = crypto.randomUUID();
const newDb = () =>
  openDatabase(`q-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });
const values = (name: string) => ({
  name,
  kind: "depot" as const,
  latitudeDeg: 47,
  longitudeDeg: 11,
  approxHeightM: 600,
  notes: "",
});

function serverSite(name: string, overrides: Partial<SiteView> = {}): SiteView {
  return {
    ...values(name),
    id: crypto.randomUUID(),
    campaignId,
    version: 1,
    updatedAt: "2027-05-01T10:00:00.000Z",
    updatedBy: null,
    deletedAt: null,
    ...overrides,
  };
}

function conflict(overrides: Partial<ConflictView> = {}): ConflictView {
  return {
    id: crypto.randomUUID(),
    entity: "site",
    entityId: crypto.randomUUID(),
    field: "notes",
    baseValue: "a",
    serverValue: "b",
    clientValue: "c",
    openedAt: "2027-05-02T10:00:00.000Z",
    openedBy: null,
    resolvedAt: null,
    resolvedValue: null,
    ...overrides,
  };
}

describe("listSites and findSite", () => {
  it("lists the campaign's sites by name, without deleted ones or other campaigns'", async () => {
    const db = newDb();
    const gone = serverSite("Alder", { deletedAt: "2027-05-01T11:00:00.000Z" });
    const pulled = [serverSite("beech"), serverSite("Cedar"), gone];
    await applyPulledPage(db, campaignId, {
      changes: pulled.map((data, i) => ({ entity: "site", seq: i + 1, id: data.id, data })),
      cursor: 3,
      hasMore: false,
      lastMutationId: null,
      rejections: [],
    });
    await createSiteLocally(db, campaignId, values("Aspen"));
    await createSiteLocally(db, otherCampaign, values("Abele"));
    const doomed = await createSiteLocally(db, campaignId, values("Birch"));
    await deleteSiteLocally(db, campaignId, doomed);

    expect((await listSites(db, campaignId)).map((s) => s.name)).toEqual([
      "Aspen",
      "beech",
      "Cedar",
    ]);
    expect(await findSite(db, campaignId, gone.id)).toBeNull();
    expect(await findSite(db, otherCampaign, pulled[0]?.id ?? "")).toBeNull();
    expect(await findSite(db, campaignId, pulled[0]?.id ?? "")).toMatchObject({ name: "beech" });
    expect((await siteNames(db, campaignId)).get(gone.id)).toBe("Alder");
  });
});

describe("hasPulled", () => {
  it("is false until a first page was applied, even an empty one", async () => {
    const db = newDb();
    await createSiteLocally(db, campaignId, values("Made offline"));
    expect(await hasPulled(db, campaignId)).toBe(false);
    await applyPulledPage(db, campaignId, {
      changes: [],
      cursor: 0,
      hasMore: false,
      lastMutationId: null,
      rejections: [],
    });
    expect(await hasPulled(db, campaignId)).toBe(true);
    expect(await hasPulled(db, otherCampaign)).toBe(false);
  });
});

describe("conflicts and recovery", () => {
  it("lists open conflicts oldest first and leaves resolved ones out", async () => {
    const db = newDb();
    const late = conflict({ openedAt: "2027-05-03T00:00:00.000Z" });
    const early = conflict({ openedAt: "2027-05-01T00:00:00.000Z" });
    const done = conflict({ resolvedAt: "2027-05-04T00:00:00.000Z" });
    await db.conflicts.bulkPut([late, early, done].map((c) => ({ ...c, campaignId })));
    await db.conflicts.put({ ...conflict(), campaignId: otherCampaign });
    expect((await listOpenConflicts(db, campaignId)).map((c) => c.id)).toEqual([early.id, late.id]);
  });

  it("lists refused changes newest first and exports them with the client id", async () => {
    const db = newDb();
    const clientId = await ensureClientId(db);
    for (const mutationId of [3, 7])
      await db.recovery.add({
        campaignId,
        mutationId,
        name: "site.create",
        args: { id: crypto.randomUUID(), name: `Site ${mutationId}` },
        reason: "Your role may not change sites",
        at: "2027-05-05T00:00:00.000Z",
      });
    expect((await listRecovery(db, campaignId)).map((e) => e.mutationId)).toEqual([7, 3]);
    const file = await exportRecovery(db, campaignId);
    expect(file).toMatchObject({ kind: "equipot-recovery", clientId, localSchemaVersion });
    expect(file.entries.map((e) => e.mutationId)).toEqual([3, 7]);
    expect(file.entries[0]?.reason).toBe("Your role may not change sites");
  });
});

describe("exportOutbox and edits", () => {
  it("exports every unsent change in order", async () => {
    const db = newDb();
    const id = await createSiteLocally(db, campaignId, values("Col"));
    await updateSiteLocally(db, campaignId, id, { notes: "Key under the stone" });
    const file = await exportOutbox(db);
    expect(file.kind).toBe("equipot-outbox");
    expect(file.entries.map((e) => [e.mutationId, e.name])).toEqual([
      [1, "site.create"],
      [2, "site.update"],
    ]);
  });

  it("sends the value seen when the form opened as the base, not a newer pulled one", async () => {
    const db = newDb();
    const site = serverSite("Ridge", { notes: "old" });
    await db.transaction("rw", db.serverSites, db.sites, async () => {
      await db.serverSites.put({ ...site, notes: "pulled meanwhile" });
      await db.sites.put({ ...site, notes: "pulled meanwhile", pendingChanges: 0 });
    });
    await updateSiteLocally(db, campaignId, site.id, { notes: "mine" }, { notes: "old" });
    const [entry] = await db.outbox.toArray();
    expect(entry?.args).toEqual({
      id: site.id,
      changes: { notes: "mine" },
      base: { notes: "old" },
    });
  });
});

describe("resolving a conflict", () => {
  it("shows the chosen value in the working copy at once, marked as not yet sent", async () => {
    const db = newDb();
    const site = serverSite("Ridge", { notes: "from the server" });
    await applyPulledPage(db, campaignId, {
      changes: [{ entity: "site", seq: 1, id: site.id, data: site }],
      cursor: 1,
      hasMore: false,
      lastMutationId: null,
      rejections: [],
    });
    const open = conflict({
      entityId: site.id,
      serverValue: "from the server",
      clientValue: "mine",
    });
    await db.conflicts.put({ ...open, campaignId });
    await resolveConflictLocally(db, campaignId, open.id, "mine");
    expect(await findSite(db, campaignId, site.id)).toMatchObject({
      notes: "mine",
      pendingChanges: 1,
    });
    expect(await listOpenConflicts(db, campaignId)).toEqual([]);
    const [entry] = await db.outbox.toArray();
    expect(entry).toMatchObject({ name: "conflict.resolve", args: { id: open.id, value: "mine" } });
  });
});
