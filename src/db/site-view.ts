// Rebuilds the working copy of a site from the server's record and this tablet's pending mutations.
import { sitePatchSchema } from "../../shared/schemas/sites";
import type { SiteCreateInput, SitePatch, SiteView } from "../../shared/schemas/sites";
import type { EquipotDb, LocalSite, OutboxEntry } from "./database";

function applyPending(record: SiteView | undefined, entry: OutboxEntry): SiteView | undefined {
  switch (entry.name) {
    case "site.create": {
      const args = entry.args as Required<Pick<SiteCreateInput, "id">> & SiteCreateInput;
      return {
        id: args.id,
        campaignId: entry.campaignId,
        name: args.name,
        kind: args.kind,
        latitudeDeg: args.latitudeDeg,
        longitudeDeg: args.longitudeDeg,
        approxHeightM: args.approxHeightM,
        notes: args.notes ?? "",
        version: 0,
        updatedAt: entry.createdAt,
        updatedBy: null,
        deletedAt: null,
      };
    }
    case "site.update":
      return record
        ? {
            ...record,
            ...(entry.args as { changes: SitePatch }).changes,
            updatedAt: entry.createdAt,
          }
        : record;
    case "site.delete":
      return record ? { ...record, deletedAt: entry.createdAt } : record;
    case "conflict.resolve": {
      // Only a site's own editable fields; anything else waits for the server's answer.
      const field = entry.field;
      if (!record || field === undefined || !(field in sitePatchSchema.shape)) return record;
      const value = (entry.args as { value: unknown }).value;
      return { ...record, [field]: value, updatedAt: entry.createdAt };
    }
    default:
      return record;
  }
}

/** Call inside a transaction over serverSites, outbox and sites. */
export async function rebuildSiteViews(db: EquipotDb, ids: Iterable<string>): Promise<void> {
  for (const id of new Set(ids)) {
    const server = await db.serverSites.get(id);
    // Entries the server refused are not applied; they wait in recovery instead.
    const pending = (await db.outbox.where("entityId").equals(id).sortBy("mutationId")).filter(
      (e) => !e.name.startsWith("attachment.") && e.result?.status !== "rejected",
    );
    let view: SiteView | undefined = server;
    for (const entry of pending) view = applyPending(view, entry);
    if (!view) await db.sites.delete(id);
    else await db.sites.put({ ...view, pendingChanges: pending.length } satisfies LocalSite);
  }
}
