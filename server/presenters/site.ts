import type { SiteView } from "../../shared/schemas/sites";
import type { SiteRow } from "../db/repositories/sites";

export function presentSite(row: SiteRow): SiteView {
  return {
    id: row.id,
    campaignId: row.campaignId,
    name: row.name,
    kind: row.kind,
    latitudeDeg: row.latitudeDeg,
    longitudeDeg: row.longitudeDeg,
    approxHeightM: row.approxHeightM,
    notes: row.notes,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    updatedBy: row.updatedBy,
    deletedAt: row.deletedAt?.toISOString() ?? null,
  };
}
