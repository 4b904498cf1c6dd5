import { checklistItems, checklistValue } from "../../shared/schemas/checklists";
import type {
  ChecklistResultView,
  ChecklistRunView,
  ChecklistTemplateView,
} from "../../shared/schemas/checklists";
import type {
  ChecklistResultRow,
  ChecklistRunRow,
  ChecklistTemplateRow,
} from "../db/repositories/checklists";

// Items and values are only written after validation; parsing keeps the views honest.
export const presentTemplate = (row: ChecklistTemplateRow): ChecklistTemplateView => ({
  id: row.id,
  campaignId: row.campaignId,
  title: row.title,
  purpose: row.purpose,
  items: checklistItems.parse(row.items),
  version: row.version,
  updatedAt: row.updatedAt.toISOString(),
  deletedAt: row.deletedAt?.toISOString() ?? null,
});

export const presentRun = (row: ChecklistRunRow): ChecklistRunView => ({
  id: row.id,
  campaignId: row.campaignId,
  templateId: row.templateId,
  siteId: row.siteId,
  title: row.title,
  purpose: row.purpose,
  items: checklistItems.parse(row.items),
  startedAt: row.startedAt.toISOString(),
  startedBy: row.startedBy,
  signedOffAt: row.signedOffAt?.toISOString() ?? null,
  signedOffBy: row.signedOffBy,
  signOffNote: row.signOffNote,
});

export const presentResult = (
  row: ChecklistResultRow & { recordedByName?: string | null },
): ChecklistResultView => ({
  id: row.id,
  campaignId: row.campaignId,
  runId: row.runId,
  itemId: row.itemId,
  value: checklistValue.parse(row.value),
  outOfRange: row.outOfRange,
  note: row.note,
  recordedAt: row.recordedAt.toISOString(),
  recordedBy: row.recordedBy,
  recordedByName: row.recordedByName ?? null,
});
