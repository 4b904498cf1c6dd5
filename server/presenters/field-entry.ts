import { fieldEntryData, type FieldEntryView } from "../../shared/schemas/field-entries";
import type { FieldEntryRow } from "../db/repositories/field-entries";

// Data is only written after validation; parsing keeps the view honest.
export const presentFieldEntry = (row: FieldEntryRow): FieldEntryView => ({
  id: row.id,
  campaignId: row.campaignId,
  siteId: row.siteId,
  crateId: row.crateId,
  kind: row.kind,
  observedAt: row.observedAt.toISOString(),
  note: row.note,
  data: fieldEntryData.parse(row.data),
  flags: { exceeded: row.exceeded, summary: row.summary },
  recordedAt: row.recordedAt.toISOString(),
  recordedBy: row.recordedBy,
  recordedByName: row.recordedByName,
});
