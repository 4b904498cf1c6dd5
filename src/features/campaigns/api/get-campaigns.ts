import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { campaignView, type CampaignView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { campaignKeys } from "./keys";

const campaignsResponse = z.object({ campaigns: z.array(campaignView) });

export async function getCampaigns(signal?: AbortSignal): Promise<CampaignView[]> {
  const { campaigns } = await apiRequest("/campaigns", { schema: campaignsResponse, signal });
  return campaigns;
}

export const campaignsQueryOptions = queryOptions({
  queryKey: campaignKeys.list(),
  queryFn: ({ signal }) => getCampaigns(signal),
});

export function useCampaigns() {
  return useQuery(campaignsQueryOptions);
}
