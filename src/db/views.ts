// The working copies: the server's record with this device's pending mutations on top, rebuilt
// after every local write and every pulled page. A few bulk reads and writes per call, however
// many records, so a pulled page of 500 costs a handful of IndexedDB requests, not thousands.
import { rebuildAttachmentViews } from "./attachment-view";
import { rebuildChecklistResultViews, rebuildChecklistRunViews } from "./checklist-view";
import type { EquipotDb } from "./database";
import { rebuildFieldEntryViews } from "./field-entry-view";
import { rebuildLevellingSectionViews, rebuildLevellingSetupViews } from "./levelling-view";
import { rebuildAlertViews, rebuildHandoverViews, rebuildLegViews } from "./logistics-view";
import { rebuildSiteViews } from "./site-view";
import type { ViewKind } from "./working-copy";

export type Touched = Partial<Record<ViewKind, Iterable<string>>>;

/** The tables a rebuild reads and writes: include them in the transaction of any write. */
export const viewTables = (db: EquipotDb) => [
  db.outbox,
  db.serverSites,
  db.sites,
  db.serverAttachments,
  db.attachments,
  db.checklistTemplates,
  db.serverChecklistRuns,
  db.checklistRuns,
  db.serverChecklistResults,
  db.checklistResults,
  db.crates,
  db.serverFieldEntries,
  db.fieldEntries,
  db.serverLevellingSections,
  db.levellingSections,
  db.serverLevellingSetups,
  db.levellingSetups,
  db.serverLegs,
  db.legs,
  db.serverHandovers,
  db.handovers,
  db.serverAlerts,
  db.alerts,
];

export async function rebuildViews(db: EquipotDb, touched: Touched): Promise<void> {
  await rebuildSiteViews(db, touched.sites ?? []);
  await rebuildAttachmentViews(db, touched.attachments ?? []);
  await rebuildChecklistRunViews(db, touched.checklistRuns ?? []);
  await rebuildChecklistResultViews(db, touched.checklistResults ?? []);
  await rebuildFieldEntryViews(db, touched.fieldEntries ?? []);
  await rebuildLevellingSectionViews(db, touched.levellingSections ?? []);
  await rebuildLevellingSetupViews(db, touched.levellingSetups ?? []);
  await rebuildLegViews(db, touched.legs ?? []);
  await rebuildHandoverViews(db, touched.handovers ?? []);
  await rebuildAlertViews(db, touched.alerts ?? []);
}
