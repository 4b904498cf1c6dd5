// POST …/levelling-adjustments: computed on the server's worker pool and kept; the answer is the result.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import {
  adjustmentView,
  type AdjustmentOptions,
  type AdjustmentView,
} from "../../../../shared/schemas/height-network";
import { apiRequest } from "../../../lib/api";
import { campaignBase, heightNetworkKeys } from "./keys";

const adjustResponse = z.object({ adjustment: adjustmentView });

export async function runAdjustment(
  campaignId: string,
  options: AdjustmentOptions,
): Promise<AdjustmentView> {
  const res = await apiRequest(`${campaignBase(campaignId)}/levelling-adjustments`, {
    method: "POST",
    body: options,
    schema: adjustResponse,
  });
  return res.adjustment;
}

export function useRunAdjustment(campaignId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (options: AdjustmentOptions) => runAdjustment(campaignId, options),
    onSuccess: async (adjustment) => {
      queryClient.setQueryData(heightNetworkKeys.latest(campaignId), adjustment);
      await queryClient.invalidateQueries({ queryKey: heightNetworkKeys.observations(campaignId) });
    },
  });
}
