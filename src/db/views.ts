// The working copies, rebuilt after every local write and every pulled page.
import { rebuildAttachmentViews } from "./attachment-view";
import type { EquipotDb } from "./database";
import { rebuildSiteViews } from "./site-view";

/** The tables a rebuild reads and writes: include them in the transaction of any write. */
export const viewTables = (db: EquipotDb) => [
  db.outbox,
  db.serverSites,
  db.sites,
  db.serverAttachments,
  db.attachments,
];

/** Ids of any entity: each kind's rebuild leaves records of other kinds alone. */
export async function rebuildViews(db: EquipotDb, ids: Iterable<string>): Promise<void> {
  const unique = [...new Set(ids)];
  await rebuildSiteViews(db, unique);
  await rebuildAttachmentViews(db, unique);
}
