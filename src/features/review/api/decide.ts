// Approve, send back or reopen a record; the queue and the record's page read again afterwards.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  reviewView,
  type ReviewDecisionInput,
  type ReviewView,
} from "../../../../shared/schemas/reviews";
import { apiRequest } from "../../../lib/api";
import { reviewKeys, reviewsBase } from "./keys";

const decisionResponse = z.object({ review: reviewView });

export async function decide(campaignId: string, input: ReviewDecisionInput): Promise<ReviewView> {
  const res = await apiRequest(reviewsBase(campaignId), {
    method: "POST",
    body: input,
    schema: decisionResponse,
  });
  return res.review;
}

export function useDecide(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewDecisionInput) => decide(campaignId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
