// Field entries are append-only (a correction is a newer entry), so they never conflict. The server
// assesses each against its crate's limits as it arrives and keeps the verdict with the entry.
import { assessEntry } from "../../../shared/field-entries";
import { ScienceInputError } from "../../../shared/science/errors";
import { nextChangeSeq } from "../../db/change-seq";
import { findCrate } from "../../db/repositories/crates-benchmarks";
import { entryIdTaken, findEntry, insertEntry } from "../../db/repositories/field-entries";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentFieldEntry } from "../../presenters/field-entry";
import { raiseAlertForEntry } from "../alerts.service";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

/** The app's public address for links in alert e-mails, once the push passes it on. */

export async function applyEntryAdd(
  ctx: ApplyContext,
  args: Args<"entry.add">,
): Promise<ApplyOutcome> {
  if (await entryIdTaken(ctx.tx, args.id))
    throw new Rejection("A field entry with this id already exists");
  if ((await findSiteAnywhere(ctx.tx, args.siteId))?.campaignId !== ctx.campaignId)
    throw new Rejection("The site of this entry is not in this campaign");
  const crate =
    args.crateId === null ? null : await findCrate(ctx.tx, ctx.campaignId, args.crateId);
  if (crate === undefined) throw new Rejection("The crate of this entry is not in this campaign");
  let flags;
  try {
    flags = assessEntry(args.data, crate);
  } catch (error) {
    // The schema keeps inputs inside the science core's ranges; should one slip through, say which.
    if (error instanceof ScienceInputError)
      throw new Rejection(`Invalid entry.add: ${error.message}`);
    throw error;
  }
  const row = await insertEntry(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    siteId: args.siteId,
    crateId: crate?.id ?? null,
    kind: args.data.kind,
    observedAt: new Date(args.observedAt),
    note: args.note,
    data: args.data,
    exceeded: flags.exceeded,
    summary: flags.summary,
    recordedAt: new Date(args.recordedAt),
    recordedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  const stored = await findEntry(ctx.tx, ctx.campaignId, row.id);
  await auditChange(ctx, {
    action: "create",
    entity: "fieldEntry",
    entityId: row.id,
    after: presentFieldEntry(stored ?? { ...row, recordedByName: null }),
  });
  if (flags.exceeded)
    await raiseAlertForEntry(ctx.tx, {
      entry: row,
      crateLabel: crate?.label ?? null,
      recordedByName: stored?.recordedByName ?? null,
      linkBase: ctx.linkBase?.(),
    });
  return { status: "applied" };
}
