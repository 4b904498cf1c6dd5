// Approve the records shown, each at the position the reviewer saw; changed ones are left.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import {
  bulkApproveResponse,
  type BulkApproveInput,
  type BulkApproveResponse,
} from "../../../../shared/schemas/reviews";
import { apiRequest } from "../../../lib/api";
import { reviewKeys, reviewsBase } from "./keys";

export const approveMany = (campaignId: string, input: BulkApproveInput) =>
  apiRequest(`${reviewsBase(campaignId)}/approve-many`, {
    method: "POST",
    body: input,
    schema: bulkApproveResponse,
  });

export function useApproveMany(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation<BulkApproveResponse, Error, BulkApproveInput>({
    mutationFn: (input) => approveMany(campaignId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
