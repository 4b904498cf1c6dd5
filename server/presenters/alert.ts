import type { AlertView } from "../../shared/schemas/logistics";
import type { AlertRow } from "../db/repositories/alerts";

export const presentAlert = (row: AlertRow): AlertView => ({
  id: row.id,
  campaignId: row.campaignId,
  crateId: row.crateId,
  siteId: row.siteId,
  entryId: row.entryId,
  kind: row.kind,
  summary: row.summary,
  createdAt: row.createdAt.toISOString(),
  acknowledgedAt: row.acknowledgedAt?.toISOString() ?? null,
  acknowledgedBy: row.acknowledgedBy,
  acknowledgeNote: row.acknowledgeNote,
});
