import type { ReviewQueueItem, ReviewView } from "../../shared/schemas/reviews";
import type { ReviewRow, SubjectRow } from "../db/repositories/reviews";

export const presentReview = (row: ReviewRow): ReviewView => ({
  id: row.id,
  subjectKind: row.subjectKind,
  subjectId: row.subjectId,
  decision: row.decision,
  comment: row.comment,
  reviewedSeq: row.reviewedSeq,
  decidedBy: row.decidedBy,
  decidedByName: row.decidedByName,
  decidedAt: row.decidedAt.toISOString(),
});

/** Waiting: never decided, reopened, or changed since the decision. */
export const isWaiting = (latestSeq: number, last: ReviewRow | undefined) =>
  last === undefined || last.decision === "reopened" || latestSeq > last.reviewedSeq;

export const presentQueueItem = (
  row: SubjectRow,
  last: ReviewRow | undefined,
  title: string,
): ReviewQueueItem => ({
  subjectKind: row.kind,
  subjectId: row.id,
  siteId: row.siteId,
  siteName: row.siteName,
  title,
  detail: row.detail,
  authorId: row.authorId,
  authorName: row.authorName,
  at: row.at.toISOString(),
  latestSeq: row.latestSeq,
  last: last ? presentReview(last) : null,
  waiting: isWaiting(row.latestSeq, last),
});
