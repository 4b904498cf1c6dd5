// Writes one pulled page into IndexedDB in one transaction: the server's records, the cursor, and
// the outbox entries the server confirms (lastMutationId) leave the outbox, refused ones go to recovery.
import type { PullResponse } from "../../shared/sync/protocol";
import type { EquipotDb, OutboxEntry } from "../db/database";
import { cursorKey, writeMeta } from "../db/meta";
import { rebuildSiteViews } from "../db/site-view";

export async function applyPulledPage(
  db: EquipotDb,
  campaignId: string,
  page: PullResponse,
): Promise<void> {
  const tables = [db.meta, db.outbox, db.serverSites, db.sites, db.conflicts, db.recovery];
  await db.transaction("rw", tables, async () => {
    const touched = new Set<string>();
    for (const change of page.changes) {
      if (change.entity === "site") {
        await db.serverSites.put(change.data);
        touched.add(change.id);
      } else {
        await db.conflicts.put({ ...change.data, campaignId });
      }
    }
    // Confirm only on the last page: then every change of a confirmed mutation is already here,
    // so its record never drops out of the working copy between pages.
    if (page.lastMutationId !== null && !page.hasMore) {
      const confirmed: OutboxEntry[] = await db.outbox
        .where("mutationId")
        .belowOrEqual(page.lastMutationId)
        .toArray();
      for (const entry of confirmed) {
        touched.add(entry.entityId);
        if (entry.result?.status === "rejected") {
          await db.recovery.add({
            campaignId: entry.campaignId,
            mutationId: entry.mutationId,
            name: entry.name,
            args: entry.args,
            reason: entry.result.message ?? "Refused by the server",
            at: new Date().toISOString(),
          });
        }
      }
      await db.outbox.bulkDelete(confirmed.map((e) => e.mutationId));
    }
    await writeMeta(db, cursorKey(campaignId), page.cursor);
    await rebuildSiteViews(db, touched);
  });
}
