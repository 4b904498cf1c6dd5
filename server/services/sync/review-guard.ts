// An approved record is read-only until a reviewer reopens it (DESIGN.md §6): the server refuses
// any pushed change to it or its parts, and the change is kept on the tablet for recovery.
import { and, eq } from "drizzle-orm";
import {
  reviewSubjectKinds,
  reviewSubjectLabels,
  type ReviewSubjectKind,
} from "../../../shared/schemas/reviews";
import type { MutationName } from "../../../shared/sync/protocol";
import type { Tx } from "../../db/client";
import { attachmentLinks } from "../../db/schema";
import { approvalOf } from "../reviews.service";
import { Rejection, type Args } from "./context";

type Subject = { kind: ReviewSubjectKind; id: string } | null;

const reviewable = (kind: string): kind is ReviewSubjectKind =>
  (reviewSubjectKinds as readonly string[]).includes(kind);

async function linkSubject(tx: Tx, campaignId: string, linkId: string): Promise<Subject> {
  const [link] = await tx
    .select({ kind: attachmentLinks.subjectKind, id: attachmentLinks.subjectId })
    .from(attachmentLinks)
    .where(and(eq(attachmentLinks.campaignId, campaignId), eq(attachmentLinks.id, linkId)));
  return link && reviewable(link.kind) ? { kind: link.kind, id: link.id } : null;
}

/** The reviewable record a mutation changes, if it changes one that exists already. */
async function subjectOf(tx: Tx, campaignId: string, name: MutationName, args: unknown) {
  switch (name) {
    case "checklist.record":
      return { kind: "checklistRun", id: (args as Args<"checklist.record">).runId } as const;
    case "checklist.signOff":
      return { kind: "checklistRun", id: (args as Args<"checklist.signOff">).id } as const;
    case "levelling.setup":
      return { kind: "levellingSection", id: (args as Args<"levelling.setup">).sectionId } as const;
    case "levelling.close":
      return { kind: "levellingSection", id: (args as Args<"levelling.close">).id } as const;
    case "leg.depart":
    case "leg.arrive":
    case "leg.cancel":
      return { kind: "leg", id: (args as Args<"leg.depart">).id } as const;
    case "attachment.add": {
      const { subject } = args as Args<"attachment.add">;
      return reviewable(subject.kind) ? { kind: subject.kind, id: subject.id } : null;
    }
    case "attachment.remove":
      return linkSubject(tx, campaignId, (args as Args<"attachment.remove">).id);
    default:
      return null;
  }
}

const dateOf = (iso: string) => iso.slice(0, 10);

/** Throws a Rejection when the mutation (validated `args` of kind `name`) touches an approved record. */
export async function refuseIfApproved(
  tx: Tx,
  campaignId: string,
  name: MutationName,
  args: unknown,
): Promise<void> {
  const subject = await subjectOf(tx, campaignId, name, args);
  if (!subject) return;
  const approval = await approvalOf(tx, campaignId, subject.kind, subject.id);
  if (!approval) return;
  throw new Rejection(
    `This ${reviewSubjectLabels[subject.kind].toLowerCase()} was approved by ${
      approval.decidedByName ?? "a reviewer"
    } on ${dateOf(approval.decidedAt)} and is read-only; ask a reviewer to reopen it. Your change is kept on this device for recovery`,
  );
}
