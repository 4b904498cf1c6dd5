// Writes one pulled page into IndexedDB in one transaction: the server's records, the cursor, and
// the outbox entries the server confirms (lastMutationId) leave the outbox, refused ones go to
// recovery. Bulk reads and writes only: a page costs a handful of IndexedDB requests.
import type { AttachmentLinkView } from "../../shared/schemas/attachments";
import type {
  ChecklistResultView,
  ChecklistRunView,
  ChecklistTemplateView,
} from "../../shared/schemas/checklists";
import type { SiteView } from "../../shared/schemas/sites";
import type { PullResponse } from "../../shared/sync/protocol";
import type { EquipotDb, LocalConflict, RecoveryEntry } from "../db/database";
import { cursorKey, writeMeta } from "../db/meta";
import { rebuildViews, viewTables } from "../db/views";
import { viewKindOf } from "../db/working-copy";

export async function applyPulledPage(
  db: EquipotDb,
  campaignId: string,
  page: PullResponse,
): Promise<void> {
  const sites: SiteView[] = [];
  const links: AttachmentLinkView[] = [];
  const conflicts: LocalConflict[] = [];
  const templates: ChecklistTemplateView[] = [];
  const runs: ChecklistRunView[] = [];
  const results: ChecklistResultView[] = [];
  for (const change of page.changes) {
    if (change.entity === "site") sites.push(change.data);
    else if (change.entity === "attachment") links.push(change.data);
    else if (change.entity === "conflict") conflicts.push({ ...change.data, campaignId });
    else if (change.entity === "checklistTemplate") templates.push(change.data);
    else if (change.entity === "checklistRun") runs.push(change.data);
    else results.push(change.data);
  }
  const touched = {
    sites: new Set(sites.map((s) => s.id)),
    attachments: new Set(links.map((l) => l.id)),
    checklistRuns: new Set(runs.map((r) => r.id)),
    checklistResults: new Set(results.map((r) => r.id)),
  };
  const checklistTables = [
    db.checklistTemplates,
    db.serverChecklistRuns,
    db.serverChecklistResults,
  ];
  const tables = [db.meta, db.conflicts, db.recovery, ...checklistTables, ...viewTables(db)];
  await db.transaction("rw", tables, async () => {
    await db.serverSites.bulkPut(sites);
    await db.serverAttachments.bulkPut(links);
    await db.conflicts.bulkPut(conflicts);
    await db.checklistTemplates.bulkPut(templates);
    await db.serverChecklistRuns.bulkPut(runs);
    await db.serverChecklistResults.bulkPut(results);
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
    await rebuildViews(db, touched);
  });
}
