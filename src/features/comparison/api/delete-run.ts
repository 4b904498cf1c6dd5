import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { comparisonKeys, runPath } from "./keys";

export async function deleteRun(campaignId: string, runId: string): Promise<void> {
  await apiRequest(runPath(campaignId, runId), { method: "DELETE", schema: noContent });
}

export function useDeleteRun(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (runId: string) => deleteRun(campaignId, runId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: comparisonKeys.list(campaignId) }),
  });
}
