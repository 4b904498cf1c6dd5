// The levelling field book: a section is opened once and closed once; its setups are append-only
// (a correction is a newer setup with the same run and number, the latest counts), so two tablets
// never conflict. The section's row lock orders setups against a close from another tablet.
import { formatMillimetres, summariseSection } from "../../../shared/levelling-book";
import { ScienceInputError } from "../../../shared/science/errors";
import { nextChangeSeq } from "../../db/change-seq";
import {
  findSectionForUpdate,
  findSetup,
  insertSection,
  insertSetup,
  sectionIdTaken,
  setupIdTaken,
  setupsOfSection,
  updateSection,
} from "../../db/repositories/levelling";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentSection, presentSetup } from "../../presenters/levelling";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

const audit = (
  ctx: ApplyContext,
  action: string,
  entity: string,
  entityId: string,
  after: unknown,
) => auditChange(ctx, { action, entity, entityId, after });

export async function applyLevellingOpen(
  ctx: ApplyContext,
  args: Args<"levelling.open">,
): Promise<ApplyOutcome> {
  if (await sectionIdTaken(ctx.tx, args.id))
    throw new Rejection("A levelling section with this id already exists");
  if ((await findSiteAnywhere(ctx.tx, args.siteId))?.campaignId !== ctx.campaignId)
    throw new Rejection("The site of this levelling section is not in this campaign");
  const row = await insertSection(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    siteId: args.siteId,
    fromMark: args.fromMark,
    toMark: args.toMark,
    classId: args.classId,
    instrument: args.instrument,
    openedAt: new Date(args.openedAt),
    openedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "create", "levellingSection", row.id, presentSection(row));
  return { status: "applied" };
}

export async function applyLevellingSetup(
  ctx: ApplyContext,
  args: Args<"levelling.setup">,
): Promise<ApplyOutcome> {
  if (await setupIdTaken(ctx.tx, args.id))
    throw new Rejection("A levelling setup with this id already exists");
  const section = await findSectionForUpdate(ctx.tx, ctx.campaignId, args.sectionId);
  if (!section) throw new Rejection("This levelling section is not in this campaign");
  if (section.closedAt)
    throw new Rejection("This section was already closed; the setup is kept for recovery");
  const row = await insertSetup(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    sectionId: section.id,
    run: args.run,
    number: args.number,
    backsightM: args.backsightM,
    foresightM: args.foresightM,
    backsightDistanceM: args.backsightDistanceM,
    foresightDistanceM: args.foresightDistanceM,
    note: args.note,
    recordedAt: new Date(args.recordedAt),
    recordedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  const stored = await findSetup(ctx.tx, ctx.campaignId, row.id);
  await audit(
    ctx,
    "create",
    "levellingSetup",
    row.id,
    presentSetup(stored ?? { ...row, recordedByName: null }),
  );
  return { status: "applied" };
}

export async function applyLevellingClose(
  ctx: ApplyContext,
  args: Args<"levelling.close">,
): Promise<ApplyOutcome> {
  const section = await findSectionForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!section) throw new Rejection("This levelling section is not in this campaign");
  if (section.closedAt) return { status: "applied", message: "Already closed" };
  const setups = (await setupsOfSection(ctx.tx, section.id)).map((s) => ({
    ...s,
    recordedAt: s.recordedAt.toISOString(),
  }));
  let closure;
  try {
    closure = summariseSection(section.classId, setups).closure;
  } catch (error) {
    if (error instanceof ScienceInputError) throw new Rejection(`Not closed: ${error.message}`);
    throw error;
  }
  if (closure === null)
    throw new Rejection("Not closed: the forward and the backward run both need complete setups");
  if (!closure.withinTolerance && args.note === "")
    throw new Rejection(
      `Not closed: the misclosure of ${formatMillimetres(closure.misclosureM)} is beyond the tolerance of ±${formatMillimetres(closure.toleranceM)}; give the reason for closing anyway in the note`,
    );
  const row = await updateSection(ctx.tx, section.id, {
    closedAt: new Date(args.closedAt),
    closedBy: ctx.userId,
    closeNote: args.note,
    closure,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "close", "levellingSection", row.id, presentSection(row));
  return { status: "applied" };
}
