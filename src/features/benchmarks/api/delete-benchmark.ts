// A deleted benchmark leaves the list; the server keeps its tombstone for the audit trail.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { benchmarkKeys, benchmarkPath } from "./keys";

export async function deleteBenchmark(campaignId: string, benchmarkId: string): Promise<void> {
  await apiRequest(benchmarkPath(campaignId, benchmarkId), {
    method: "DELETE",
    schema: noContent,
  });
}

export function useDeleteBenchmark(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (benchmarkId: string) => deleteBenchmark(campaignId, benchmarkId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: benchmarkKeys.list(campaignId) }),
  });
}
