// Office review: the queue of synced records, decisions on them, and what the server enforces.
// A decision takes the campaign's change position first: that lock (db/change-seq.ts) orders it
// against every push, so the record the reviewer saw is the record as it is when they decide.
import type { z } from "zod";
import { fieldEntryKindLabels, fieldEntryKinds } from "../../shared/schemas/field-entries";
import {
  reviewDecisionLabels,
  reviewSubjectLabels,
  type bulkApproveInput,
  type BulkApproveResponse,
  type reviewDecisionInput,
  type reviewQueueQuery,
  type ReviewQueueResponse,
  type ReviewRecordResponse,
  type ReviewSubjectKind,
  type ReviewView,
} from "../../shared/schemas/reviews";
import { nextChangeSeq } from "../db/change-seq";
import type { Db, Queryable, Tx } from "../db/client";
import { recordAudit, trailOf } from "../db/repositories/audit";
import { findCampaign } from "../db/repositories/campaigns";
import { enqueueEmailOnce } from "../db/repositories/outbox";
import {
  insertReview,
  latestReview,
  listSubjects,
  reviewsById,
  reviewsOf,
  type SubjectRow,
} from "../db/repositories/reviews";
import { conflict, HttpError, notFound } from "../http-errors";
import { presentQueueItem, presentReview } from "../presenters/review";

type Scope = { campaignId: string; userId: string };
type Query = z.output<typeof reviewQueueQuery>;
type DecisionInput = z.output<typeof reviewDecisionInput>;

const queueLimit = 500;

const isEntryKind = (title: string): title is (typeof fieldEntryKinds)[number] =>
  (fieldEntryKinds as readonly string[]).includes(title);

/** Field entries are titled by their kind's label; the others carry their own title. */
const titleOf = (row: SubjectRow) =>
  row.kind === "fieldEntry" && isEntryKind(row.title) ? fieldEntryKindLabels[row.title] : row.title;

export async function reviewQueue(
  db: Db,
  campaignId: string,
  query: Query,
): Promise<ReviewQueueResponse> {
  // Read a page more than shown, since the state filter runs after the decisions are known.
  const rows = await listSubjects(
    db,
    campaignId,
    {
      kind: query.kind,
      site: query.site,
      person: query.person,
      fromDate: query.from,
      toDate: query.to,
    },
    queueLimit * 4,
  );
  const last = await reviewsById(
    db,
    rows.flatMap((r) => (r.lastId ? [r.lastId] : [])),
  );
  const items = rows
    .map((r) => presentQueueItem(r, r.lastId ? last.get(r.lastId) : undefined, titleOf(r)))
    .filter((item) =>
      query.show === "all"
        ? true
        : query.show === "waiting"
          ? item.waiting
          : !item.waiting && item.last?.decision === query.show,
    );
  const people = new Map<string, string>();
  for (const r of rows) if (r.authorId && r.authorName) people.set(r.authorId, r.authorName);
  return {
    items: items.slice(0, queueLimit),
    truncated: items.length > queueLimit || rows.length === queueLimit * 4,
    people: [...people]
      .map(([id, name]) => ({ id, name }))
      .sort((a, b) => a.name.localeCompare(b.name)),
  };
}

async function findSubject(q: Queryable, campaignId: string, kind: ReviewSubjectKind, id: string) {
  const [row] = await listSubjects(q, campaignId, { kind, id }, 1);
  if (!row) throw notFound(`${reviewSubjectLabels[kind]} not found in this campaign`);
  return row;
}

export async function reviewRecord(
  db: Db,
  campaignId: string,
  kind: ReviewSubjectKind,
  id: string,
): Promise<ReviewRecordResponse> {
  const row = await findSubject(db, campaignId, kind, id);
  const decisions = await reviewsOf(db, campaignId, kind, id);
  return {
    item: presentQueueItem(row, decisions[0], titleOf(row)),
    decisions: decisions.map(presentReview),
    trail: await trailOf(db, campaignId, kind, id),
  };
}

/** Why a decision cannot follow the record's current state, or null. */
function refusal(decision: DecisionInput["decision"], current: string | undefined) {
  if (decision === "reopened")
    return current === "approved" ? null : "Only an approved record can be reopened";
  if (current === "approved") return "This record is approved; reopen it before deciding again";
  return null;
}

export interface DecideDeps {
  linkBase: string;
}

