// Writes one pulled page into IndexedDB in one transaction: the server's records, the cursor, and
// the outbox entries the server confirms (lastMutationId) leave the outbox, refused ones go to
// recovery. Bulk reads and writes only: a page costs a handful of IndexedDB requests.
import type { ChangeRecord, PullResponse } from "../../shared/sync/protocol";
import type { EquipotDb, LocalConflict, RecoveryEntry } from "../db/database";
import { cursorKey, writeMeta } from "../db/meta";
import { rebuildViews, viewTables, type Touched } from "../db/views";
import { viewKindOf, type ViewKind } from "../db/working-copy";

type Entity = ChangeRecord["entity"];
type DataOf<E extends Entity> = Extract<ChangeRecord, { entity: E }>["data"];
type Pulled = { [E in Entity]: DataOf<E>[] };

/** The working copy each pulled entity feeds, when it has one. */
const viewOf: Partial<Record<Entity, ViewKind>> = {
  site: "sites",
  attachment: "attachments",
  checklistRun: "checklistRuns",
  checklistResult: "checklistResults",
  fieldEntry: "fieldEntries",
  levellingSection: "levellingSections",
  levellingSetup: "levellingSetups",
  leg: "legs",
  handover: "handovers",
  alert: "alerts",
};

export async function applyPulledPage(
  db: EquipotDb,
  campaignId: string,
  page: PullResponse,
): Promise<void> {
  const pulled: Pulled = {
    site: [],
    conflict: [],
    attachment: [],
    checklistTemplate: [],
    checklistRun: [],
    checklistResult: [],
    crate: [],
    fieldEntry: [],
    levellingSection: [],
    levellingSetup: [],
    leg: [],
    handover: [],
    alert: [],
    review: [],
  };
  // The union's data follows its entity; TypeScript cannot pair them through the index.
  for (const change of page.changes) (pulled[change.entity] as unknown[]).push(change.data);
  const touched: Record<ViewKind, Set<string>> = {
    sites: new Set(),
    attachments: new Set(),
    checklistRuns: new Set(),
    checklistResults: new Set(),
    fieldEntries: new Set(),
    levellingSections: new Set(),
    levellingSetups: new Set(),
    legs: new Set(),
    handovers: new Set(),
    alerts: new Set(),
  };
  for (const [entity, kind] of Object.entries(viewOf) as [Entity, ViewKind][])
    for (const record of pulled[entity]) touched[kind].add(record.id);
  const conflicts: LocalConflict[] = pulled.conflict.map((c) => ({ ...c, campaignId }));
  const reviews = pulled.review.map((r) => ({ ...r, campaignId }));
  const tables = [
    db.meta,
    db.conflicts,
    db.recovery,
    db.checklistTemplates,
    db.reviews,
    ...viewTables(db),
  ];
  await db.transaction("rw", tables, async () => {
    await db.serverSites.bulkPut(pulled.site);
    await db.serverAttachments.bulkPut(pulled.attachment);
    await db.conflicts.bulkPut(conflicts);
    await db.checklistTemplates.bulkPut(pulled.checklistTemplate);
    await db.serverChecklistRuns.bulkPut(pulled.checklistRun);
    await db.serverChecklistResults.bulkPut(pulled.checklistResult);
    await db.crates.bulkPut(pulled.crate);
    await db.serverFieldEntries.bulkPut(pulled.fieldEntry);
    await db.serverLevellingSections.bulkPut(pulled.levellingSection);
    await db.serverLevellingSetups.bulkPut(pulled.levellingSetup);
    await db.serverLegs.bulkPut(pulled.leg);
    await db.serverHandovers.bulkPut(pulled.handover);
    await db.serverAlerts.bulkPut(pulled.alert);
    await db.reviews.bulkPut(reviews);
    // Confirm only on the last page: then every change of a confirmed mutation is already here,
    // so its record never drops out of the working copy between pages.
    if (page.lastMutationId !== null && !page.hasMore) {
      // The server's own record of refusals covers a push whose answer never arrived.
      const refusedByServer = new Map(page.rejections.map((r) => [r.mutationId, r.reason]));
      const confirmed = await db.outbox
        .where("mutationId")
        .belowOrEqual(page.lastMutationId)
        .toArray();
      const refused: RecoveryEntry[] = [];
      const at = new Date().toISOString();
      for (const entry of confirmed) {
        touched[viewKindOf(entry.name)].add(entry.entityId);
        const reason =
          entry.result?.status === "rejected"
            ? (entry.result.message ?? "Refused by the server")
            : refusedByServer.get(entry.mutationId);
        if (reason === undefined) continue;
        const { campaignId: campaign, mutationId, name, args } = entry;
        refused.push({ campaignId: campaign, mutationId, name, args, reason, at });
      }
      await db.recovery.bulkAdd(refused);
      await db.outbox.bulkDelete(confirmed.map((e) => e.mutationId));
    }
    await writeMeta(db, cursorKey(campaignId), page.cursor);
    await rebuildViews(db, touched satisfies Touched);
  });
}
