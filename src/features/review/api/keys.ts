import type { ReviewQueueQuery, ReviewSubjectKind } from "../../../../shared/schemas/reviews";

export const reviewKeys = {
  all: ["reviews"] as const,
  queue: (campaignId: string, query: ReviewQueueQuery) =>
    [...reviewKeys.all, "queue", campaignId, query] as const,
  record: (campaignId: string, kind: ReviewSubjectKind, id: string) =>
    [...reviewKeys.all, "record", campaignId, kind, id] as const,
  summary: (campaignId: string) => [...reviewKeys.all, "summary", campaignId] as const,
};

export const reviewsBase = (campaignId: string) =>
  `/campaigns/${encodeURIComponent(campaignId)}/reviews`;
