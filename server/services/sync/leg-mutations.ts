// A crate's legs: planned once, then departed, arrived or cancelled, each once. The leg's row lock
// orders two tablets recording the same step (the later one is answered "Already …"); departure and
// arrival also move the crate's state, with its own version, change position and audit event.
import { nextChangeSeq } from "../../db/change-seq";
import {
  findCrate,
  findCrateForUpdate,
  updateCrate,
} from "../../db/repositories/crates-benchmarks";
import { findLegForUpdate, insertLeg, legIdTaken, updateLeg } from "../../db/repositories/legs";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentCrate } from "../../presenters/crate-benchmark";
import { presentLeg } from "../../presenters/logistics";
import type { CrateState } from "../../../shared/schemas/logistics";
import type { LegRow } from "../../db/repositories/legs";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

type Step = Args<"leg.depart">;

const inCampaign = async (ctx: ApplyContext, siteId: string) =>
  (await findSiteAnywhere(ctx.tx, siteId))?.campaignId === ctx.campaignId;

/** Times as people read them in a refusal. */
export const readableTime = (at: Date) =>
  at
    .toISOString()
    .replace("T", " ")
    .replace(/\.\d{3}Z$/, " UTC");

/** A step's note is kept on the leg, after what was there, marked with the step. */
const withStepNote = (leg: LegRow, step: string, note: string) =>
  note === "" ? leg.note : [leg.note, `${step}: ${note}`].filter((n) => n !== "").join("\n");

async function moveCrate(ctx: ApplyContext, crateId: string, state: CrateState) {
  const current = await findCrateForUpdate(ctx.tx, ctx.campaignId, crateId);
  if (!current || current.state === state) return;
  const row = await updateCrate(ctx.tx, ctx.campaignId, crateId, {
    state,
    version: current.version + 1,
    updatedAt: new Date(),
    updatedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await auditChange(ctx, {
    action: "update",
    entity: "crate",
    entityId: crateId,
    before: presentCrate(current),
    after: presentCrate(row),
  });
}

async function lockedLeg(ctx: ApplyContext, id: string): Promise<LegRow> {
  const leg = await findLegForUpdate(ctx.tx, ctx.campaignId, id);
  if (!leg) throw new Rejection("This leg is not in this campaign");
  return leg;
}

async function recordStep(
  ctx: ApplyContext,
  leg: LegRow,
  action: string,
  patch: Partial<LegRow>,
): Promise<LegRow> {
  const row = await updateLeg(ctx.tx, leg.id, {
    ...patch,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await auditChange(ctx, {
    action,
    entity: "leg",
    entityId: leg.id,
    before: presentLeg(leg),
    after: presentLeg(row),
  });
  return row;
}

export async function applyLegPlan(
  ctx: ApplyContext,
  args: Args<"leg.plan">,
): Promise<ApplyOutcome> {
  if (await legIdTaken(ctx.tx, args.id)) throw new Rejection("A leg with this id already exists");
  if (!(await findCrate(ctx.tx, ctx.campaignId, args.crateId)))
    throw new Rejection("The crate of this leg is not in this campaign");
  if (!(await inCampaign(ctx, args.fromSiteId)))
    throw new Rejection("The place this leg starts from is not a site of this campaign");
  if (!(await inCampaign(ctx, args.toSiteId)))
    throw new Rejection("The place this leg ends at is not a site of this campaign");
  const row = await insertLeg(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    crateId: args.crateId,
    fromSiteId: args.fromSiteId,
    toSiteId: args.toSiteId,
    vehicle: args.vehicle,
    plannedDepartAt: new Date(args.plannedDepartAt),
    plannedArriveAt: new Date(args.plannedArriveAt),
    note: args.note,
    createdBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await auditChange(ctx, {
    action: "create",
    entity: "leg",
    entityId: row.id,
    after: presentLeg(row),
  });
  return { status: "applied" };
}

export async function applyLegDepart(ctx: ApplyContext, args: Step): Promise<ApplyOutcome> {
  const leg = await lockedLeg(ctx, args.id);
  if (leg.departedAt) return { status: "applied", message: "Already departed" };
  if (leg.cancelledAt)
    throw new Rejection("This leg was cancelled; plan a new leg for the journey");
  await recordStep(ctx, leg, "depart", {
    departedAt: new Date(args.at),
    departedBy: ctx.userId,
    note: withStepNote(leg, "Departure", args.note),
  });
  await moveCrate(ctx, leg.crateId, "moving");
  return { status: "applied" };
}

export async function applyLegArrive(ctx: ApplyContext, args: Step): Promise<ApplyOutcome> {
  const leg = await lockedLeg(ctx, args.id);
  if (leg.arrivedAt) return { status: "applied", message: "Already arrived" };
  if (leg.cancelledAt) throw new Rejection("This leg was cancelled; it cannot arrive");
  if (!leg.departedAt)
    throw new Rejection("This leg has not departed yet: record the departure first");
  const at = new Date(args.at);
  if (at < leg.departedAt)
    throw new Rejection(
      `The arrival at ${readableTime(at)} is before the departure at ${readableTime(leg.departedAt)}`,
    );
  await recordStep(ctx, leg, "arrive", {
    arrivedAt: at,
    arrivedBy: ctx.userId,
    note: withStepNote(leg, "Arrival", args.note),
  });
  await moveCrate(ctx, leg.crateId, "arrived");
  return { status: "applied" };
}

export async function applyLegCancel(ctx: ApplyContext, args: Step): Promise<ApplyOutcome> {
  const leg = await lockedLeg(ctx, args.id);
  if (leg.cancelledAt) return { status: "applied", message: "Already cancelled" };
  if (leg.departedAt)
    throw new Rejection("This leg has already departed; only a planned leg can be cancelled");
  await recordStep(ctx, leg, "cancel", {
    cancelledAt: new Date(args.at),
    cancelledBy: ctx.userId,
    note: withStepNote(leg, "Cancelled", args.note),
  });
  return { status: "applied" };
}
