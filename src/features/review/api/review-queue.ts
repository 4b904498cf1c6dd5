// The campaign's records waiting for review (or by their last decision), with the filters applied.
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import {
  reviewQueueResponse,
  type ReviewQueueQuery,
  type ReviewQueueResponse,
} from "../../../../shared/schemas/reviews";
import { apiRequest } from "../../../lib/api";
import { reviewKeys, reviewsBase } from "./keys";

export async function getReviewQueue(
  campaignId: string,
  query: ReviewQueueQuery,
  signal?: AbortSignal,
): Promise<ReviewQueueResponse> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query))
    if (value !== undefined && value !== "") params.set(key, String(value));
  return apiRequest(`${reviewsBase(campaignId)}/queue?${params.toString()}`, {
    schema: reviewQueueResponse,
    signal,
  });
}

export function reviewQueueQueryOptions(campaignId: string, query: ReviewQueueQuery) {
  return queryOptions({
    queryKey: reviewKeys.queue(campaignId, query),
    queryFn: ({ signal }) => getReviewQueue(campaignId, query, signal),
    placeholderData: keepPreviousData,
  });
}

/** `enabled` false: the caller knows the request would be refused (role), so none is sent. */
export function useReviewQueue(campaignId: string, query: ReviewQueueQuery, enabled = true) {
  return useQuery({ ...reviewQueueQueryOptions(campaignId, query), enabled });
}
