// Custody of a crate passes from person to person, recorded append-only and in time order. The
// crate's row lock orders two tablets handing over the same crate at once, so the chain is checked
// against the handover that really came before.
import { custodyProblem } from "../../../shared/custody";
import { nextChangeSeq } from "../../db/change-seq";
import { findCrateForUpdate } from "../../db/repositories/crates-benchmarks";
import {
  findHandover,
  handoverIdTaken,
  insertHandover,
  latestHandoverOfCrate,
} from "../../db/repositories/handovers";
import { findLeg } from "../../db/repositories/legs";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentHandover } from "../../presenters/logistics";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";
import { readableTime } from "./leg-mutations";

export async function applyHandoverRecord(
  ctx: ApplyContext,
  args: Args<"handover.record">,
): Promise<ApplyOutcome> {
  if (await handoverIdTaken(ctx.tx, args.id))
    throw new Rejection("A handover with this id already exists");
  // A deleted crate still takes handovers: custody that happened is never thrown away.
  const crate = await findCrateForUpdate(ctx.tx, ctx.campaignId, args.crateId);
  if (!crate) throw new Rejection("The crate of this handover is not in this campaign");
  if (
    args.legId !== null &&
    (await findLeg(ctx.tx, ctx.campaignId, args.legId))?.crateId !== crate.id
  )
    throw new Rejection(`The leg of this handover is not a leg of ${crate.label}`);
  if (
    args.siteId !== null &&
    (await findSiteAnywhere(ctx.tx, args.siteId))?.campaignId !== ctx.campaignId
  )
    throw new Rejection("The site of this handover is not in this campaign");
  const at = new Date(args.at);
  const previous = await latestHandoverOfCrate(ctx.tx, ctx.campaignId, crate.id);
  const problem = custodyProblem(previous ?? null, { at, fromName: args.fromName });
  if (problem?.kind === "out-of-order" && previous)
    throw new Rejection(
      `The handover at ${readableTime(at)} is ${at < previous.at ? "earlier than" : "at the same time as"} the last handover of ${crate.label} at ${readableTime(previous.at)}; custody is recorded in time order`,
    );
  if (problem?.kind === "wrong-giver")
    throw new Rejection(`${crate.label} is held by ${problem.holder}, not ${args.fromName}`);
  const row = await insertHandover(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    crateId: crate.id,
    legId: args.legId,
    fromName: args.fromName,
    toName: args.toName,
    at,
    siteId: args.siteId,
    place: args.place,
    condition: args.condition,
    note: args.note,
    recordedBy: ctx.userId,
    recordedAt: new Date(),
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  const stored = await findHandover(ctx.tx, ctx.campaignId, row.id);
  await auditChange(ctx, {
    action: "create",
    entity: "handover",
    entityId: row.id,
    after: presentHandover(stored ?? { ...row, recordedByName: null }),
  });
  return { status: "applied" };
}
