// Working copies of checklist runs and results: the server's record with this tablet's pending
// start, sign-off and results on top. The outbox entry's snapshot carries what the arguments do
// not: the items a run copied from its template, and whether a result is out of range.
import type {
  ChecklistItem,
  ChecklistPurpose,
  ChecklistResultView,
  ChecklistRunView,
  ChecklistValue,
} from "../../shared/schemas/checklists";
import type { EquipotDb, LocalChecklistResult, LocalChecklistRun, OutboxEntry } from "./database";
import { rebuildWorkingCopies } from "./working-copy";

export interface RunSnapshot {
  title: string;
  purpose: ChecklistPurpose;
  items: ChecklistItem[];
}

function applyRun(record: ChecklistRunView | undefined, entry: OutboxEntry) {
  if (entry.name === "checklist.start") {
    const args = entry.args as {
      id: string;
      templateId: string;
      siteId: string;
      startedAt: string;
    };
    const snapshot = entry.snapshot as RunSnapshot;
    return {
      id: args.id,
      campaignId: entry.campaignId,
      templateId: args.templateId,
      siteId: args.siteId,
      ...snapshot,
      startedAt: args.startedAt,
      startedBy: null,
      signedOffAt: null,
      signedOffBy: null,
      signOffNote: "",
    } satisfies ChecklistRunView;
  }
  if (entry.name === "checklist.signOff" && record && record.signedOffAt === null) {
    const args = entry.args as { signedOffAt: string; note?: string };
    return { ...record, signedOffAt: args.signedOffAt, signOffNote: args.note ?? "" };
  }
  return record;
}

function applyResult(record: ChecklistResultView | undefined, entry: OutboxEntry) {
  if (entry.name !== "checklist.record") return record;
  const args = entry.args as {
    id: string;
    runId: string;
    itemId: string;
    value: ChecklistValue;
    note?: string;
    recordedAt: string;
  };
  const { outOfRange, recordedByName = null } = entry.snapshot as {
    outOfRange: boolean;
    recordedByName?: string | null;
  };
  return {
    id: args.id,
    campaignId: entry.campaignId,
    runId: args.runId,
    itemId: args.itemId,
    value: args.value,
    outOfRange,
    note: args.note ?? "",
    recordedAt: args.recordedAt,
    recordedBy: null,
    recordedByName,
  } satisfies ChecklistResultView;
}

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildChecklistRunViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverChecklistRuns,
    working: db.checklistRuns,
    kind: "checklistRuns",
    apply: applyRun,
    finish: (view, pending): LocalChecklistRun => ({ ...view, pending: pending.length > 0 }),
  });

export const rebuildChecklistResultViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverChecklistResults,
    working: db.checklistResults,
    kind: "checklistResults",
    apply: applyResult,
    finish: (view, pending): LocalChecklistResult => ({ ...view, pending: pending.length > 0 }),
  });
