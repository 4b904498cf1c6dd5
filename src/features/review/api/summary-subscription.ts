// The reviewer's own choice of the weekly summary e-mail.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { apiRequest } from "../../../lib/api";
import { reviewKeys, reviewsBase } from "./keys";

const summaryResponse = z.object({ weekly: z.boolean() });

export function useSummarySubscription(campaignId: string) {
  return useQuery({
    queryKey: reviewKeys.summary(campaignId),
    queryFn: ({ signal }) =>
      apiRequest(`${reviewsBase(campaignId)}/summary`, { schema: summaryResponse, signal }),
  });
}

export function useSetSummarySubscription(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (weekly: boolean) =>
      apiRequest(`${reviewsBase(campaignId)}/summary`, {
        method: "PUT",
        body: { weekly },
        schema: summaryResponse,
      }),
    onSuccess: (data) => queryClient.setQueryData(reviewKeys.summary(campaignId), data),
  });
}