/** One decision inside the caller's transaction, after the change position was taken. */
async function decideIn(
  tx: Tx,
  scope: Scope,
  input: DecisionInput,
  changeSeq: number,
  deps: DecideDeps,
): Promise<ReviewView> {
  const subject = await findSubject(tx, scope.campaignId, input.subjectKind, input.subjectId);
  const current = await latestReview(tx, scope.campaignId, input.subjectKind, input.subjectId);
  if (subject.latestSeq !== input.reviewedSeq)
    throw conflict(
      "The record changed since you opened it (a new sync arrived): look at it again, then decide",
    );
  const problem = refusal(input.decision, current?.decision);
  if (problem) throw conflict(problem);
  const row = await insertReview(tx, {
    campaignId: scope.campaignId,
    subjectKind: input.subjectKind,
    subjectId: input.subjectId,
    decision: input.decision,
    comment: input.comment,
    reviewedSeq: subject.latestSeq,
    decidedBy: scope.userId,
    changeSeq,
  });
  const view = presentReview(row);
  await recordAudit(tx, {
    campaignId: scope.campaignId,
    userId: scope.userId,
    action: `review.${input.decision}`,
    entity: input.subjectKind,
    entityId: input.subjectId,
    before: current ? presentReview(current) : null,
    after: view,
  });
  if (input.decision === "sentBack") await queueSendBackNotice(tx, scope, subject, view, deps);
  return view;
}

export const decide = (db: Db, scope: Scope, input: DecisionInput, deps: DecideDeps) =>
  db.transaction(async (tx) =>
    decideIn(tx, scope, input, await nextChangeSeq(tx, scope.campaignId), deps),
  );

/**
 * Approves every listed record still as the reviewer saw it, in one transaction; the others
 * (changed meanwhile, or already decided) are counted and left in the queue for a look.
 */
export async function approveMany(
  db: Db,
  scope: Scope,
  input: z.output<typeof bulkApproveInput>,
  deps: DecideDeps,
): Promise<BulkApproveResponse> {
  return db.transaction(async (tx) => {
    let approved = 0;
    for (const item of input.items) {
      const changeSeq = await nextChangeSeq(tx, scope.campaignId);
      try {
        await tx.transaction((inner) =>
          decideIn(inner, scope, { ...item, decision: "approved", comment: "" }, changeSeq, deps),
        );
        approved += 1;
      } catch (error) {
        if (!(error instanceof HttpError) || error.status !== 409) throw error;
      }
    }
    return { approved, skipped: input.items.length - approved };
  });
}

/** Where the author opens the record on their tablet. */
const recordLink = (linkBase: string, campaignId: string, kind: ReviewSubjectKind, id: string) => {
  const base = `${linkBase.replace(/\/$/, "")}/campaigns/${campaignId}`;
  const path: Record<ReviewSubjectKind, string> = {
    checklistRun: `/checklists/${id}`,
    fieldEntry: `/entries/${id}`,
    levellingSection: `/levelling/${id}`,
    leg: `/logistics`,
    handover: `/crates/handovers/${id}`,
  };
  return base + path[kind];
};

async function queueSendBackNotice(
  tx: Queryable,
  scope: Scope,
  subject: SubjectRow,
  review: ReviewView,
  deps: DecideDeps,
) {
  if (!subject.authorEmail || subject.authorId === scope.userId) return;
  const campaign = await findCampaign(tx, scope.campaignId);
  const what = `${reviewSubjectLabels[subject.kind]} "${titleOf(subject)}"`;
  await enqueueEmailOnce(tx, {
    messageKey: `review-sent-back:${review.id}`,
    toAddress: subject.authorEmail,
    subject: `Equipot, ${campaign?.name ?? "campaign"}: ${what} was sent back`,
    textBody: [
      `Hello ${subject.authorName ?? ""},`.trim(),
      "",
      `The office sent back your ${what.toLowerCase()}`,
      `${subject.siteName ? `at ${subject.siteName} ` : ""}(${subject.at.toISOString()}).`,
      "",
      `${reviewDecisionLabels.sentBack} by ${review.decidedByName ?? "a reviewer"}:`,
      review.comment,
      "",
      "The comment is on the record on your tablet after its next sync:",
      recordLink(deps.linkBase, scope.campaignId, subject.kind, subject.id),
    ].join("\n"),
  });
}

/** The decision in force on a record, for the push guard: approved records are read-only. */
export async function approvalOf(
  q: Queryable,
  campaignId: string,
  kind: ReviewSubjectKind,
  id: string,
): Promise<ReviewView | null> {
  const last = await latestReview(q, campaignId, kind, id);
  return last?.decision === "approved" ? presentReview(last) : null;
}
