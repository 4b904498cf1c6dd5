// The latest kept adjustment, or null when the network was never adjusted.
import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { adjustmentView, type AdjustmentView } from "../../../../shared/schemas/height-network";
import { apiRequest } from "../../../lib/api";
import { campaignBase, heightNetworkKeys } from "./keys";

const latestResponse = z.object({ adjustment: adjustmentView.nullable() });

export async function getLatestAdjustment(
  campaignId: string,
  signal?: AbortSignal,
): Promise<AdjustmentView | null> {
  const res = await apiRequest(`${campaignBase(campaignId)}/levelling-adjustments/latest`, {
    schema: latestResponse,
    signal,
  });
  return res.adjustment;
}

export function latestAdjustmentQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: heightNetworkKeys.latest(campaignId),
    queryFn: ({ signal }) => getLatestAdjustment(campaignId, signal),
  });
}

export function useLatestAdjustment(campaignId: string) {
  return useQuery(latestAdjustmentQueryOptions(campaignId));
}
