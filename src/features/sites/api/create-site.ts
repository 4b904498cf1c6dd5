import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { siteView, type SiteCreateInput, type SiteView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { siteKeys } from "./keys";

const siteResponse = z.object({ site: siteView });

export async function createSite(campaignId: string, input: SiteCreateInput): Promise<SiteView> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/sites`;
  const { site } = await apiRequest(path, { method: "POST", body: input, schema: siteResponse });
  return site;
}

export function useCreateSite(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteCreateInput) => createSite(campaignId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: siteKeys.list(campaignId) }),
  });
}
