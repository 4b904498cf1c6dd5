// Local checklist writes: start a run of a template at a site, record a result, sign off. Each is
// one transaction with its outbox entry (outbox.ts); the same checks as the server run first, so a
// mistake shows at once on the tablet instead of at the next sync.
import { checkResult } from "../../shared/checklists";
import { dewPointClears } from "../../shared/field-entries";
import {
  checklistRecordInput,
  checklistSignOffInput,
  checklistStartInput,
  type ChecklistValue,
} from "../../shared/schemas/checklists";
import type { RunSnapshot } from "./checklist-view";
import type { EquipotDb, LocalChecklistResult } from "./database";
import { readAuthorName, recordMutation } from "./outbox";

export async function startChecklistLocally(
  db: EquipotDb,
  campaignId: string,
  templateId: string,
  siteId: string,
  id = crypto.randomUUID(),
): Promise<string> {
  const template = await db.checklistTemplates.get(templateId);
  if (!template || template.campaignId !== campaignId || template.deletedAt !== null)
    throw new Error("This checklist is not on this device");
  const args = checklistStartInput.parse({
    id,
    templateId,
    siteId,
    startedAt: new Date().toISOString(),
  });
  const snapshot: RunSnapshot = {
    title: template.title,
    purpose: template.purpose,
    items: template.items,
  };
  await recordMutation(db, { campaignId, name: "checklist.start", entityId: id, args, snapshot });
  return id;
}

/** The latest result of each item of a run (a correction is a newer result). */
export async function latestResults(
  db: EquipotDb,
  runId: string,
): Promise<Map<string, LocalChecklistResult>> {
  const all = await db.checklistResults.where("runId").equals(runId).toArray();
  all.sort((a, b) => a.recordedAt.localeCompare(b.recordedAt) || a.id.localeCompare(b.id));
  return new Map(all.map((r) => [r.itemId, r]));
}

async function openRun(db: EquipotDb, campaignId: string, runId: string) {
  const run = await db.checklistRuns.get(runId);
  if (!run || run.campaignId !== campaignId)
    throw new Error("This checklist is not on this device");
  if (run.signedOffAt !== null)
    throw new Error("This checklist is signed off and takes no more results");
  return run;
}

/** Returns whether the value lies outside the item's range (flagged at once). */
export async function recordResultLocally(
  db: EquipotDb,
  campaignId: string,
  runId: string,
  itemId: string,
  value: ChecklistValue,
  note = "",
): Promise<{ id: string; outOfRange: boolean }> {
  const run = await openRun(db, campaignId, runId);
  const item = run.items.find((i) => i.id === itemId);
  if (!item) throw new Error(`This checklist has no item "${itemId}"`);
  const checked = checkResult(item, value);
  if (!checked.ok) throw new Error(checked.message);
  const id = crypto.randomUUID();
  const args = checklistRecordInput.parse({
    id,
    runId,
    itemId,
    value,
    note,
    recordedAt: new Date().toISOString(),
  });
  await recordMutation(db, {
    campaignId,
    name: "checklist.record",
    entityId: id,
    args,
    snapshot: { outOfRange: checked.outOfRange, recordedByName: await readAuthorName(db) },
  });
  return { id, outOfRange: checked.outOfRange };
}

/** Refused, with the items still open, until every required item has a result. */
export async function signOffLocally(db: EquipotDb, campaignId: string, runId: string, note = "") {
  const run = await openRun(db, campaignId, runId);
  const answered = await latestResults(db, runId);
  const missing = run.items.filter((i) => i.required && !answered.has(i.id)).map((i) => i.label);
  if (missing.length > 0)
    throw new Error(`Not signed off: no result yet for ${missing.join("; ")}`);
  if (run.purpose === "unpacking" && !(await dewPointCleared(db, run)))
    throw new Error(dewPointGate);
  const args = checklistSignOffInput.parse({
    id: runId,
    signedOffAt: new Date().toISOString(),
    note,
  });
  await recordMutation(db, { campaignId, name: "checklist.signOff", entityId: runId, args });
}

export const dewPointGate =
  "Not signed off: the dew-point check must pass, or be overridden with a reason, before the crate is unpacked";

/** Whether a dew-point check recorded for this run passed or was overridden with a reason. */
export async function dewPointCleared(
  db: EquipotDb,
  run: { id: string; siteId: string },
): Promise<boolean> {
  const entries = await db.fieldEntries.where("siteId").equals(run.siteId).toArray();
  return entries.some(
    (e) => e.data.kind === "dew-point" && e.data.runId === run.id && dewPointClears(e.data),
  );
}
