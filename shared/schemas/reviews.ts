// Office review of synced field records: decisions, the queue, and what the tablet is shown.
import { z } from "zod";

/** The field records a reviewer approves or sends back. */
export const reviewSubjectKinds = [
  "checklistRun",
  "fieldEntry",
  "levellingSection",
  "leg",
  "handover",
] as const;
export const reviewSubjectKind = z.enum(reviewSubjectKinds);
export type ReviewSubjectKind = z.infer<typeof reviewSubjectKind>;

export const reviewDecisions = ["approved", "sentBack", "reopened"] as const;
export const reviewDecision = z.enum(reviewDecisions);
export type ReviewDecision = (typeof reviewDecisions)[number];

export const reviewCommentMax = 2000;

export const reviewDecisionInput = z
  .strictObject({
    subjectKind: reviewSubjectKind,
    subjectId: z.uuid("subjectId must be a record id"),
    decision: reviewDecision,
    comment: z
      .string()
      .trim()
      .max(reviewCommentMax, `comment: at most ${reviewCommentMax} characters`)
      .default(""),
    /** The change position the reviewer looked at: a newer change refuses the decision. */
    reviewedSeq: z.number().int().min(0),
  })
  .refine((d) => d.decision !== "sentBack" || d.comment.length > 0, {
    message: "A send-back needs a comment saying what to fix",
    path: ["comment"],
  });
export type ReviewDecisionInput = z.input<typeof reviewDecisionInput>;

export const reviewView = z.object({
  id: z.uuid(),
  subjectKind: reviewSubjectKind,
  subjectId: z.uuid(),
  decision: reviewDecision,
  comment: z.string(),
  reviewedSeq: z.number().int(),
  decidedBy: z.uuid().nullable(),
  decidedByName: z.string().nullable(),
  decidedAt: z.string(),
});
export type ReviewView = z.infer<typeof reviewView>;

export const reviewQueueQuery = z.strictObject({
  site: z.uuid("site must be a site id").optional(),
  kind: reviewSubjectKind.optional(),
  person: z.uuid("person must be a user id").optional(),
  from: z.iso.date("from must be a date (YYYY-MM-DD)").optional(),
  to: z.iso.date("to must be a date (YYYY-MM-DD)").optional(),
  /** "waiting": new or changed since the last decision (the default); or by the last decision. */
  show: z.enum(["waiting", "approved", "sentBack", "all"]).default("waiting"),
});
export type ReviewQueueQuery = z.input<typeof reviewQueueQuery>;

export const reviewQueueItem = z.object({
  subjectKind: reviewSubjectKind,
  subjectId: z.uuid(),
  siteId: z.uuid().nullable(),
  siteName: z.string().nullable(),
  title: z.string(),
  detail: z.string(),
  authorId: z.uuid().nullable(),
  authorName: z.string().nullable(),
  at: z.string(),
  /** The newest change position of the record and its parts (results, setups). */
  latestSeq: z.number().int(),
  last: reviewView.nullable(),
  /** Changed since the last decision (or never decided). */
  waiting: z.boolean(),
});
export type ReviewQueueItem = z.infer<typeof reviewQueueItem>;

export const reviewQueueResponse = z.object({
  items: z.array(reviewQueueItem),
  /** More records matched than were sent: narrow the filters. */
  truncated: z.boolean(),
  people: z.array(z.object({ id: z.uuid(), name: z.string() })),
});
export type ReviewQueueResponse = z.infer<typeof reviewQueueResponse>;

/** One change in the audit trail: who, when, from which device, before and after. */
export const auditEventView = z.object({
  id: z.number().int(),
  at: z.string(),
  action: z.string(),
  entity: z.string(),
  entityId: z.string(),
  userId: z.uuid().nullable(),
  userName: z.string().nullable(),
  clientId: z.uuid().nullable(),
  deviceLabel: z.string().nullable(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEventView = z.infer<typeof auditEventView>;

export const reviewRecordResponse = z.object({
  item: reviewQueueItem,
  decisions: z.array(reviewView),
  trail: z.array(auditEventView),
});
export type ReviewRecordResponse = z.infer<typeof reviewRecordResponse>;

export const summarySubscriptionInput = z.strictObject({ weekly: z.boolean() });

/** Words for people; the decision names stay in the code and on the wire. */
export const reviewSubjectLabels: Record<ReviewSubjectKind, string> = {
  checklistRun: "Checklist",
  fieldEntry: "Field entry",
  levellingSection: "Levelling section",
  leg: "Leg",
  handover: "Handover",
};

export const reviewDecisionLabels: Record<ReviewDecision, string> = {
  approved: "Approved",
  sentBack: "Sent back",
  reopened: "Reopened",
};

export const bulkApproveMax = 500;

/** Approve many records at once (the ones shown in the queue), each at the position seen. */
export const bulkApproveInput = z.strictObject({
  items: z
    .array(
      z.strictObject({
        subjectKind: reviewSubjectKind,
        subjectId: z.uuid("subjectId must be a record id"),
        reviewedSeq: z.number().int().min(0),
      }),
    )
    .min(1, "items: choose at least one record")
    .max(bulkApproveMax, `items: at most ${bulkApproveMax} records at once`),
});
export type BulkApproveInput = z.input<typeof bulkApproveInput>;

export const bulkApproveResponse = z.object({
  approved: z.number().int(),
  /** Records that changed since they were shown, or were decided meanwhile: left for a look. */
  skipped: z.number().int(),
});
export type BulkApproveResponse = z.infer<typeof bulkApproveResponse>;

/** Records whose change history can be read on its own (the reviewed kinds and the edited ones). */
export const trailEntities = [
  ...reviewSubjectKinds,
  "site",
  "crate",
  "benchmark",
  "instrument",
  "checklistTemplate",
] as const;
export const trailEntity = z.enum(trailEntities);
export type TrailEntity = z.infer<typeof trailEntity>;

export const trailResponse = z.object({ trail: z.array(auditEventView) });
