// Attachment links are append-only: one mutation adds a link, one removes it. They never conflict;
// a second remove is harmless. The bytes travel separately (PUT …/attachments/:sha256).
import type { AttachmentSubjectKind } from "../../../shared/schemas/attachments";
import { nextChangeSeq } from "../../db/change-seq";
import {
  attachmentLinkIdTaken,
  findAttachmentLinkForUpdate,
  insertAttachmentLink,
  updateAttachmentLink,
} from "../../db/repositories/attachment-links";
import { findRunForUpdate } from "../../db/repositories/checklists";
import { findEntry } from "../../db/repositories/field-entries";
import { findHandover } from "../../db/repositories/handovers";
import { findSection } from "../../db/repositories/levelling";
import { findSiteAnywhere } from "../../db/repositories/sites";
import { presentAttachmentLink } from "../../presenters/attachment-link";
import { auditChange, Rejection, type ApplyContext, type ApplyOutcome, type Args } from "./context";

/** The record a file is attached to must be in the same campaign (a deleted one still counts). */
const subjectFinders: Record<
  AttachmentSubjectKind,
  (ctx: ApplyContext, id: string) => Promise<boolean>
> = {
  site: async (ctx, id) => (await findSiteAnywhere(ctx.tx, id))?.campaignId === ctx.campaignId,
  checklistRun: async (ctx, id) =>
    (await findRunForUpdate(ctx.tx, ctx.campaignId, id)) !== undefined,
  fieldEntry: async (ctx, id) => (await findEntry(ctx.tx, ctx.campaignId, id)) !== undefined,
  levellingSection: async (ctx, id) =>
    (await findSection(ctx.tx, ctx.campaignId, id)) !== undefined,
  handover: async (ctx, id) => (await findHandover(ctx.tx, ctx.campaignId, id)) !== undefined,
};

const audit = (
  ctx: ApplyContext,
  action: string,
  entityId: string,
  before: unknown,
  after: unknown,
) => auditChange(ctx, { action, entity: "attachment", entityId, before, after });

export async function applyAttachmentAdd(
  ctx: ApplyContext,
  args: Args<"attachment.add">,
): Promise<ApplyOutcome> {
  if (await attachmentLinkIdTaken(ctx.tx, args.id))
    throw new Rejection("An attachment with this id already exists");
  if (!(await subjectFinders[args.subject.kind](ctx, args.subject.id)))
    throw new Rejection(`The ${args.subject.kind} this file belongs to is not in this campaign`);
  const row = await insertAttachmentLink(ctx.tx, {
    id: args.id,
    campaignId: ctx.campaignId,
    sha256: args.sha256,
    contentType: args.contentType,
    sizeBytes: args.sizeBytes,
    name: args.name,
    subjectKind: args.subject.kind,
    subjectId: args.subject.id,
    caption: args.caption,
    takenAt: args.takenAt === null ? null : new Date(args.takenAt),
    createdBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "create", row.id, null, presentAttachmentLink(row));
  return { status: "applied" };
}

export async function applyAttachmentRemove(
  ctx: ApplyContext,
  args: Args<"attachment.remove">,
): Promise<ApplyOutcome> {
  const current = await findAttachmentLinkForUpdate(ctx.tx, ctx.campaignId, args.id);
  if (!current) throw new Rejection("Attachment not found");
  if (current.removedAt) return { status: "applied", message: "Already removed" };
  const row = await updateAttachmentLink(ctx.tx, current.id, {
    removedAt: new Date(),
    removedBy: ctx.userId,
    changeSeq: await nextChangeSeq(ctx.tx, ctx.campaignId),
  });
  await audit(ctx, "delete", row.id, presentAttachmentLink(current), null);
  return { status: "applied" };
}
