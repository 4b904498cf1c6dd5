import { useMutation, useQueryClient } from "@tanstack/react-query";
import { apiRequest, noContent } from "../../../lib/api";
import { siteKeys } from "./keys";

/** The server keeps a tombstone; the site leaves every list. */
export async function deleteSite(campaignId: string, siteId: string): Promise<void> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/sites/${encodeURIComponent(siteId)}`;
  await apiRequest(path, { method: "DELETE", schema: noContent });
}

export function useDeleteSite(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (siteId: string) => deleteSite(campaignId, siteId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.list(campaignId) }),
  });
}
