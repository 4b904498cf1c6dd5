// Reads of crates and field entries for live queries and tests.
import type { CrateView } from "../../shared/schemas/crates";
import type { EquipotDb, LocalFieldEntry } from "./database";

/** The campaign's crates by label, deleted ones left out. */
export async function listCrates(db: EquipotDb, campaignId: string): Promise<CrateView[]> {
  const crates = await db.crates.where("campaignId").equals(campaignId).toArray();
  return crates
    .filter((c) => c.deletedAt === null)
    .sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }));
}

/** A site's entries, newest observation first. */
export async function listSiteEntries(
  db: EquipotDb,
  campaignId: string,
  siteId: string,
): Promise<LocalFieldEntry[]> {
  const entries = await db.fieldEntries.where("siteId").equals(siteId).toArray();
  return entries
    .filter((e) => e.campaignId === campaignId)
    .sort((a, b) => b.observedAt.localeCompare(a.observedAt) || b.id.localeCompare(a.id));
}
