// Store and engine on fake-indexeddb with a small in-memory stand-in for the server's sync API.
import { describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { SiteView } from "../../../shared/schemas/sites";
import type {
  ChangeRecord,
  PullResponse,
  PushRequest,
  PushResponse,
} from "../../../shared/sync/protocol";
import { openDatabase } from "../../../src/db/database";
import {
  createSiteLocally,
  deleteSiteLocally,
  updateSiteLocally,
} from "../../../src/db/site-store";
import { applyPulledPage } from "../../../src/sync/apply-pull";
import { createSyncEngine } from "../../../src/sync/engine";
import type { PullParams, SyncTransport } from "../../../src/sync/transport";

const campaignId = crypto.randomUUID();
const values = {
  name: "Col hut",
  kind: "mountain" as const,
  latitudeDeg: 46.9,
  longitudeDeg: 10.1,
  approxHeightM: 2400,
  notes: "",
};

function fakeServer() {
  const sites = new Map<string, SiteView & { seq: number }>();
  const last = new Map<string, number>();
  let seq = 0;
  const pushes: PushRequest[] = [];
  let failNextPushAfterApply = false;
  const transport: SyncTransport = {
    async push(request): Promise<PushResponse> {
      pushes.push(request);
      let applied = last.get(request.clientId) ?? 0;
      const results = request.mutations.map((m) => {
        if (m.mutationId <= applied)
          return { mutationId: m.mutationId, status: "duplicate" as const };
        applied = m.mutationId;
        const args = m.args as { id: string; changes?: Partial<SiteView> };
        const existing = sites.get(args.id);
        if (m.name === "site.create")
          sites.set(args.id, {
            ...(m.args as SiteView),
            campaignId,
            version: 1,
            updatedAt: m.createdAt,
            updatedBy: null,
            deletedAt: null,
            seq: ++seq,
          });
        if (m.name === "site.update" && existing)
          sites.set(args.id, {
            ...existing,
            ...args.changes,
            version: existing.version + 1,
            seq: ++seq,
          });
        if (m.name === "site.delete" && existing)
          sites.set(args.id, { ...existing, deletedAt: m.createdAt, seq: ++seq });
        return { mutationId: m.mutationId, status: "applied" as const };
      });
      last.set(request.clientId, applied);
      if (failNextPushAfterApply) {
        failNextPushAfterApply = false;
        throw new Error("response lost");
      }
      return { results, lastMutationId: applied };
    },
    async pull({ cursor, limit, clientId }: PullParams): Promise<PullResponse> {
      const all = [...sites.values()].filter((s) => s.seq > cursor).sort((a, b) => a.seq - b.seq);
      const page = all.slice(0, limit);
      const changes: ChangeRecord[] = page.map(({ seq: s, ...data }) => ({
        entity: "site",
        seq: s,
        id: data.id,
        data,
      }));
      return {
        changes,
        cursor: page.at(-1)?.seq ?? cursor,
        hasMore: all.length > limit,
        lastMutationId: last.get(clientId) ?? 0,
      };
    },
  };
  return { transport, sites, pushes, loseNextResponse: () => (failNextPushAfterApply = true) };
}

const engineFor = (db: ReturnType<typeof openDatabase>, server: ReturnType<typeof fakeServer>) =>
  createSyncEngine({ db, transport: server.transport, campaignIds: () => [campaignId] });

const newDb = () =>
  openDatabase(`t-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });

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
    const server = fakeServer();
    const engine = createSyncEngine({
      db,
      transport: server.transport,
      campaignIds: () => [campaignId],
      pushBatch: 2,
      pullPage: 2,
    });
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
    const server = fakeServer();
    const engine = engineFor(db, server);
    const id = await createSiteLocally(db, campaignId, values);
    server.loseNextResponse();
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
    const server = fakeServer();
    const engine = engineFor(db, server);
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
    });
    expect(await db.sites.get(id)).toMatchObject({
      name: "Mine, not yet sent",
      notes: "From the office",
      pendingChanges: 1,
    });
    expect(await db.outbox.count()).toBe(1);
  });
});
