// One record under review: what it is, the decisions on it and its audit trail.
import { queryOptions, useQuery } from "@tanstack/react-query";
import {
  reviewRecordResponse,
  type ReviewRecordResponse,
  type ReviewSubjectKind,
} from "../../../../shared/schemas/reviews";
import { apiRequest } from "../../../lib/api";
import { reviewKeys, reviewsBase } from "./keys";

export async function getReviewRecord(
  campaignId: string,
  kind: ReviewSubjectKind,
  id: string,
  signal?: AbortSignal,
): Promise<ReviewRecordResponse> {
  return apiRequest(
    `${reviewsBase(campaignId)}/records/${encodeURIComponent(kind)}/${encodeURIComponent(id)}`,
    { schema: reviewRecordResponse, signal },
  );
}

export function reviewRecordQueryOptions(campaignId: string, kind: ReviewSubjectKind, id: string) {
  return queryOptions({
    queryKey: reviewKeys.record(campaignId, kind, id),
    queryFn: ({ signal }) => getReviewRecord(campaignId, kind, id, signal),
  });
}

export function useReviewRecord(
  campaignId: string,
  kind: ReviewSubjectKind,
  id: string,
  enabled = true,
) {
  return useQuery({ ...reviewRecordQueryOptions(campaignId, kind, id), enabled });
}
