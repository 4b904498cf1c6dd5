import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { siteView, type SiteUpdateInput, type SiteView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { siteKeys } from "./keys";

const siteResponse = z.object({ site: siteView });

export async function updateSite(
  campaignId: string,
  siteId: string,
  input: SiteUpdateInput,
): Promise<SiteView> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/sites/${encodeURIComponent(siteId)}`;
  const { site } = await apiRequest(path, { method: "PATCH", body: input, schema: siteResponse });
  return site;
}

export function useUpdateSite(campaignId: string, siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteUpdateInput) => updateSite(campaignId, siteId, input),
    // Also after a 409: the list then holds the version that won, to edit again.
    onSettled: () => queryClient.invalidateQueries({ queryKey: siteKeys.list(campaignId) }),
  });
}
