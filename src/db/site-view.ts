// Rebuilds the working copy of a site from the server's record and this tablet's pending mutations.
import { sitePatchSchema } from "../../shared/schemas/sites";
import type { SiteCreateInput, SitePatch, SiteView } from "../../shared/schemas/sites";
import type { EquipotDb, LocalSite, OutboxEntry } from "./database";
import { rebuildWorkingCopies } from "./working-copy";

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

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildSiteViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverSites,
    working: db.sites,
    kind: "sites",
    apply: applyPending,
    finish: (view, pending): LocalSite => ({ ...view, pendingChanges: pending.length }),
  });
