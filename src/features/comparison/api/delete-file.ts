import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { comparisonKeys, runPath } from "./keys";

export async function deleteFile(campaignId: string, runId: string, fileId: string) {
  await apiRequest(`${runPath(campaignId, runId)}/files/${encodeURIComponent(fileId)}`, {
    method: "DELETE",
    schema: noContent,
  });
}

export function useDeleteFile(campaignId: string, runId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fileId: string) => deleteFile(campaignId, runId, fileId),
    // The run, its files, analysis and result all change with the data.
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: comparisonKeys.run(campaignId, runId) }),
  });
}
