// Checklist runs and their results. Results are append-only (a correction is a newer result, the
// latest per item counts), so they never conflict; a run is started once and signed off once,
// after which it takes no more results. An unpacking run also needs a dew-point entry that cleared.
import { checkResult } from "../../../shared/checklists";
import { dewPointClears } from "../../../shared/field-entries";
import { checklistItems } from "../../../shared/schemas/checklists";
import { fieldEntryData } from "../../../shared/schemas/field-entries";
import { nextChangeSeq } from "../../db/change-seq";
import {
  findRunForUpdate,
  findTemplate,
  insertResult,
  insertRun,
  resultIdTaken,
  resultsOfRun,
  runIdTaken,
  updateRun,
} from "../../db/repositories/checklists";
import { dewPointEntriesOfRun } from "../../db/repositories/field-entries";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentResult, presentRun } from "../../presenters/checklist";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

const audit = (
  ctx: ApplyContext,
  action: string,
  entity: string,
  entityId: string,
  after: unknown,
) => auditChange(ctx, { action, entity, entityId, after });

export async function applyChecklistStart(
  ctx: ApplyContext,
  args: Args<"checklist.start">,
): Promise<ApplyOutcome> {
  if (await runIdTaken(ctx.tx, args.id))
    throw new Rejection("A checklist run with this id already exists");
  const template = await findTemplate(ctx.tx, ctx.campaignId, args.templateId);
  if (!template) throw new Rejection("This checklist is not in this campaign");
  if ((await findSiteAnywhere(ctx.tx, args.siteId))?.campaignId !== ctx.campaignId)
    throw new Rejection("The site of this checklist is not in this campaign");
  const row = await insertRun(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    templateId: template.id,
    siteId: args.siteId,
    title: template.title,
    purpose: template.purpose,
    items: template.items,
    startedAt: new Date(args.startedAt),
    startedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "create", "checklistRun", row.id, presentRun(row));
  return { status: "applied" };
}

export async function applyChecklistRecord(
  ctx: ApplyContext,
  args: Args<"checklist.record">,
): Promise<ApplyOutcome> {
  if (await resultIdTaken(ctx.tx, args.id))
    throw new Rejection("A checklist result with this id already exists");
  // The run's row lock orders results against a sign-off arriving from another tablet.
  const run = await findRunForUpdate(ctx.tx, ctx.campaignId, args.runId);
  if (!run) throw new Rejection("This checklist run is not in this campaign");
  if (run.signedOffAt)
    throw new Rejection("This checklist was already signed off; the result is kept for recovery");
  const item = checklistItems.parse(run.items).find((i) => i.id === args.itemId);
  if (!item) throw new Rejection(`This checklist has no item "${args.itemId}"`);
  const checked = checkResult(item, args.value);
  if (!checked.ok) throw new Rejection(checked.message);
  const row = await insertResult(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    runId: run.id,
    itemId: item.id,
    value: args.value,
    outOfRange: checked.outOfRange,
    note: args.note,
    recordedAt: new Date(args.recordedAt),
    recordedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "create", "checklistResult", row.id, presentResult(row));
  return { status: "applied" };
}

/** Condensation on cold optics is the hazard: one passed (or overridden) check for this run clears it. */
async function dewPointCleared(ctx: ApplyContext, runId: string): Promise<boolean> {
  for (const { data } of await dewPointEntriesOfRun(ctx.tx, ctx.campaignId, runId)) {
    const parsed = fieldEntryData.parse(data);
    if (parsed.kind === "dew-point" && dewPointClears(parsed)) return true;
  }
  return false;
}

export async function applyChecklistSignOff(
  ctx: ApplyContext,
  args: Args<"checklist.signOff">,
): Promise<ApplyOutcome> {
  const run = await findRunForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!run) throw new Rejection("This checklist run is not in this campaign");
  if (run.signedOffAt) return { status: "applied", message: "Already signed off" };
  const answered = new Set((await resultsOfRun(ctx.tx, run.id)).map((r) => r.itemId));
  const missing = checklistItems
    .parse(run.items)
    .filter((i) => i.required && !answered.has(i.id))
    .map((i) => i.label);
  if (missing.length > 0)
    throw new Rejection(`Not signed off: no result yet for ${missing.join("; ")}`);
  if (run.purpose === "unpacking" && !(await dewPointCleared(ctx, run.id)))
    throw new Rejection(
      "Not signed off: the dew-point check must pass, or be overridden with a reason, before the crate is unpacked",
    );
  const row = await updateRun(ctx.tx, run.id, {
    signedOffAt: new Date(args.signedOffAt),
    signedOffBy: ctx.userId,
    signOffNote: args.note,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "sign-off", "checklistRun", row.id, presentRun(row));
  return { status: "applied" };
}
