import { Router } from "express";
import { z } from "zod";
import {
  bulkApproveInput,
  reviewDecisionInput,
  reviewQueueQuery,
  reviewSubjectKind,
  summarySubscriptionInput,
  trailEntity,
} from "../../../shared/schemas/reviews";
import type { Db } from "../../db/client";
import { trailOf } from "../../db/repositories/audit";
import { hasSummarySubscription, setSummarySubscription } from "../../db/repositories/reviews";
import { requireAction, scope } from "../../middleware/authorize";
import { parseInput } from "../../middleware/validate";
import { approveMany, decide, reviewQueue, reviewRecord } from "../../services/reviews.service";

export interface ReviewsDeps {
  db: Db;
  linkBase: () => string;
  onMailQueued: () => void;
}

const recordParams = z.object({
  kind: reviewSubjectKind,
  recordId: z.uuid("The record id must be a UUID"),
});

const trailParams = z.object({
  entity: trailEntity,
  entityId: z.uuid("The record id must be a UUID"),
});

/** Mounted under /api/campaigns/:campaignId after the membership check. */
export function reviewsRouter({ db, linkBase, onMailQueued }: ReviewsDeps): Router {
  const router = Router({ mergeParams: true });
  router.get("/reviews/queue", requireAction("entry.review"), async (req, res) => {
    const query = parseInput(reviewQueueQuery, req.query);
    res.json(await reviewQueue(db, scope(req).campaignId, query));
  });
  router.get("/reviews/records/:kind/:recordId", requireAction("audit.read"), async (req, res) => {
    const { kind, recordId } = parseInput(recordParams, req.params);
    res.json(await reviewRecord(db, scope(req).campaignId, kind, recordId));
  });
  router.get("/audit/:entity/:entityId", requireAction("audit.read"), async (req, res) => {
    const { entity, entityId } = parseInput(trailParams, req.params);
    res.json({ trail: await trailOf(db, scope(req).campaignId, entity, entityId) });
  });
  router.post("/reviews", requireAction("entry.review"), async (req, res) => {
    const input = parseInput(reviewDecisionInput, req.body);
    const review = await decide(db, scope(req), input, { linkBase: linkBase() });
    if (review.decision === "sentBack") onMailQueued();
    res.status(201).json({ review });
  });
  router.post("/reviews/approve-many", requireAction("entry.review"), async (req, res) => {
    const input = parseInput(bulkApproveInput, req.body);
    res.json(await approveMany(db, scope(req), input, { linkBase: linkBase() }));
  });
  // The weekly summary is for reviewers, by their own choice.
  router.get("/reviews/summary", requireAction("entry.review"), async (req, res) => {
    const { campaignId, userId } = scope(req);
    res.json({ weekly: await hasSummarySubscription(db, campaignId, userId) });
  });
  router.put("/reviews/summary", requireAction("entry.review"), async (req, res) => {
    const { weekly } = parseInput(summarySubscriptionInput, req.body);
    const { campaignId, userId } = scope(req);
    await setSummarySubscription(db, campaignId, userId, weekly);
    res.json({ weekly });
  });
  return router;
}
