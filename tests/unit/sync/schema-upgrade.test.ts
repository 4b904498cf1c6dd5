// An app update brings a new local schema version: the outbox written under the old one must
// survive the upgrade and still be sent, in order, with the counter going on where it stopped.
import { describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { localSchemaVersion, openDatabase, schemaHistory } from "../../../src/db/database";
import { addAttachmentLocally } from "../../../src/db/attachment-store";
import { createSyncEngine } from "../../../src/sync/engine";
import { fakeServer } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const site = {
  name: "Lower depot",
  kind: "depot" as const,
  latitudeDeg: 45.2,
  longitudeDeg: 8.3,
  approxHeightM: 410,
  notes: "",
};

describe("local schema upgrade", () => {
  it("has every shipped version in order, the newest being the one opened", () => {
    const versions = schemaHistory.map((v) => v.version);
    expect(versions).toEqual([...versions].sort((a, b) => a - b));
    expect(new Set(versions).size).toBe(versions.length);
    expect(localSchemaVersion).toBe(versions.at(-1));
    expect(localSchemaVersion).toBeGreaterThan(1);
  });

  it("keeps the outbox written under version 1 and sends it after the update", async () => {
    const factory = new IDBFactory();
    const name = `upgrade-${crypto.randomUUID()}`;
    const old = openDatabase(name, { indexedDB: factory, IDBKeyRange }, 1);
    // Rows as the version-1 app wrote them (its own code is gone after the update).
    const id = crypto.randomUUID();
    const at = "2027-06-01T08:00:00.000Z";
    await old.transaction("rw", [old.meta, old.outbox, old.sites], async () => {
      await old.meta.bulkPut([
        { key: "clientId", value: crypto.randomUUID() },
        { key: "nextMutationId", value: 3 },
      ]);
      await old.outbox.bulkAdd([
        {
          mutationId: 1,
          campaignId,
          name: "site.create",
          entityId: id,
          args: { id, ...site },
          createdAt: at,
        },
        {
          mutationId: 2,
          campaignId,
          name: "site.update",
          entityId: id,
          args: { id, changes: { notes: "Key under the stone" }, base: { notes: "" } },
          createdAt: at,
        },
      ]);
      await old.sites.add({
        ...site,
        id,
        campaignId,
        notes: "Key under the stone",
        version: 0,
        updatedAt: at,
        updatedBy: null,
        deletedAt: null,
        pendingChanges: 2,
      });
    });
    expect(old.verno).toBe(1);
    expect(old.tables.map((t) => t.name)).not.toContain("files");
    old.close();

    const updated = openDatabase(name, { indexedDB: factory, IDBKeyRange });
    await updated.open();
    expect(updated.verno).toBe(localSchemaVersion);
    expect((await updated.outbox.toArray()).map((e) => [e.mutationId, e.name])).toEqual([
      [1, "site.create"],
      [2, "site.update"],
    ]);
    expect(await updated.sites.get(id)).toMatchObject({
      notes: "Key under the stone",
      pendingChanges: 2,
    });
    // The new tables work, and the counter goes on after the old entries.
    await addAttachmentLocally(updated, campaignId, {
      subject: { kind: "site", id },
      bytes: new TextEncoder().encode("photo").buffer as ArrayBuffer,
      contentType: "image/png",
      name: "depot.png",
    });
    expect((await updated.outbox.toArray()).map((e) => e.mutationId)).toEqual([1, 2, 3]);

    const server = fakeServer(campaignId);
    const engine = createSyncEngine({
      db: updated,
      transport: server.transport,
      campaignIds: () => [campaignId],
    });
    await engine.sync();
    expect(server.pushes.flatMap((p) => p.mutations.map((m) => m.mutationId))).toEqual([1, 2, 3]);
    expect(server.sites.get(id)).toMatchObject({ notes: "Key under the stone", version: 2 });
    expect(await updated.outbox.count()).toBe(0);
  });
});
