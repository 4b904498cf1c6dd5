// Store and engine on fake-indexeddb with a small in-memory stand-in for the server (helpers/fake-sync).
import { describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { openDatabase } from "../../../src/db/database";
import {
  createSiteLocally,
  deleteSiteLocally,
  updateSiteLocally,
} from "../../../src/db/site-store";
import { applyPulledPage } from "../../../src/sync/apply-pull";
import { engineFor, fakeServer, newDb, type FakeServer } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const values = {
  name: "Col hut",
  kind: "mountain" as const,
  latitudeDeg: 46.9,
  longitudeDeg: 10.1,
  approxHeightM: 2400,
  notes: "",
};

const newServer = () => fakeServer(campaignId);
const engineOf = (db: ReturnType<typeof newDb>, server: FakeServer) =>
  engineFor(db, server, campaignId);

describe("local store", () => {
  it("writes the working copy and the outbox entry together, with increasing mutation ids", async () => {
    const db = newDb();
    const id = await createSiteLocally(db, campaignId, values);
    await updateSiteLocally(db, campaignId, id, { name: "Col hut (upper)" });
    const outbox = await db.outbox.toArray();
    expect(outbox.map((e) => [e.mutationId, e.name])).toEqual([
      [1, "site.create"],
      [2, "site.update"],
    ]);
    expect(outbox[1]?.args).toEqual({
      id,
      changes: { name: "Col hut (upper)" },
      base: { name: "Col hut" },
    });
    expect(await db.sites.get(id)).toMatchObject({ name: "Col hut (upper)", pendingChanges: 2 });
  });

  it("does not record an edit that changes nothing", async () => {
    const db = newDb();
    const id = await createSiteLocally(db, campaignId, values);
    expect(await updateSiteLocally(db, campaignId, id, { name: "Col hut" })).toBe(false);
    expect(await db.outbox.count()).toBe(1);
  });

  it("keeps the outbox and the counter across a reopen of the database", async () => {
    const factory = new IDBFactory();
    const name = `reopen-${crypto.randomUUID()}`;
    const first = openDatabase(name, { indexedDB: factory, IDBKeyRange });
    await createSiteLocally(first, campaignId, values);
    first.close();
    const second = openDatabase(name, { indexedDB: factory, IDBKeyRange });
    await createSiteLocally(second, campaignId, { ...values, name: "Second" });
    expect((await second.outbox.toArray()).map((e) => e.mutationId)).toEqual([1, 2]);
  });
});

describe("sync engine", () => {
  it("pushes in order, pulls, and drops outbox entries only once a pull confirms them", async () => {
    const db = newDb();
    const server = newServer();
    const engine = engineFor(db, server, campaignId, { pushBatch: 2, pullPage: 2 });
    const a = await createSiteLocally(db, campaignId, values);
    const b = await createSiteLocally(db, campaignId, { ...values, name: "Second" });
    await updateSiteLocally(db, campaignId, a, { notes: "Door sticks" });
    await deleteSiteLocally(db, campaignId, b);
    await engine.sync();
    expect(server.pushes.map((p) => p.mutations.map((m) => m.mutationId))).toEqual([
      [1, 2],
      [3, 4],
    ]);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.sites.get(a)).toMatchObject({
      notes: "Door sticks",
      version: 2,
      pendingChanges: 0,
    });
    expect(await db.sites.get(b)).toMatchObject({ deletedAt: expect.any(String) });
    expect(engine.getStatus()).toMatchObject({
      pending: 0,
      running: false,
      error: null,
      lastSuccessAt: expect.any(String),
    });
  });

  it("resends after a lost response without doubling anything", async () => {
    const db = newDb();
    const server = newServer();
    const engine = engineOf(db, server);
    const id = await createSiteLocally(db, campaignId, values);
    server.controls.loseNextResponse = true;
    await expect(engine.sync()).rejects.toThrow();
    expect(await db.outbox.count()).toBe(1);
    expect(engine.getStatus().error?.kind).toBe("server");
    await engine.sync();
    expect(server.pushes[1]?.mutations.map((m) => m.mutationId)).toEqual([1]);
    expect(server.sites.size).toBe(1);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.sites.get(id)).toMatchObject({ version: 1 });
  });

  it("keeps local edits on top of newer server data until they are confirmed", async () => {
    const db = newDb();
    const server = newServer();
    const engine = engineOf(db, server);
    const id = await createSiteLocally(db, campaignId, values);
    await engine.sync();
    const synced = await db.serverSites.get(id);
    await updateSiteLocally(db, campaignId, id, { name: "Mine, not yet sent" });
    if (!synced) throw new Error("the site was not pulled");
    // Someone else's change arrives by pull while ours is still pending (the server has not seen it).
    await applyPulledPage(db, campaignId, {
      changes: [
        { entity: "site", seq: 99, id, data: { ...synced, notes: "From the office", version: 2 } },
      ],
      cursor: 99,
      hasMore: false,
      lastMutationId: 1,
      rejections: [],
    });
    expect(await db.sites.get(id)).toMatchObject({
      name: "Mine, not yet sent",
      notes: "From the office",
      pendingChanges: 1,
    });
    expect(await db.outbox.count()).toBe(1);
  });
});
