// Writes one pulled page into IndexedDB in one transaction: the server's records, the cursor, and
// the outbox entries the server confirms (lastMutationId) leave the outbox, refused ones go to recovery.
import type { PullResponse } from "../../shared/sync/protocol";
import type { EquipotDb, OutboxEntry } from "../db/database";
import { cursorKey, writeMeta } from "../db/meta";
import { rebuildViews, viewTables } from "../db/views";

export async function applyPulledPage(
  db: EquipotDb,
  campaignId: string,
  page: PullResponse,
): Promise<void> {
  const tables = [db.meta, db.conflicts, db.recovery, ...viewTables(db)];
  await db.transaction("rw", tables, async () => {
    const touched = new Set<string>();
    for (const change of page.changes) {
      if (change.entity === "site") await db.serverSites.put(change.data);
      else if (change.entity === "attachment") await db.serverAttachments.put(change.data);
      else await db.conflicts.put({ ...change.data, campaignId });
      if (change.entity !== "conflict") touched.add(change.id);
    }
    // Confirm only on the last page: then every change of a confirmed mutation is already here,
    // so its record never drops out of the working copy between pages.
    if (page.lastMutationId !== null && !page.hasMore) {
      // The server's own record of refusals covers a push whose answer never arrived.
      const refusedByServer = new Map(page.rejections.map((r) => [r.mutationId, r.reason]));
      const confirmed: OutboxEntry[] = await db.outbox
        .where("mutationId")
        .belowOrEqual(page.lastMutationId)
        .toArray();
      for (const entry of confirmed) {
        touched.add(entry.entityId);
        const reason =
          entry.result?.status === "rejected"
            ? (entry.result.message ?? "Refused by the server")
            : refusedByServer.get(entry.mutationId);
        if (reason === undefined) continue;
        await db.recovery.add({
          campaignId: entry.campaignId,
          mutationId: entry.mutationId,
          name: entry.name,
          args: entry.args,
          reason,
          at: new Date().toISOString(),
        });
      }
      await db.outbox.bulkDelete(confirmed.map((e) => e.mutationId));
    }
    await writeMeta(db, cursorKey(campaignId), page.cursor);
    await rebuildViews(db, touched);
  });
}
